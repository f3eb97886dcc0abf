import { baselineDrawPlan, CELL_COUNT, drawBaselineCells } from "./baselineDraws.js";
import { buildCrashMatrix } from "./crashMatrix.js";
import type { RandomSource } from "./random/pcg32.js";
import type { SiteBaseline } from "./siteBaselines.js";
import { CRASH_TYPES, SEVERITIES, type CrashMatrix, type SafetyPerformanceFunction, type Site } from "./types.js";

/** How a site's baseline is drawn; stated in every uncertainty output. */
export const BASELINE_SAMPLING_RULE =
  "each site's baseline is drawn by its own method. Observed baselines: for each severity, the site's true crash rate is drawn from its Poisson-gamma posterior under the Jeffreys prior p(rate) ∝ rate^(-1/2), rate | n ~ Gamma(n + 1/2, T) (n crashes of that severity in T window years), and every crash-type cell of that severity is scaled by the drawn rate / (n/T), keeping the observed crash-type mix; a severity with no observed crashes gets a proper posterior too, Gamma(1/2, T), and its drawn rate is spread over crash types by the site's mix of crashes of the same group (K+A, or B+C+O), else of all its crashes, else evenly. The plan uses the observed rate n/T; the draws average (n + 1/2)/T, so they lean above the plan, most where counts are small. Empirical Bayes baselines: the site's expected crashes per year λ (all severities) are drawn from their gamma posterior λ | n ~ Gamma(1/k + n, 1/(kμ) + T) (μ the SPF's prediction per year, k the site's overdispersion, n its observed crashes over T years; Hauer 1997, ch. 7; Highway Safety Manual 2010, Part C, Appendix A), whose mean is the EB estimate, and the site's EB crash matrix is scaled by drawn λ / that mean";

/** One drawn baseline and whether it was actually drawn (false: held at its point estimate). */
export interface SampledBaseline {
  readonly expectedPerYear: CrashMatrix;
  readonly sampled: boolean;
}

/**
 * One draw of a site's expected crashes per year, by its own baseline method (see
 * BASELINE_SAMPLING_RULE); `spf` is the site's performance function, needed for an Empirical Bayes
 * baseline. Methods without a posterior are held at their point estimate (`sampled: false`).
 * Observed: with n ~ Poisson(rate × T) and the Jeffreys prior ∝ rate^(−1/2), rate | n ~ Gamma(n + ½, T)
 * (conjugate gamma–Poisson update; Gelman et al., Bayesian Data Analysis, 3rd ed., §2.6 and §2.8, from memory).
 * Empirical Bayes: `empiricalBayesPosterior`.
 */
export function sampleSiteBaseline(
  baseline: SiteBaseline,
  site: Site,
  windowYears: number,
  random: RandomSource,
  spf?: SafetyPerformanceFunction,
): SampledBaseline {
  const cells = new Float64Array(CELL_COUNT);
  const sampled = drawBaselineCells(baselineDrawPlan(baseline, site, windowYears, spf), random, cells);
  if (!sampled) return { expectedPerYear: baseline.expectedPerYear, sampled };
  return { expectedPerYear: buildCrashMatrix((type, severity) => cells[CRASH_TYPES.indexOf(type) * SEVERITIES.length + SEVERITIES.indexOf(severity)]!), sampled };
}
