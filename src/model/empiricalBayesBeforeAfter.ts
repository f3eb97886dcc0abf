import type { EffectEstimate, TreatedSiteCounts } from "./beforeAfterTypes.js";
import { empiricalBayesEstimate, empiricalBayesWeight } from "./empiricalBayesWeight.js";
import { indexOfEffectiveness } from "./indexOfEffectiveness.js";

/**
 * The Empirical Bayes before-after estimate of a treatment's effect (Highway Safety Manual 2010,
 * Part B, ch. 9, Appendix 9A.1; Hauer, Harwood, Council and Griffith, "Estimating safety by the
 * Empirical Bayes method: a tutorial", TRR 1784, 2002; Hauer 1997, ch. 8). For each site, with
 * P_B and P_A the SPF's predicted crashes over the before and after periods and K its observed
 * crashes before:
 *
 *   w = 1 / (1 + k P_B)                       (9A.1-2)
 *   EB_before = w P_B + (1 − w) K             (9A.1-1)
 *   r = P_A / P_B                             (9A.1-3): carries the change in AADT and in period length
 *   π_i = EB_before · r                       (9A.1-4)
 *   Var(π_i) = r² · EB_before · (1 − w) = π_i r (1 − w)   (9A.1-9)
 *
 * λ, π̂ and Var(π̂) are summed over the sites and handed to indexOfEffectiveness. Because the site's
 * own count is shrunk towards the SPF, sites chosen for their high counts do not make the treatment
 * look better than it is (no regression-to-the-mean bias), provided the SPF and k fit the sites.
 *
 * Callers pass only sites that have `spf`; a site without it, or with a non-positive before
 * prediction (r would be undefined), is a programming mistake: RangeError. No sites, no crashes
 * after, or no crashes expected: null (see indexOfEffectiveness).
 */
export function empiricalBayesBeforeAfter(sites: readonly TreatedSiteCounts[]): EffectEstimate | null {
  let observedAfter = 0;
  let expectedAfter = 0;
  let expectedAfterVariance = 0;
  for (const site of sites) {
    const spf = site.spf;
    if (spf === undefined) throw new RangeError(`site ${site.site} has no SPF prediction; leave it out of the Empirical Bayes estimate`);
    if (!(spf.beforePredicted > 0) || !(spf.afterPredicted >= 0)) {
      throw new RangeError(`site ${site.site}: the SPF must predict more than 0 crashes before and at least 0 after, got ${spf.beforePredicted} and ${spf.afterPredicted}`);
    }
    const weight = empiricalBayesWeight(spf.overdispersion, spf.beforePredicted);
    const expectedBefore = empiricalBayesEstimate(weight, spf.beforePredicted, site.beforeObserved);
    const ratio = spf.afterPredicted / spf.beforePredicted;
    const expected = expectedBefore * ratio;
    observedAfter += site.afterObserved;
    expectedAfter += expected;
    expectedAfterVariance += expected * ratio * (1 - weight);
  }
  return indexOfEffectiveness("empirical-bayes", sites.length, observedAfter, expectedAfter, expectedAfterVariance);
}
