import type { PlanResult } from "../analysis/planProgramme.js";
import { sitesWithoutCandidates } from "../model/sitesWithoutCandidates.js";
import { CAUTIONS } from "./cautions.js";
import { describeAssumptions } from "./describeAssumptions.js";
import { jsonNumber } from "./formatNumber.js";
import { totalsJson } from "./totalsJson.js";

/**
 * The stable JSON contract of `plan --format json`. Money is in currency units; ratios that
 * are undefined or infinite are null.
 */
export function planJson(result: PlanResult): object {
  const { prepared, solution, totals } = result;
  return {
    scenario: prepared.scenario.name,
    currency: prepared.scenario.currency,
    budget: result.budget,
    objective: prepared.objective,
    status: solution.status,
    ...(solution.diagnosis !== undefined && { diagnosis: solution.diagnosis }),
    totals: totalsJson(totals),
    selected: result.funded.map(({ entry, alternative }) => ({
      site: entry.site.id,
      name: entry.site.name,
      kind: entry.site.kind,
      district: entry.site.district,
      treatments: alternative.treatments,
      cost: alternative.cost,
      lifecycleCostPV: alternative.lifecycleCostPV,
      ksiAvoided: alternative.ksiAvoided,
      benefitPV: alternative.benefitPV,
      bcRatio: jsonNumber(alternative.bcRatio),
      npv: alternative.npv,
      costPerKsi: jsonNumber(alternative.costPerKsi),
      required: entry.required,
    })),
    sitesWithoutCandidates: sitesWithoutCandidates(prepared.scenario.sites),
    bound: solution.bound,
    gap: solution.gap,
    budgetMarginalValue: solution.budgetMarginalValue,
    engine: solution.engine,
    assumptions: describeAssumptions(prepared.scenario),
    cautions: CAUTIONS,
  };
}
