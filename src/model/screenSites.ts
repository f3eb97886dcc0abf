import { sumCrashMatrix } from "./crashMatrix.js";
import { empiricalBayesCrashesPerYear } from "./empiricalBayesCrashesPerYear.js";
import { empiricalBayesGap, windowYears } from "./siteBaselines.js";
import { KSI_SEVERITIES, type Scenario, type Site } from "./types.js";

/** One site's screening figures (all per year) and its two ranks (1 = worst). */
export interface ScreenedSite {
  readonly site: Site;
  readonly observedKsiPerYear: number;
  /** SPF prediction for a typical site like this one, and the EB expected value; undefined without EB. */
  readonly predictedKsiPerYear?: number;
  readonly expectedKsiPerYear?: number;
  /** EB expected minus predicted KSI: how much worse than its peers the site is expected to be. */
  readonly excessKsiPerYear?: number;
  readonly excessRank: number;
  readonly observedRank: number;
  /** Why there is no EB estimate for this site. */
  readonly note?: string;
}

/** The screened network and the sites proposed for a programme. */
export interface NetworkScreening {
  /** Sites in excess-rank order. */
  readonly sites: readonly ScreenedSite[];
  /** Ids of the top sites by excess expected KSI, among those with a positive excess. */
  readonly proposed: readonly string[];
}

/**
 * Ranks every site by excess expected KSI crashes per year (Empirical Bayes expected minus SPF
 * predicted: the "excess expected average crash frequency" screening measure of HSM Part B,
 * chapter 4, applied to K+A crashes) and, for comparison, by observed KSI per year, which
 * favours sites with a chance bad run (regression to the mean). Sites without what EB needs
 * rank after all others, by observed KSI. Ties go to the site id. Proposes the top `top` sites
 * with a positive excess.
 */
export function screenSites(scenario: Scenario, top: number): NetworkScreening {
  const years = windowYears(scenario);
  const spfs = new Map(scenario.catalogue.performanceFunctions.map((spf) => [spf.id, spf]));
  const figures = scenario.sites.map((site) => {
    const observedKsiPerYear = sumCrashMatrix(site.crashes, KSI_SEVERITIES) / years;
    const spf = site.performanceFunction === undefined ? undefined : spfs.get(site.performanceFunction);
    const gap = empiricalBayesGap(site, spf);
    if (gap !== undefined || spf === undefined) return { site, observedKsiPerYear, note: gap ?? "no SPF" };
    const eb = empiricalBayesCrashesPerYear(site, spf, years);
    const expectedKsiPerYear = sumCrashMatrix(eb.expectedPerYear, KSI_SEVERITIES);
    return { site, observedKsiPerYear, predictedKsiPerYear: eb.predictedKsiPerYear, expectedKsiPerYear, excessKsiPerYear: expectedKsiPerYear - eb.predictedKsiPerYear };
  });
  const byId = (a: { site: Site }, b: { site: Site }) => (a.site.id < b.site.id ? -1 : a.site.id > b.site.id ? 1 : 0);
  const byObserved = [...figures].sort((a, b) => b.observedKsiPerYear - a.observedKsiPerYear || byId(a, b));
  const byExcess = [...figures].sort(
    (a, b) =>
      Number(a.excessKsiPerYear === undefined) - Number(b.excessKsiPerYear === undefined) ||
      (b.excessKsiPerYear ?? 0) - (a.excessKsiPerYear ?? 0) ||
      b.observedKsiPerYear - a.observedKsiPerYear ||
      byId(a, b),
  );
  const observedRank = new Map(byObserved.map((entry, index) => [entry.site.id, index + 1]));
  const sites = byExcess.map((entry, index): ScreenedSite => ({ ...entry, excessRank: index + 1, observedRank: observedRank.get(entry.site.id)! }));
  const proposed = sites.filter((entry) => (entry.excessKsiPerYear ?? 0) > 0).slice(0, top).map((entry) => entry.site.id);
  return { sites, proposed };
}
