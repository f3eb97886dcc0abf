import type { EffectEstimate, TreatedSiteCounts } from "./beforeAfterTypes.js";
import { indexOfEffectiveness } from "./indexOfEffectiveness.js";

/**
 * The naive (simple) before-after estimate (Hauer 1997, "Observational Before-After Studies in
 * Road Safety", ch. 7): each site's before count, scaled to the length of its after period, is
 * taken as what the after period would have seen untreated:
 *
 *   π_i = K_i · (T_A,i / T_B,i),  Var(π_i) = K_i · (T_A,i / T_B,i)²  (K_i Poisson),
 *
 * summed over the sites and handed to indexOfEffectiveness. It ignores changes in traffic and
 * trends, and when the sites were chosen for their high counts it is biased by regression to
 * the mean: the high before counts partly were chance, the after period falls back anyway, and the
 * treatment looks more effective than it is. Shown for comparison only, never as the estimate.
 * No sites, no crashes before or none after: null.
 */
export function naiveBeforeAfter(sites: readonly TreatedSiteCounts[]): EffectEstimate | null {
  let observedAfter = 0;
  let expectedAfter = 0;
  let expectedAfterVariance = 0;
  for (const site of sites) {
    if (!(site.beforeYears > 0) || !(site.afterYears > 0)) throw new RangeError(`site ${site.site}: both periods must last more than 0 years`);
    const scale = site.afterYears / site.beforeYears;
    observedAfter += site.afterObserved;
    expectedAfter += site.beforeObserved * scale;
    expectedAfterVariance += site.beforeObserved * scale ** 2;
  }
  return indexOfEffectiveness("naive", sites.length, observedAfter, expectedAfter, expectedAfterVariance);
}
