import { buildCrashMatrix, sumCrashMatrix, totalsBySeverity } from "./crashMatrix.js";
import { empiricalBayesCrashesPerYear } from "./empiricalBayesCrashesPerYear.js";
import { empiricalBayesPosterior } from "./empiricalBayesPosterior.js";
import { sampleGamma } from "./random/sampleGamma.js";
import type { RandomSource } from "./random/pcg32.js";
import type { SiteBaseline } from "./siteBaselines.js";
import { CRASH_TYPES, KSI_SEVERITIES, SEVERITIES, type CrashMatrix, type CrashType, type SafetyPerformanceFunction, type Severity, type Site } from "./types.js";

/** How a site's baseline is drawn; stated in every uncertainty output. */
export const BASELINE_SAMPLING_RULE =
  "each site's baseline is drawn by its own method. Observed baselines: for each severity, the site's true crash rate is drawn from its Poisson-gamma posterior under the Jeffreys prior p(rate) ∝ rate^(-1/2), rate | n ~ Gamma(n + 1/2, T) (n crashes of that severity in T window years), and every crash-type cell of that severity is scaled by the drawn rate / (n/T), keeping the observed crash-type mix; a severity with no observed crashes gets a proper posterior too, Gamma(1/2, T), and its drawn rate is spread over crash types by the site's mix of crashes of the same group (K+A, or B+C+O), else of all its crashes, else evenly. The plan uses the observed rate n/T; the draws average (n + 1/2)/T, so they lean above the plan, most where counts are small. Empirical Bayes baselines: the site's expected crashes per year λ (all severities) are drawn from their gamma posterior λ | n ~ Gamma(1/k + n, 1/(kμ) + T) (μ the SPF's prediction per year, k the site's overdispersion, n its observed crashes over T years; Hauer 1997, ch. 7; Highway Safety Manual 2010, Part C, Appendix A), whose mean is the EB estimate, and the site's EB crash matrix is scaled by drawn λ / that mean";

/** One drawn baseline and whether it was actually drawn (false: held at its point estimate). */
export interface SampledBaseline {
  readonly expectedPerYear: CrashMatrix;
  readonly sampled: boolean;
}

/** Half a crash: the shape the Jeffreys prior adds to a Poisson count. */
const JEFFREYS_SHAPE = 0.5;

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
  if (baseline.method === "observed") return { expectedPerYear: sampleObserved(site.crashes, windowYears, random), sampled: true };
  if (baseline.method === "empirical-bayes") {
    if (spf === undefined) throw new RangeError(`site ${site.id} has an Empirical Bayes baseline but no performance function was given`);
    const estimate = empiricalBayesCrashesPerYear(site, spf, windowYears);
    const posterior = empiricalBayesPosterior(estimate.predictedPerYear, estimate.overdispersion, sumCrashMatrix(site.crashes), windowYears);
    const scale = sampleGamma(random, posterior.shape, posterior.rate) / (posterior.shape / posterior.rate);
    return { expectedPerYear: buildCrashMatrix((type, severity) => baseline.expectedPerYear[type][severity] * scale), sampled: true };
  }
  return { expectedPerYear: baseline.expectedPerYear, sampled: false };
}

function sampleObserved(crashes: CrashMatrix, windowYears: number, random: RandomSource): CrashMatrix {
  const counts = totalsBySeverity(crashes);
  const drawnRate = {} as Record<Severity, number>;
  // Every severity draws, in KABCO order, whether or not it saw crashes: one fixed use of the stream.
  for (const severity of SEVERITIES) drawnRate[severity] = sampleGamma(random, counts[severity] + JEFFREYS_SHAPE, windowYears);
  const groupMix = { ksi: typeMix(crashes, KSI_SEVERITIES), other: typeMix(crashes, SEVERITIES.filter((s) => !KSI_SEVERITIES.includes(s))) };
  const allMix = typeMix(crashes, SEVERITIES);
  return buildCrashMatrix((type, severity) => {
    const n = counts[severity];
    if (n > 0) return (crashes[type][severity] / n) * drawnRate[severity];
    const mix = (KSI_SEVERITIES.includes(severity) ? groupMix.ksi : groupMix.other) ?? allMix;
    return (mix === undefined ? 1 / CRASH_TYPES.length : mix[type]) * drawnRate[severity];
  });
}

/** Each crash type's share of the site's crashes of these severities, or undefined when it has none. */
function typeMix(crashes: CrashMatrix, severities: readonly Severity[]): Record<CrashType, number> | undefined {
  const total = sumCrashMatrix(crashes, severities);
  if (total === 0) return undefined;
  const mix = {} as Record<CrashType, number>;
  for (const type of CRASH_TYPES) mix[type] = severities.reduce((sum, severity) => sum + crashes[type][severity], 0) / total;
  return mix;
}
