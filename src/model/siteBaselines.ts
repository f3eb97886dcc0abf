import { observedCrashesPerYear } from "./observedCrashesPerYear.js";
import type { BaselineMethod, CrashMatrix, Scenario } from "./types.js";

/** A site's expected crashes per year without treatment, and how they were estimated. */
export interface SiteBaseline {
  readonly site: string;
  readonly expectedPerYear: CrashMatrix;
  readonly method: BaselineMethod;
  /** Why the site fell back to another method than the scenario asked for. */
  readonly note?: string;
}

/** Number of whole calendar years in the scenario's crash window. */
export function windowYears(scenario: Scenario): number {
  return scenario.crashWindow.lastYear - scenario.crashWindow.firstYear + 1;
}

/** Expected crashes per year at every site by the scenario's baseline method. */
export function siteBaselines(scenario: Scenario): SiteBaseline[] {
  const years = windowYears(scenario);
  return scenario.sites.map((site) => ({
    site: site.id,
    expectedPerYear: observedCrashesPerYear(site.crashes, years),
    method: "observed",
  }));
}
