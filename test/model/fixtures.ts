import { completeCrashMatrix } from "../../src/model/crashMatrix.js";
import { CRASH_TYPES, SEVERITIES, type Economics, type Site, type Treatment } from "../../src/model/types.js";

/** A small hand-checkable site: five years of counts. */
export function handSite(overrides: Partial<Site> = {}): Site {
  return {
    id: "X-1",
    name: "Hand-worked intersection",
    kind: "intersection",
    district: "Test",
    tags: [],
    crashes: completeCrashMatrix({ pedestrian: { K: 1, A: 4, B: 5 }, angle: { O: 10 } }),
    candidates: ["t1", "t2"],
    costOverrides: {},
    ...overrides,
  };
}

/** Round numbers so the expected values can be worked by hand in the tests. */
export const HAND_ECONOMICS: Economics = {
  discountRate: 0.04,
  horizonYears: 20,
  crashCosts: { perCrash: { K: 10_000_000, A: 500_000, B: 100_000, C: 50_000, O: 10_000 }, source: "hand-worked test values" },
};

export function treatment(partial: Partial<Treatment> & Pick<Treatment, "id">): Treatment {
  return {
    name: partial.id,
    appliesTo: ["intersection", "segment", "corridor"],
    cost: { basis: "per-site", amount: 0 },
    upkeepPerYear: 0,
    serviceLifeYears: 10,
    effects: [],
    ...partial,
  };
}

export const ALL_TYPES = CRASH_TYPES;
export const ALL_SEVERITIES = SEVERITIES;
