import { planMethodNotes } from "../analysis/planMethodNotes.js";
import type { PlanResult } from "../analysis/planProgramme.js";
import { sitesWithoutCandidates } from "../model/sitesWithoutCandidates.js";
import { CAUTIONS } from "./cautions.js";
import { describeAssumptions } from "./describeAssumptions.js";
import { jsonNumber } from "./formatNumber.js";
import { COST_PER_KSI_DEFINITION, KSI_AVOIDED_DEFINITION, KSI_AVOIDED_PER_YEAR_DEFINITION } from "./ksiAvoidedLabel.js";
import { marginalValueDefinition } from "./marginalValueWords.js";
import { programmeJson, projectYearJson } from "./programmeJson.js";
import { totalsJson } from "./totalsJson.js";

/**
 * The stable JSON contract of `plan --format json`. Money is in currency units; ratios that
 * are undefined or infinite are null. `definitions` says in words what the K+A figures and the
 * budget's marginal value mean (the keys keep their names: they are a contract).
 */
export function planJson(result: PlanResult): object {
  const { prepared, solution, totals } = result;
  const methodBySite = new Map(prepared.baselines.map((baseline) => [baseline.site, baseline.method]));
  const method = planMethodNotes(result);
  return {
    scenario: prepared.scenario.name,
    currency: prepared.scenario.currency,
    budget: result.budget,
    objective: prepared.objective,
    status: solution.status,
    ...(solution.diagnosis !== undefined && { diagnosis: solution.diagnosis }),
    totals: totalsJson(totals),
    ...programmeJson(result),
    selected: result.funded.map(({ entry, alternative }, index) => ({
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
      baseline: methodBySite.get(entry.site.id),
      sharedCrashCells: alternative.sharedCells,
      ...projectYearJson(result, index),
    })),
    sitesWithoutCandidates: sitesWithoutCandidates(prepared.scenario.sites),
    bound: solution.bound,
    gap: solution.gap,
    budgetMarginalValue: solution.budgetMarginalValue,
    engine: solution.engine,
    definitions: {
      ksiAvoided: KSI_AVOIDED_DEFINITION,
      ksiAvoidedPerYear: KSI_AVOIDED_PER_YEAR_DEFINITION,
      costPerKsi: COST_PER_KSI_DEFINITION,
      budgetMarginalValue: marginalValueDefinition(prepared.objective, prepared.scenario.currency),
    },
    method: {
      baselineCounts: method.baselineCounts,
      observedBaselineProjects: method.observedBaselineProjects,
      singleFatalCrashShare: { share: method.singleFatal.share, sites: method.singleFatal.sites, threshold: method.singleFatal.threshold, high: method.singleFatal.high, definition: method.singleFatal.definition },
      sharedCellProjects: method.sharedCellProjects,
      notes: method.notes,
    },
    assumptions: describeAssumptions(prepared.scenario, prepared.baselines),
    cautions: CAUTIONS,
  };
}
