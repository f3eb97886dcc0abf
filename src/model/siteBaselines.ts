import { empiricalBayesCrashesPerYear } from "./empiricalBayesCrashesPerYear.js";
import { observedCrashesPerYear } from "./observedCrashesPerYear.js";
import type { BaselineMethod, CrashMatrix, SafetyPerformanceFunction, Scenario, Site } from "./types.js";

/** A site's expected crashes per year without treatment, and how they were estimated. */
export interface SiteBaseline {
  readonly site: string;
  readonly expectedPerYear: CrashMatrix;
  readonly method: BaselineMethod;
  /** Why the site fell back to another method than the scenario asked for. */
  readonly note?: string;
}

/** Years of crash data below which counts are too noisy to rank sites (common practice: 3 to 5 years). */
export const MIN_RECOMMENDED_WINDOW_YEARS = 3;

/** Number of whole calendar years in the scenario's crash window. */
export function windowYears(scenario: Scenario): number {
  return scenario.crashWindow.lastYear - scenario.crashWindow.firstYear + 1;
}

/**
 * Expected crashes per year at every site by the scenario's baseline method. With
 * `empirical-bayes`, a site that lacks what EB needs (AADT, a known SPF that applies to its kind,
 * a length when the SPF uses one) falls back to its observed counts, with a note saying why.
 */
export function siteBaselines(scenario: Scenario): SiteBaseline[] {
  const years = windowYears(scenario);
  const performanceFunctions = new Map(scenario.catalogue.performanceFunctions.map((spf) => [spf.id, spf]));
  return scenario.sites.map((site) => {
    const observed = (note?: string): SiteBaseline => ({
      site: site.id,
      expectedPerYear: observedCrashesPerYear(site.crashes, years),
      method: "observed",
      ...(note !== undefined && { note }),
    });
    if (scenario.baseline !== "empirical-bayes") return observed();
    const spf = site.performanceFunction === undefined ? undefined : performanceFunctions.get(site.performanceFunction);
    const missing = empiricalBayesGap(site, spf);
    if (missing !== undefined || spf === undefined) return observed(`observed counts used: ${missing}`);
    return { site: site.id, expectedPerYear: empiricalBayesCrashesPerYear(site, spf, years).expectedPerYear, method: "empirical-bayes" };
  });
}

/** What a site lacks for an Empirical Bayes estimate, or undefined when it has everything. */
export function empiricalBayesGap(site: Site, spf: SafetyPerformanceFunction | undefined): string | undefined {
  if (site.aadt === undefined) return "the site has no aadt";
  if (site.performanceFunction === undefined) return "the site names no performanceFunction";
  if (spf === undefined) return `performance function '${site.performanceFunction}' is not in the catalogues`;
  if (!spf.appliesTo.includes(site.kind)) return `performance function '${spf.id}' does not apply to a ${site.kind}`;
  const needsLength = site.kind !== "intersection" && (spf.lengthExponent !== 0 || spf.overdispersionPerKm);
  if (needsLength && site.lengthKm === undefined) return `performance function '${spf.id}' needs the site's lengthKm`;
  return undefined;
}
