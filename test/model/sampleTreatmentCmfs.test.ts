import { describe, expect, it } from "vitest";
import { createPcg32 } from "../../src/model/random/pcg32.js";
import { assumedCmfCv, cmfSamplingRule, DEFAULT_ASSUMED_CMF_CV, drawnStandardError } from "../../src/model/sampleTreatmentCmfs.js";
import { sampleTreatmentCmfs } from "../analysis/uncertainty/referenceDraws.js";
import type { Effect, Scenario } from "../../src/model/types.js";
import { treatment } from "./fixtures.js";

const effect = (cmf: number, standardError?: number): Effect => ({
  crashTypes: ["angle"],
  severities: ["K", "A", "B", "C", "O"],
  cmf,
  ...(standardError !== undefined && { standardError }),
  source: "test",
});

describe("drawnStandardError", () => {
  it("uses the published standard error, else the assumed CV × CMF, else none", () => {
    expect(drawnStandardError(effect(0.7, 0.1), 0.2)).toBe(0.1);
    expect(drawnStandardError(effect(0.7), 0.2)).toBeCloseTo(0.14, 15);
    // A standard error of 0 is not a published one: the assumed CV applies.
    expect(drawnStandardError(effect(0.7, 0), 0.2)).toBeCloseTo(0.14, 15);
    expect(drawnStandardError(effect(0.7), "off")).toBe(0);
    expect(drawnStandardError(effect(0.7, 0.1), "off")).toBe(0.1);
  });

  it("takes the scenario's setting, 0.2 by default (common practice)", () => {
    expect(DEFAULT_ASSUMED_CMF_CV).toBe(0.2);
    expect(assumedCmfCv({} as Scenario)).toBe(0.2);
    expect(assumedCmfCv({ uncertainty: {} } as Scenario)).toBe(0.2);
    expect(assumedCmfCv({ uncertainty: { assumedCmfCv: "off" } } as Scenario)).toBe("off");
    expect(assumedCmfCv({ uncertainty: { assumedCmfCv: 0.35 } } as Scenario)).toBe(0.35);
    expect(cmfSamplingRule(0.2)).toContain("0.2 × CMF");
    expect(cmfSamplingRule("off")).toContain("held at their value");
  });
});

describe("sampleTreatmentCmfs with an assumed CV", () => {
  it("draws a CMF without a standard error from the lognormal with mean CMF and sd cv × CMF", () => {
    // Lognormal moments (Johnson, Kotz, Balakrishnan, vol. 1, ch. 14): mean exp(mu + s²/2), var (exp(s²) − 1)·mean²;
    // with sd = 0.2 × 0.7 = 0.14, variance 0.0196. Five standard errors of the sample mean and variance.
    const treatments = [treatment({ id: "t", effects: [effect(0.7)] })];
    const random = createPcg32(3n, 3n);
    const n = 100_000;
    let sum = 0;
    let sumSquares = 0;
    for (let i = 0; i < n; i += 1) {
      const cmf = sampleTreatmentCmfs(treatments, random, 0.2)[0]!.effects[0]!.cmf;
      sum += cmf;
      sumSquares += cmf * cmf;
    }
    const mean = sum / n;
    const variance = sumSquares / n - mean * mean;
    const s2 = Math.log(1 + 0.2 ** 2);
    const kurtosis = Math.exp(4 * s2) + 2 * Math.exp(3 * s2) + 3 * Math.exp(2 * s2) - 3;
    expect(Math.abs(mean - 0.7)).toBeLessThan(5 * Math.sqrt(0.0196 / n));
    expect(Math.abs(variance - 0.0196)).toBeLessThan(5 * 0.0196 * Math.sqrt((kurtosis - 1) / n));
  });

  it("holds such CMFs exact with 'off', leaving the treatment untouched, and the same source gives the same CMFs", () => {
    const treatments = [treatment({ id: "a", effects: [effect(0.7)] }), treatment({ id: "b", effects: [effect(0.8, 0.1), effect(0.9)] })];
    const off = sampleTreatmentCmfs(treatments, createPcg32(4n, 4n), "off");
    expect(off[0]).toBe(treatments[0]);
    expect(off[1]!.effects[1]!.cmf).toBe(0.9);
    expect(off[1]!.effects[0]!.cmf).not.toBe(0.8);
    const once = sampleTreatmentCmfs(treatments, createPcg32(4n, 4n), 0.2);
    const again = sampleTreatmentCmfs(treatments, createPcg32(4n, 4n), 0.2);
    expect(once).toEqual(again);
    expect(once[0]!.effects[0]!.cmf).not.toBe(0.7);
  });
});
