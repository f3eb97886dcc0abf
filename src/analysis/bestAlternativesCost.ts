import { objectiveValue } from "./buildProgramme.js";
import type { PreparedPlan } from "./preparePlan.js";

/**
 * Capital cost of funding every site's best alternative (the one with the highest objective
 * value; the cheaper on a tie): the budget beyond which more money buys nothing, used as the
 * top of a default budget frontier.
 */
export function bestAlternativesCost(prepared: PreparedPlan): number {
  let total = 0;
  for (const entry of prepared.sites) {
    let best: { cost: number; value: number } | undefined;
    for (const alternative of entry.alternatives) {
      const value = objectiveValue(alternative, prepared.objective);
      if (best === undefined || value > best.value || (value === best.value && alternative.cost < best.cost)) best = { cost: alternative.cost, value };
    }
    total += best?.cost ?? 0;
  }
  return total;
}
