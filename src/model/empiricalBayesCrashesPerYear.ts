import { buildCrashMatrix, sumCrashMatrix } from "./crashMatrix.js";
import { empiricalBayesEstimate, empiricalBayesWeight } from "./empiricalBayesWeight.js";
import { predictedCrashesPerYear } from "./predictedCrashesPerYear.js";
import { siteOverdispersion } from "./siteOverdispersion.js";
import { KSI_SEVERITIES, type CrashMatrix, type SafetyPerformanceFunction, type Site } from "./types.js";

/** A site's Empirical Bayes estimate, with the pieces a reviewer needs to follow it. */
export interface EmpiricalBayesResult {
  /** SPF prediction per year, all crashes and KSI (K+A) crashes. */
  readonly predictedPerYear: number;
  readonly predictedKsiPerYear: number;
  /** Overdispersion used at this site (after dividing by length when k is per km). */
  readonly overdispersion: number;
  /** Weights on the prediction for the total and for the KSI total. */
  readonly weight: number;
  readonly ksiWeight: number;
  /** Expected crashes per year in each type × severity cell; its K+A cells sum to the EB KSI total. */
  readonly expectedPerYear: CrashMatrix;
}

/**
 * Empirical Bayes expected crashes per year at a site (Hauer et al. 2002, TRR 1784; HSM Part C,
 * Appendix A), split into crash type × severity cells:
 * 1. EB on the total: P = SPF prediction over the window, w = 1/(1 + k·P), E = w·P + (1 − w)·O.
 * 2. EB on the KSI (K+A) total with the SPF's KSI share: P_ksi = P·s_ksi, w_ksi = 1/(1 + k·P_ksi),
 *    using the same k (an approximation: no separate KSI overdispersion is published with most
 *    SPFs). This keeps E_ksi ≤ E, since w_ksi ≥ w and observed KSI ≤ observed total.
 * 3. Split E_ksi over the K+A cells, and E − E_ksi over the others, by a mix of the SPF's shares
 *    and the site's observed mix shrunk towards them with the same weight (w_ksi, resp. w):
 *    mix = w·(SPF share within the group) + (1 − w)·(observed share within the group); when the
 *    site has no crashes in a group its observed mix is unknown and the SPF shares are used.
 * Totals are preserved exactly. Results are per year: window totals divided by `windowYears`.
 */
export function empiricalBayesCrashesPerYear(site: Site, spf: SafetyPerformanceFunction, windowYears: number): EmpiricalBayesResult {
  if (site.aadt === undefined) throw new RangeError(`site ${site.id} has no AADT`);
  if (!(windowYears > 0)) throw new RangeError(`crash window must cover at least one year, got ${windowYears}`);
  const predictedPerYear = predictedCrashesPerYear(spf, site.kind, site.aadt, site.lengthKm);
  const k = siteOverdispersion(spf, site.kind, site.lengthKm);
  const ksiShare = sumCrashMatrix(spf.shares, KSI_SEVERITIES);

  const predicted = predictedPerYear * windowYears;
  const observed = sumCrashMatrix(site.crashes);
  const weight = empiricalBayesWeight(k, predicted);
  const expected = empiricalBayesEstimate(weight, predicted, observed);

  const predictedKsi = predicted * ksiShare;
  const observedKsi = sumCrashMatrix(site.crashes, KSI_SEVERITIES);
  const ksiWeight = empiricalBayesWeight(k, predictedKsi);
  const expectedKsi = empiricalBayesEstimate(ksiWeight, predictedKsi, observedKsi);

  const groups = {
    ksi: { spfShare: ksiShare, observed: observedKsi, expected: expectedKsi, weight: ksiWeight },
    other: { spfShare: 1 - ksiShare, observed: observed - observedKsi, expected: Math.max(0, expected - expectedKsi), weight },
  };
  const expectedPerYear = buildCrashMatrix((type, severity) => {
    const g = KSI_SEVERITIES.includes(severity) ? groups.ksi : groups.other;
    const spfMix = g.spfShare > 0 ? spf.shares[type][severity] / g.spfShare : 0;
    const mix = g.observed > 0 ? g.weight * spfMix + (1 - g.weight) * (site.crashes[type][severity] / g.observed) : spfMix;
    return (g.expected * mix) / windowYears;
  });
  return { predictedPerYear, predictedKsiPerYear: predictedPerYear * ksiShare, overdispersion: k, weight, ksiWeight, expectedPerYear };
}
