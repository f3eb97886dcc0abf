import { describe, expect, it } from "vitest";
import { completeCrashMatrix } from "../../src/model/crashMatrix.js";
import { estimateCalibrationFactor } from "../../src/model/estimateCalibrationFactor.js";
import { predictedCrashesPerYear } from "../../src/model/predictedCrashesPerYear.js";
import type { SafetyPerformanceFunction, Site } from "../../src/model/types.js";

const spf: SafetyPerformanceFunction = {
  id: "hand",
  appliesTo: ["intersection"],
  intercept: Math.log(1e-4),
  aadtExponent: 1,
  lengthExponent: 0,
  overdispersion: 0.5,
  overdispersionPerKm: false,
  calibrationFactor: 3, // ignored by the estimate, which starts from the uncalibrated SPF
  shares: completeCrashMatrix({ angle: { O: 1 } }),
  source: "test",
};
const site = (id: string, aadt: number, crashes: number): Site => ({
  id,
  name: id,
  kind: "intersection",
  district: "D",
  tags: [],
  aadt,
  crashes: completeCrashMatrix({ angle: { O: crashes } }),
  candidates: [],
  costOverrides: {},
});

describe("estimateCalibrationFactor (Highway Safety Manual 2010, Part C, Appendix A.1.1: C = Σ observed ÷ Σ predicted)", () => {
  it("divides the observed total by the uncalibrated prediction over the same sites and years", () => {
    // Predicted a year: 1 and 3 crashes (AADT 10 000 and 30 000); over 3 years: 12. Observed 6 + 12 = 18 → C = 1.5.
    const estimate = estimateCalibrationFactor(spf, [site("a", 10_000, 6), site("b", 30_000, 12)], 3)!;
    expect(estimate.factor).toBeCloseTo(1.5, 12);
    expect(estimate).toMatchObject({ sites: 2, observedCrashes: 18 });
    expect(estimate.predictedCrashes).toBeCloseTo(12, 10);
  });
  it("calibrated predictions are the SPF's times C", () => {
    expect(predictedCrashesPerYear(spf, "intersection", 10_000, undefined)).toBeCloseTo(3, 12);
    expect(predictedCrashesPerYear({ ...spf, calibrationFactor: undefined }, "intersection", 10_000, undefined)).toBeCloseTo(1, 12);
  });
  it("has no estimate without sites", () => {
    expect(estimateCalibrationFactor(spf, [], 3)).toBeUndefined();
  });
});
