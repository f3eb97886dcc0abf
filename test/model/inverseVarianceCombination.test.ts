import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { inverseVarianceCombination } from "../../src/model/inverseVarianceCombination.js";

describe("inverseVarianceCombination (fixed-effect meta-analysis on ln CMF)", () => {
  it("matches a hand computation with three CMFs", () => {
    // By hand (common practice: Var(ln CMF) ≈ (SE/CMF)², weights 1/Var):
    //   0.80 ± 0.08: w = (0.8/0.08)² = 100, ln = −0.223144
    //   0.60 ± 0.12: w = (0.6/0.12)² = 25,  ln = −0.510826
    //   0.90 ± 0.15: w = (0.9/0.15)² = 36,  ln = −0.105361
    // Σw = 161; ln C = (−22.314355 − 12.770641 − 3.792979) / 161 = −0.241478; C = 0.785466;
    // SE(ln C) = 1/sqrt(161) = 0.078811; SE(C) = 0.785466 × 0.078811 = 0.061903.
    const pooled = inverseVarianceCombination([
      { cmf: 0.8, standardError: 0.08 },
      { cmf: 0.6, standardError: 0.12 },
      { cmf: 0.9, standardError: 0.15 },
    ]);
    expect(pooled.cmf).toBeCloseTo(0.785466, 6);
    expect(pooled.standardError).toBeCloseTo(0.061903, 6);
  });

  it("matches a hand computation with two CMFs", () => {
    // w = 100 and 25; ln C = (−22.314355 − 12.770641) / 125 = −0.280680; C = 0.755270; SE = 0.755270 / sqrt(125) = 0.067553.
    const pooled = inverseVarianceCombination([
      { cmf: 0.8, standardError: 0.08 },
      { cmf: 0.6, standardError: 0.12 },
    ]);
    expect(pooled.cmf).toBeCloseTo(0.75527, 6);
    expect(pooled.standardError).toBeCloseTo(0.067553, 6);
  });

  const evidence = fc.record({ cmf: fc.double({ min: 0.05, max: 3, noNaN: true }), standardError: fc.double({ min: 0.001, max: 1, noNaN: true }) });

  it("one estimate returns itself", () => {
    let runs = 0;
    fc.assert(
      fc.property(evidence, (one) => {
        const pooled = inverseVarianceCombination([one]);
        expect(pooled.cmf).toBeCloseTo(one.cmf, 12);
        expect(pooled.standardError).toBeCloseTo(one.standardError, 12);
        runs += 1;
      }),
      { seed: 41, numRuns: 200 },
    );
    expect(runs).toBe(200);
  });

  it("estimates of equal relative SE pool to their geometric mean, with relative SE divided by sqrt(n)", () => {
    let runs = 0;
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0.05, max: 3, noNaN: true }), { minLength: 1, maxLength: 8 }), fc.double({ min: 0.01, max: 0.5, noNaN: true }), (cmfs, relativeSe) => {
        const pooled = inverseVarianceCombination(cmfs.map((cmf) => ({ cmf, standardError: relativeSe * cmf })));
        const geometricMean = Math.exp(cmfs.reduce((sum, cmf) => sum + Math.log(cmf), 0) / cmfs.length);
        expect(pooled.cmf / geometricMean).toBeCloseTo(1, 10);
        expect(pooled.standardError / pooled.cmf).toBeCloseTo(relativeSe / Math.sqrt(cmfs.length), 10);
        runs += 1;
      }),
      { seed: 42, numRuns: 200 },
    );
    expect(runs).toBe(200);
  });

  it("the pooled relative SE is never larger than the smallest input's, and the CMF lies within the inputs' range", () => {
    let runs = 0;
    fc.assert(
      fc.property(fc.array(evidence, { minLength: 1, maxLength: 8 }), (list) => {
        const pooled = inverseVarianceCombination(list);
        const smallestRelative = Math.min(...list.map((e) => e.standardError / e.cmf));
        expect(pooled.standardError / pooled.cmf).toBeLessThanOrEqual(smallestRelative * (1 + 1e-12));
        expect(pooled.cmf).toBeGreaterThanOrEqual(Math.min(...list.map((e) => e.cmf)) * (1 - 1e-12));
        expect(pooled.cmf).toBeLessThanOrEqual(Math.max(...list.map((e) => e.cmf)) * (1 + 1e-12));
        runs += 1;
      }),
      { seed: 43, numRuns: 300 },
    );
    expect(runs).toBe(300);
  });

  it("refuses an empty list, a CMF ≤ 0 and an SE ≤ 0", () => {
    expect(() => inverseVarianceCombination([])).toThrow(RangeError);
    expect(() => inverseVarianceCombination([{ cmf: 0, standardError: 0.1 }])).toThrow(RangeError);
    expect(() => inverseVarianceCombination([{ cmf: -0.5, standardError: 0.1 }])).toThrow(RangeError);
    expect(() => inverseVarianceCombination([{ cmf: 0.8, standardError: 0 }])).toThrow(RangeError);
    expect(() => inverseVarianceCombination([{ cmf: 0.8, standardError: Number.NaN }])).toThrow(RangeError);
  });
});
