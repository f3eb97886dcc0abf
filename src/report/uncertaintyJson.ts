import type { UncertaintyResult } from "../analysis/uncertainty/analyseUncertainty.js";
import type { SensitivityCase, SensitivityResult } from "../analysis/uncertainty/oneAtATimeSensitivity.js";
import { REPLACEMENT_RULE, SHAKY_PROBABILITY } from "../analysis/uncertainty/shakyProjects.js";
import type { Spread } from "../analysis/uncertainty/summariseDraws.js";
import { CORE_PROBABILITY, MARGINAL_PROBABILITY } from "../analysis/uncertainty/summariseDraws.js";
import { BASELINE_SAMPLING_RULE } from "../model/sampleSiteBaseline.js";
import { cmfSamplingRule } from "../model/sampleTreatmentCmfs.js";
import { baselinesDrawnText } from "./baselinesDrawnText.js";
import { CAUTIONS } from "./cautions.js";
import { describeAssumptions } from "./describeAssumptions.js";
import { effectsUncertainText } from "./effectsUncertainText.js";
import { jsonNumber } from "./formatNumber.js";

/** What the uncertainty outputs' quantities mean; KSI here counts K+A crashes, not people. */
export const UNCERTAINTY_DEFINITIONS = {
  ksiAvoided:
    "K+A crashes avoided: crashes of KABCO severity K (fatal) or A (suspected serious injury) avoided over each project's service life within the horizon; KSI in field names means these K+A crashes, not people",
  probability: "a share of the draws (probabilityBcAboveOne over all draws, selection probabilities over the solved draws), each with the effectsUncertain basis beside it",
  regret: "the best list's objective minus the chosen list's, per solved draw (K+A crashes avoided, or benefit PV, as the objective)",
} as const;

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
 * achieves over the draws, selection probabilities (core, marginal), shaky funded projects with
 * their replacements, regret and the one-at-a-time sensitivity; every probability sits beside the
 * "N of M effects uncertain" basis. Nothing in it depends on the number of threads, so the same
 * seed gives the same bytes.
 */
export function uncertaintyJson(result: UncertaintyResult, sensitivity: SensitivityResult): object {
  const { plan, summary } = result;
  const { scenario } = plan.prepared;
  const objectiveUnit = plan.prepared.objective === "ksi" ? "K+A crashes" : scenario.currency;
  const effectsUncertain = effectsUncertainText(result.effects);
  const project = (site: string, treatments: readonly string[]) => `${site}: ${treatments.join(" + ")}`;
  return {
    scenario: scenario.name,
    currency: scenario.currency,
    budget: plan.budget,
    objective: plan.prepared.objective,
    draws: result.draws,
    seed: result.seed,
    definitions: UNCERTAINTY_DEFINITIONS,
    method: {
      cmf: cmfSamplingRule(result.effects.assumedCmfCv),
      assumedCmfCv: result.effects.assumedCmfCv,
      effects: {
        total: result.effects.total,
        uncertain: result.effects.withStandardError + result.effects.withAssumedCv,
        withStandardError: result.effects.withStandardError,
        withAssumedCv: result.effects.withAssumedCv,
        heldExact: result.effects.heldExact,
      },
      effectsUncertain,
      effectsWithStandardError: result.effects.withStandardError,
      effectsWithoutStandardError: result.effects.total - result.effects.withStandardError,
      baseline: result.sampleBaselines ? BASELINE_SAMPLING_RULE : "baselines held at their point estimates (--fixed-baseline)",
      baselineSites: result.baselines,
      baselinesDrawn: baselinesDrawnText(result.baselines),
      sitesWithFixedBaseline: result.baselines.fixed,
      percentiles: "Hyndman–Fan type 7 (linear interpolation, as R and NumPy by default)",
      coreProbability: CORE_PROBABILITY,
      marginalProbability: MARGINAL_PROBABILITY,
      shakyProbability: SHAKY_PROBABILITY,
      shakyRule: REPLACEMENT_RULE,
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
      effectsUncertain,
      planInfeasibleDraws: summary.planInfeasibleDraws,
      regret: { unit: objectiveUnit, ...spread(summary.regret) },
    },
    selectionsEffectsUncertain: effectsUncertain,
    selections: summary.selections.map((s) => ({
      site: s.site,
      treatments: s.treatments,
      probability: s.probability,
      inPlan: s.inPlan,
      class: s.class,
    })),
    core: summary.selections.filter((s) => s.class === "core").map((s) => project(s.site, s.treatments)),
    marginal: summary.selections.filter((s) => s.class === "marginal").map((s) => project(s.site, s.treatments)),
    shakyProjects: summary.shaky.map((s) => ({
      site: s.site,
      treatments: s.treatments,
      cost: s.cost,
      probability: s.probability,
      effectsUncertain,
      drawsWithout: s.drawsWithout,
      replacedBy: s.replacements.map((r) => ({ site: r.site, treatments: r.treatments, cost: r.cost, shareOfDrawsWithout: r.shareOfDrawsWithout, shareOfDrawsWith: r.shareOfDrawsWith })),
    })),
    sensitivity: {
      baseKsiAvoided: sensitivity.baseKsiAvoided,
      baseBcRatio: jsonNumber(sensitivity.baseBcRatio),
      rows: sensitivity.rows.map((row) => ({ parameter: row.parameter, base: row.base, low: sensitivityCase(row.low), high: sensitivityCase(row.high) })),
    },
    assumptions: describeAssumptions(scenario),
    cautions: CAUTIONS,
  };
}
