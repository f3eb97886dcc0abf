import { describe, expect, it } from "vitest";
import { loadCatalogue } from "../../src/io/loadCatalogue.js";
import { completeCrashMatrix, sumCrashMatrix } from "../../src/model/crashMatrix.js";
import { empiricalBayesCrashesPerYear } from "../../src/model/empiricalBayesCrashesPerYear.js";
import { empiricalBayesEstimate, empiricalBayesWeight } from "../../src/model/empiricalBayesWeight.js";
import { predictedCrashesPerYear } from "../../src/model/predictedCrashesPerYear.js";
import { siteOverdispersion } from "../../src/model/siteOverdispersion.js";
import { KSI_SEVERITIES, type SafetyPerformanceFunction, type Site } from "../../src/model/types.js";

const site = (over: Partial<Site>): Site => ({
  id: "X",
  name: "X",
  kind: "intersection",
  district: "D",
  tags: [],
  crashes: completeCrashMatrix({}),
  candidates: ["t"],
  costOverrides: {},
  ...over,
});

describe("Empirical Bayes weight and estimate", () => {
  it("matches the formulas of Hauer et al. (2002) worked by hand", () => {
    // k = 0.5, 10 crashes predicted over the window: w = 1 / (1 + 0.5 × 10) = 1/6.
    expect(empiricalBayesWeight(0.5, 10)).toBeCloseTo(1 / 6, 12);
    // 16 observed: E = 10/6 + (5/6) × 16 = 15.
    expect(empiricalBayesEstimate(1 / 6, 10, 16)).toBeCloseTo(15, 12);
  });

  it("estimates and splits an intersection's crashes as computed by hand", () => {
    // SPF: N = 1e-4 × AADT, k = 0.5, shares: angle A 0.1, angle O 0.5, rear-end O 0.4.
    const spf: SafetyPerformanceFunction = {
      id: "hand",
      appliesTo: ["intersection"],
      intercept: Math.log(1e-4),
      aadtExponent: 1,
      lengthExponent: 0,
      overdispersion: 0.5,
      overdispersionPerKm: false,
      shares: completeCrashMatrix({ angle: { A: 0.1, O: 0.5 }, "rear-end": { O: 0.4 } }),
      source: "test",
    };
    // AADT 20 000 → 2 a year, 10 over 5 years; observed 16: pedestrian A 4, rear-end O 12.
    const result = empiricalBayesCrashesPerYear(site({ aadt: 20000, crashes: completeCrashMatrix({ pedestrian: { A: 4 }, "rear-end": { O: 12 } }) }), spf, 5);
    expect(result.predictedPerYear).toBeCloseTo(2, 12);
    expect(result.weight).toBeCloseTo(1 / 6, 12);
    // KSI: predicted 1 over the window, w = 1/(1 + 0.5) = 2/3, E = 2/3 × 1 + 1/3 × 4 = 2 → 0.4 a year.
    expect(result.ksiWeight).toBeCloseTo(2 / 3, 12);
    expect(sumCrashMatrix(result.expectedPerYear, KSI_SEVERITIES)).toBeCloseTo(0.4, 12);
    expect(sumCrashMatrix(result.expectedPerYear)).toBeCloseTo(3, 12); // 15 / 5 years
    // KSI mix: 2/3 × SPF (angle A 1) + 1/3 × observed (pedestrian A 1).
    expect(result.expectedPerYear.angle.A).toBeCloseTo(0.4 * (2 / 3), 12);
    expect(result.expectedPerYear.pedestrian.A).toBeCloseTo(0.4 / 3, 12);
    // Others: 13 over the window = 2.6 a year; mix 1/6 × (5/9, 4/9) + 5/6 × (0, 1).
    expect(result.expectedPerYear["rear-end"].O).toBeCloseTo(2.6 * (49 / 54), 12);
    expect(result.expectedPerYear.angle.O).toBeCloseTo(2.6 * (5 / 54), 12);
  });

  it("divides a per-km overdispersion by the segment's length", () => {
    // Rural two-lane form (HSM chapter 10, from memory): N = AADT × L_mi × 365e-6 × e^-0.312, k = 0.236 / L_mi.
    const spf: SafetyPerformanceFunction = {
      id: "rural",
      appliesTo: ["segment"],
      intercept: Math.log(365e-6) - 0.312 - Math.log(1.609344),
      aadtExponent: 1,
      lengthExponent: 1,
      overdispersion: 0.236 * 1.609344,
      overdispersionPerKm: true,
      shares: completeCrashMatrix({ "run-off-road": { K: 0.05, O: 0.95 } }),
      source: "test",
    };
    const segment = site({ kind: "segment", aadt: 5000, lengthKm: 2 * 1.609344, crashes: completeCrashMatrix({ "run-off-road": { O: 7 } }) });
    // 2 miles: N = 5000 × 2 × 365e-6 × e^-0.312 = 2.67173 a year; k = 0.236 / 2 = 0.118 (the same in miles or km).
    const perYear = 5000 * 2 * 365e-6 * Math.exp(-0.312);
    expect(perYear).toBeCloseTo(2.67173, 5);
    expect(siteOverdispersion(spf, "segment", segment.lengthKm)).toBeCloseTo(0.118, 12);
    const result = empiricalBayesCrashesPerYear(segment, spf, 3);
    expect(result.predictedPerYear).toBeCloseTo(perYear, 10);
    const w = 1 / (1 + 0.118 * perYear * 3);
    expect(result.weight).toBeCloseTo(w, 12);
    expect(sumCrashMatrix(result.expectedPerYear)).toBeCloseTo((w * perYear * 3 + (1 - w) * 7) / 3, 12);
    // Without the per-km flag the weight would differ: the test can fail if the length is ignored.
    expect(empiricalBayesCrashesPerYear(segment, { ...spf, overdispersionPerKm: false }, 3).weight).not.toBeCloseTo(w, 3);
  });
});

