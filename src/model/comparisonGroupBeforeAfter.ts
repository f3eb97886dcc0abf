import type { ComparisonSiteCounts, EffectEstimate, TreatedSiteCounts } from "./beforeAfterTypes.js";
import { indexOfEffectiveness } from "./indexOfEffectiveness.js";

/**
 * The comparison-group before-after estimate (Hauer 1997, "Observational Before-After Studies in
 * Road Safety", ch. 9): untreated sites that share the treated sites' trends (traffic, weather,
 * reporting) tell how the after period would have differed from the before period untreated.
 * With K = Σ treated before, λ = L = Σ treated after, M = Σ comparison before, N = Σ comparison after:
 *
 *   r_C = [(N / ΣT_A,C) / (M / ΣT_B,C)] / (1 + 1/M): the comparison sites' after-to-before ratio of
 *     crashes per site-year, pooled (each site weighs by its crashes, each year alike), and divided
 *     by 1 + 1/M, Hauer's correction of the small-sample bias of a ratio whose denominator is a
 *     Poisson count;
 *   π̂ = r_C × Σ_i K_i (T_A,i / T_B,i): each treated site's before count put on its own after
 *     period's length, then moved by the comparison trend;
 *   Var(π̂)/π̂² ≈ Σ K_i ρ_i² / (Σ K_i ρ_i)² + 1/M + 1/N, ρ_i = T_A,i/T_B,i (all three counts Poisson;
 *     the first term is 1/K when every treated site has the same period lengths).
 *
 * It neglects the variance of the odds ratio ω across comparison groups, i.e. it assumes the
 * comparison trend holds exactly for the treated sites; where it does not, the interval is too
 * narrow. It does not correct for regression to the mean: sites chosen for high counts bias it.
 * Null when K, M, N or λ is 0 (no ratio can be formed), so also for no sites.
 */
export function comparisonGroupBeforeAfter(treated: readonly TreatedSiteCounts[], comparison: readonly ComparisonSiteCounts[]): EffectEstimate | null {
  let comparisonBefore = 0;
  let comparisonAfter = 0;
  let comparisonBeforeYears = 0;
  let comparisonAfterYears = 0;
  for (const site of comparison) {
    requirePeriods(site);
    comparisonBefore += site.beforeObserved;
    comparisonAfter += site.afterObserved;
    comparisonBeforeYears += site.beforeYears;
    comparisonAfterYears += site.afterYears;
  }
  let treatedBefore = 0;
  let observedAfter = 0;
  let scaledBefore = 0;
  let scaledBeforeVariance = 0;
  for (const site of treated) {
    requirePeriods(site);
    const scale = site.afterYears / site.beforeYears;
    treatedBefore += site.beforeObserved;
    observedAfter += site.afterObserved;
    scaledBefore += site.beforeObserved * scale;
    scaledBeforeVariance += site.beforeObserved * scale ** 2;
  }
  if (treatedBefore === 0 || comparisonBefore === 0 || comparisonAfter === 0) return null;
  const trend = comparisonAfter / comparisonAfterYears / (comparisonBefore / comparisonBeforeYears) / (1 + 1 / comparisonBefore);
  const expectedAfter = trend * scaledBefore;
  const relativeVariance = scaledBeforeVariance / scaledBefore ** 2 + 1 / comparisonBefore + 1 / comparisonAfter;
  return indexOfEffectiveness("comparison-group", treated.length, observedAfter, expectedAfter, relativeVariance * expectedAfter ** 2);
}

function requirePeriods(site: { readonly site: string; readonly beforeYears: number; readonly afterYears: number }): void {
  if (!(site.beforeYears > 0) || !(site.afterYears > 0)) throw new RangeError(`site ${site.site}: both periods must last more than 0 years`);
}
