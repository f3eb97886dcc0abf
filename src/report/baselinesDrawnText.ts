import type { BaselineUncertainty } from "../analysis/uncertainty/analyseUncertainty.js";

/** How many sites' baselines were drawn, by method, and how many held fixed. */
export function baselinesDrawnText(baselines: BaselineUncertainty): string {
  const drawn = baselines.observed + baselines.empiricalBayes;
  const total = drawn + baselines.fixed;
  return `baselines drawn at ${drawn} of ${total} sites (${baselines.observed} observed, ${baselines.empiricalBayes} Empirical Bayes)${baselines.fixed === 0 ? "" : `; ${baselines.fixed} held at their point estimate`}`;
}
