import type { PreparedPlan } from "../../src/analysis/preparePlan.js";
import type { SiteAlternatives } from "../../src/model/buildAlternatives.js";
import { completeCrashMatrix } from "../../src/model/crashMatrix.js";
import type { Alternative, Objective, Scenario, Site } from "../../src/model/types.js";
import type { PolicyRule } from "../../src/model/policyRule.js";
import { seededRandom } from "../../scripts/seededRandom.js";

export { seededRandom };

/** One alternative as a test writes it: whole-number capital cost and KSI avoided; benefit optional. */
export interface SyntheticOption {
  readonly cost: number;
  readonly ksi: number;
  readonly benefit?: number;
  readonly lifecycle?: number;
  readonly treatments?: readonly string[];
}

/** One site as a test writes it. */
export interface SyntheticSite {
  readonly id: string;
  readonly options: readonly SyntheticOption[];
  readonly required?: boolean;
  readonly excludedBy?: string;
}

/** A site record with no crashes: the tests below supply alternatives directly. */
export function syntheticSite(id: string): Site {
  return { id, name: `Site ${id}`, kind: "intersection", district: "D1", tags: [], crashes: completeCrashMatrix(undefined), candidates: [], costOverrides: {} };
}

/** An alternative whose economics are given outright (benefit defaults to 1000 × KSI, lifecycle cost to capital). */
export function syntheticAlternative(site: string, option: SyntheticOption, index: number): Alternative {
  const benefitPV = option.benefit ?? option.ksi * 1000;
  const lifecycleCostPV = option.lifecycle ?? option.cost;
  return {
    site,
    treatments: option.treatments ?? [`t${index}`],
    cost: option.cost,
    lifecycleCostPV,
    crashesAvoidedPerYear: { K: 0, A: option.ksi / 10, B: 0, C: 0, O: 0 },
    ksiAvoided: option.ksi,
    benefitPV,
    bcRatio: lifecycleCostPV > 0 ? benefitPV / lifecycleCostPV : Infinity,
    npv: benefitPV - lifecycleCostPV,
    costPerKsi: option.ksi > 0 ? lifecycleCostPV / option.ksi : Infinity,
    sharedCells: 0,
    effectiveYears: 10,
  };
}

/**
 * A prepared plan built straight from sites and options, bypassing crash baselines, so tests
 * control every cost and value exactly.
 */
export function syntheticPlan(sites: readonly SyntheticSite[], budget: number, objective: Objective = "ksi", rules: readonly PolicyRule[] = []): PreparedPlan {
  const entries: SiteAlternatives[] = sites.map((spec) => ({
    site: syntheticSite(spec.id),
    alternatives: spec.options.map((option, index) => syntheticAlternative(spec.id, option, index)),
    required: spec.required ?? false,
    ...(spec.excludedBy === undefined ? {} : { excludedBy: spec.excludedBy }),
  }));
  const scenario: Scenario = {
    name: "synthetic",
    currency: "USD",
    budget,
    crashWindow: { firstYear: 2020, lastYear: 2024 },
    economics: { discountRate: 0.04, horizonYears: 20, crashCosts: { perCrash: { K: 1, A: 1, B: 1, C: 1, O: 1 }, source: "test" } },
    objective,
    baseline: "observed",
    maxTreatmentsPerSite: 3,
    catalogue: { treatments: [], performanceFunctions: [] },
    sites: entries.map((entry) => entry.site),
    rules,
  };
  return { scenario, objective, baselines: [], sites: entries };
}


/** Random small sites with whole-number costs and KSI, so every sum is exact in floating point. */
export function randomSites(seed: number, count: number, maxOptions: number): SyntheticSite[] {
  const random = seededRandom(seed);
  const int = (lo: number, hi: number) => lo + Math.floor(random() * (hi - lo + 1));
  return Array.from({ length: count }, (_, s) => ({
    id: `S${s}`,
    options: Array.from({ length: int(1, maxOptions) }, () => ({ cost: int(1, 50), ksi: int(0, 30) })),
  }));
}
