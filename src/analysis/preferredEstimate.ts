import type { CrashGroupEvaluation } from "./evaluateBuiltProjects.js";
import type { EffectEstimate } from "../model/beforeAfterTypes.js";

/**
 * The estimate that speaks for a crash group: Empirical Bayes when any site has an SPF and AADT,
 * else the comparison group, never the naive one (it does not correct for regression to the mean).
 */
export function preferredEstimate(evaluation: CrashGroupEvaluation): EffectEstimate | null {
  return evaluation.empiricalBayes ?? evaluation.comparisonGroup;
}
