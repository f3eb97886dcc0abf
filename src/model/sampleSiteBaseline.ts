import { buildCrashMatrix, totalsBySeverity } from "./crashMatrix.js";
import { sampleGamma } from "./random/sampleGamma.js";
import type { RandomSource } from "./random/pcg32.js";
import type { SiteBaseline } from "./siteBaselines.js";
import type { CrashMatrix, Site } from "./types.js";

/** How a site's baseline is drawn; stated in every uncertainty output. */
export const BASELINE_SAMPLING_RULE =
  "observed baselines: for each severity, the site's true crash rate is drawn from its Poisson-gamma posterior Gamma(n, T) (n crashes of that severity in T window years, vague conjugate prior p(rate) ∝ 1/rate, so the draws average to the observed rate n/T that plan uses); every crash-type cell of that severity is scaled by the drawn rate / observed rate, keeping the observed crash-type mix; a severity with no observed crashes stays at zero, as in the observed baseline; other baseline methods are held fixed";

/** One drawn baseline and whether it was actually drawn (false: held at its point estimate). */
export interface SampledBaseline {
  readonly expectedPerYear: CrashMatrix;
  readonly sampled: boolean;
}

/**
 * One draw of a site's expected crashes per year, by its baseline method (see
 * BASELINE_SAMPLING_RULE). Other methods (Empirical Bayes) are held at their point estimate
 * (`sampled: false`).
 * Posterior: with n ~ Poisson(rate × T) and prior ∝ 1/rate, rate | n ~ Gamma(n, T)
 * (conjugate gamma–Poisson update, e.g. Gelman et al., Bayesian Data Analysis, 3rd ed., §2.6).
 */
export function sampleSiteBaseline(baseline: SiteBaseline, site: Site, windowYears: number, random: RandomSource): SampledBaseline {
  if (baseline.method !== "observed") return { expectedPerYear: baseline.expectedPerYear, sampled: false };
  const counts = totalsBySeverity(site.crashes);
  const ratePerCrash = { K: 0, A: 0, B: 0, C: 0, O: 0 };
  for (const severity of ["K", "A", "B", "C", "O"] as const) {
    const n = counts[severity];
    // Cell counts are whole crashes; the posterior shape is their total for the severity.
    if (n > 0) ratePerCrash[severity] = sampleGamma(random, n, windowYears) / n;
  }
  return { expectedPerYear: buildCrashMatrix((type, severity) => site.crashes[type][severity] * ratePerCrash[severity]), sampled: true };
}
