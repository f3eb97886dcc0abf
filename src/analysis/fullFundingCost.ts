import type { PreparedPlan } from "./preparePlan.js";
import { objectiveValue } from "./buildProgramme.js";

/**
 * Capital cost of funding every site's best alternative: the one with the most objective value
 * (KSI avoided, or benefit PV), the cheaper on a tie. Beyond this budget nothing more can be bought,
 * so it is the natural top of a budget frontier.
 */
export function fullFundingCost(prepared: PreparedPlan): number {
  let total = 0;
  for (const entry of prepared.sites) {
    let best: { value: number; cost: number } | undefined;
    for (const alternative of entry.alternatives) {
      const value = objectiveValue(alternative, prepared.objective);
      if (best === undefined || value > best.value || (value === best.value && alternative.cost < best.cost)) {
        best = { value, cost: alternative.cost };
      }
    }
    total += best?.cost ?? 0;
  }
  return total;
}