describe("the demo catalogue's SPFs reproduce reference values", () => {
  const spfs = new Map(loadCatalogue("catalogs/demo-catalogue.yaml").catalogue.performanceFunctions.map((spf) => [spf.id, spf]));
  it("rural two-lane segment: AADT 10 000 over 1.5 miles predicts 4.008 crashes a year", () => {
    // HSM chapter 10 base SPF, 10 000 × 1.5 × 365e-6 × e^-0.312 = 4.0076 (from memory of the manual's
    // rural two-lane sample problem). A factor-of-10 typo in AADT scale or intercept would give 0.40 or 40.
    expect(predictedCrashesPerYear(spfs.get("rural-two-lane-segment")!, "segment", 10000, 1.5 * 1.609344)).toBeCloseTo(4.0076, 2);
    // The published form itself, to five significant figures: an intercept rounded to -8.7035 misses it.
    const published = 10000 * 1.5 * 365e-6 * Math.exp(-0.312);
    expect(predictedCrashesPerYear(spfs.get("rural-two-lane-segment")!, "segment", 10000, 1.5 * 1.609344)).toBeCloseTo(published, 4);
  });
  it("urban four-leg signalised intersection matches exp(-10.99 + 1.07 ln 20 000 + 0.23 ln 6 000)", () => {
    // HSM chapter 12 coefficients (from memory), minor AADT 30 % of major as the catalogue assumes.
    const reference = Math.exp(-10.99 + 1.07 * Math.log(20000) + 0.23 * Math.log(6000));
    expect(predictedCrashesPerYear(spfs.get("urban-4sg-intersection")!, "intersection", 20000, undefined)).toBeCloseTo(reference, 3);
  });
  it("urban two-lane undivided segment matches exp(-15.22 + 1.68 ln 15 000 + ln 0.75 mi)", () => {
    const reference = Math.exp(-15.22 + 1.68 * Math.log(15000) + Math.log(0.75));
    expect(predictedCrashesPerYear(spfs.get("urban-2u-segment")!, "segment", 15000, 0.75 * 1.609344)).toBeCloseTo(reference, 3);
  });
});
