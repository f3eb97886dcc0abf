import { completeCrashMatrix } from "../../../src/model/crashMatrix.js";
import type { Scenario, Site, Treatment } from "../../../src/model/types.js";

/** One single-treatment site for a constructed scenario: KSI crashes observed over 5 years, and its treatment. */
export interface ConstructedSite {
  readonly id: string;
  readonly fatalAndSerious: number;
  readonly cmf: number;
  readonly standardError: number;
}

/**
 * A small scenario of single-treatment sites costing 100 each, with a 5-year window, a 10-year
 * life and horizon, and a budget for `fundable` projects; objective KSI.
 */
export function constructedScenario(sites: readonly ConstructedSite[], fundable: number): Scenario {
  const treatments: Treatment[] = sites.map((site) => ({
    id: `t-${site.id}`,
    name: `treatment at ${site.id}`,
    appliesTo: ["intersection"],
    cost: { basis: "per-site", amount: 100 },
    upkeepPerYear: 0,
    serviceLifeYears: 10,
    effects: [{ crashTypes: ["angle"], severities: ["K", "A", "B", "C", "O"], cmf: site.cmf, standardError: site.standardError, source: "constructed for a test" }],
  }));
  const scenarioSites: Site[] = sites.map((site) => ({
    id: site.id,
    name: site.id,
    kind: "intersection",
    district: "Test",
    tags: [],
    crashes: completeCrashMatrix({ angle: { A: site.fatalAndSerious, O: 10 } }),
    candidates: [`t-${site.id}`],
    costOverrides: {},
  }));
  return {
    name: "constructed",
    currency: "USD",
    budget: 100 * fundable,
    crashWindow: { firstYear: 2021, lastYear: 2025 },
    economics: { discountRate: 0.04, horizonYears: 10, crashCosts: { perCrash: { K: 1e7, A: 6e5, B: 2e5, C: 1e5, O: 1e4 }, source: "constructed" } },
    objective: "ksi",
    baseline: "observed",
    maxTreatmentsPerSite: 1,
    catalogue: { treatments, performanceFunctions: [] },
    sites: scenarioSites,
    rules: [],
  };
}
