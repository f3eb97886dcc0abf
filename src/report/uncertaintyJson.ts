import type { UncertaintyResult } from "../analysis/uncertainty/analyseUncertainty.js";
import type { SensitivityCase, SensitivityResult } from "../analysis/uncertainty/oneAtATimeSensitivity.js";
import type { Spread } from "../analysis/uncertainty/summariseDraws.js";
import { CORE_PROBABILITY, MARGINAL_PROBABILITY } from "../analysis/uncertainty/summariseDraws.js";
import { BASELINE_SAMPLING_RULE } from "../model/sampleSiteBaseline.js";
import { CAUTIONS } from "./cautions.js";
import { describeAssumptions } from "./describeAssumptions.js";
import { jsonNumber } from "./formatNumber.js";

/** How CMFs are drawn; stated in every uncertainty output. */
export const CMF_SAMPLING_RULE =
  "each CMF with a standard error is drawn once per draw from a lognormal whose mean is the published CMF and whose standard deviation is its standard error (sigma² = ln(1 + (se/cmf)²), mu = ln(cmf) − sigma²/2), shared by every site; CMFs without a standard error are held at their value";

function spread(value: Spread): object {
  return { mean: jsonNumber(value.mean), p5: jsonNumber(value.p5), p50: jsonNumber(value.p50), p95: jsonNumber(value.p95) };
}

function sensitivityCase(value: SensitivityCase): object {
  return {
    value: value.label,
    ksiAvoided: value.ksiAvoided,
    ksiAvoidedChange: value.ksiAvoidedChange,
    bcRatio: jsonNumber(value.bcRatio),
    bcRatioChange: jsonNumber(value.bcRatioChange),
    listChanges: value.listChanges,
    entering: value.entering,
    leaving: value.leaving,
  };
}

/**
 * The stable JSON contract of `uncertainty --format json`: the chosen list, the spread of what it
 * achieves over the draws, selection probabilities (core, marginal), regret and the one-at-a-time
 * sensitivity. Nothing in it depends on the number of threads, so the same seed gives the same bytes.
 */
export function uncertaintyJson(result: UncertaintyResult, sensitivity: SensitivityResult): object {
  const { plan, summary } = result;
  const { scenario } = plan.prepared;
  const objectiveUnit = plan.prepared.objective === "ksi" ? "KSI crashes" : scenario.currency;
  return {
    scenario: scenario.name,
    currency: scenario.currency,
    budget: plan.budget,
    objective: plan.prepared.objective,
    draws: result.draws,
    seed: result.seed,
    method: {
      cmf: CMF_SAMPLING_RULE,
      baseline: result.sampleBaselines ? BASELINE_SAMPLING_RULE : "baselines held at their point estimates (--fixed-baseline)",
      effectsWithStandardError: result.effectsWithStandardError,
      effectsWithoutStandardError: result.effectsWithoutStandardError,
      sitesWithFixedBaseline: result.sitesWithFixedBaseline,
      percentiles: "Hyndman–Fan type 7 (linear interpolation, as R and NumPy by default)",
      coreProbability: CORE_PROBABILITY,
      marginalProbability: MARGINAL_PROBABILITY,
    },
    plan: {
      status: plan.solution.status,
      projects: plan.totals.projects,
      cost: plan.totals.cost,
      ksiAvoided: plan.totals.ksiAvoided,
      benefitPV: plan.totals.benefitPV,
      lifecycleCostPV: plan.totals.lifecycleCostPV,
      bcRatio: jsonNumber(plan.totals.bcRatio),
    },
    overDraws: {
      solvedDraws: summary.solvedDraws,
      statusCounts: summary.statusCounts,
      ksiAvoided: spread(summary.planKsiAvoided),
      benefitPV: spread(summary.planBenefitPV),
      bcRatio: spread(summary.planBcRatio),
      probabilityBcAboveOne: summary.probabilityBcAboveOne,
      planInfeasibleDraws: summary.planInfeasibleDraws,
      regret: { unit: objectiveUnit, ...spread(summary.regret) },
    },
    selections: summary.selections.map((s) => ({
      site: s.site,
      treatments: s.treatments,
      probability: s.probability,
      inPlan: s.inPlan,
      class: s.class,
    })),
    core: summary.selections.filter((s) => s.class === "core").map((s) => `${s.site}: ${s.treatments.join(" + ")}`),
    marginal: summary.selections.filter((s) => s.class === "marginal").map((s) => `${s.site}: ${s.treatments.join(" + ")}`),
    sensitivity: {
      baseKsiAvoided: sensitivity.baseKsiAvoided,
      baseBcRatio: jsonNumber(sensitivity.baseBcRatio),
      rows: sensitivity.rows.map((row) => ({ parameter: row.parameter, base: row.base, low: sensitivityCase(row.low), high: sensitivityCase(row.high) })),
    },
    assumptions: describeAssumptions(scenario),
    cautions: CAUTIONS,
  };
}
