import { empiricalBayesCrashesPerYear } from "./empiricalBayesCrashesPerYear.js";
import { observedCrashesPerYear } from "./observedCrashesPerYear.js";
import type { CrashMatrix, SafetyPerformanceFunction, Scenario, Site, SiteBaselineMethod } from "./types.js";

/** A site's expected crashes per year without treatment, and how they were estimated. */
export interface SiteBaseline {
  readonly site: string;
  readonly expectedPerYear: CrashMatrix;
  readonly method: SiteBaselineMethod;
  /** Factor by which expected crashes grow each year with traffic (1: no growth). */
  readonly crashGrowthPerYear?: number;
  /** Why the site uses observed counts when the scenario asked for Empirical Bayes or auto. */
  readonly note?: string;
}

/** Years of crash data below which counts are too noisy to rank sites (common practice: 3 to 5 years). */
export const MIN_RECOMMENDED_WINDOW_YEARS = 3;

/** Number of whole calendar years in the scenario's crash window. */
export function windowYears(scenario: Scenario): number {
  return scenario.crashWindow.lastYear - scenario.crashWindow.firstYear + 1;
}

/** How traffic growth feeds expected crashes; stated in every output that shows assumptions. */
export function describeTrafficGrowth(rate: number): string {
  if (rate === 0) return "none: expected crashes stay at their baseline every year";
  return `AADT grows ${(100 * rate).toFixed(2)}% a year; at Empirical Bayes sites expected crashes grow with the SPF's AADT exponent b, by (1 + g)^b a year (the SPF's elasticity to traffic, Highway Safety Manual 2010 Part C form); at observed-count sites they grow in proportion, by (1 + g) a year`;
}

/**
 * Expected crashes per year at every site by the scenario's baseline method:
 * - `observed`: the site's own counts per window year;
 * - `empirical-bayes`: the EB estimate; a site that lacks what EB needs (AADT, a known SPF that
 *   applies to its kind, a length when the SPF uses one) falls back to its observed counts, with
 *   a note saying why;
 * - `auto` (the default): the same as `empirical-bayes`; the name says that observed counts are an
 *   expected fallback rather than the user's choice.
 * Each baseline also carries its yearly crash growth under the scenario's traffic growth rate.
 */
export function siteBaselines(scenario: Scenario): SiteBaseline[] {
  const years = windowYears(scenario);
  const growth = 1 + (scenario.economics.trafficGrowthRate ?? 0);
  const performanceFunctions = new Map(scenario.catalogue.performanceFunctions.map((spf) => [spf.id, spf]));
  return scenario.sites.map((site) => {
    const observed = (note?: string): SiteBaseline => ({
      site: site.id,
      expectedPerYear: observedCrashesPerYear(site.crashes, years),
      method: "observed",
      crashGrowthPerYear: growth,
      ...(note !== undefined && { note }),
    });
    if (scenario.baseline === "observed") return observed();
    const spf = site.performanceFunction === undefined ? undefined : performanceFunctions.get(site.performanceFunction);
    const missing = empiricalBayesGap(site, spf);
    if (missing !== undefined || spf === undefined) return observed(`observed counts used: ${missing}`);
    return {
      site: site.id,
      expectedPerYear: empiricalBayesCrashesPerYear(site, spf, years).expectedPerYear,
      method: "empirical-bayes",
      crashGrowthPerYear: Math.pow(growth, spf.aadtExponent),
    };
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
