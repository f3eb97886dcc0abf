import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { completeCrashMatrix, sumCrashMatrix } from "../../src/model/crashMatrix.js";
import { empiricalBayesCrashesPerYear } from "../../src/model/empiricalBayesCrashesPerYear.js";
import { empiricalBayesPosterior } from "../../src/model/empiricalBayesPosterior.js";
import { empiricalBayesEstimate, empiricalBayesWeight } from "../../src/model/empiricalBayesWeight.js";
import type { SafetyPerformanceFunction, Site } from "../../src/model/types.js";

describe("empiricalBayesPosterior", () => {
  it("is Gamma(1/k + n, 1/(kμ) + T): the hand-worked case of Hauer et al. (2002)", () => {
    // μ = 2 a year, k = 0.5, 16 crashes in 5 years: shape 2 + 16 = 18, rate 1 + 5 = 6.
    const posterior = empiricalBayesPosterior(2, 0.5, 16, 5);
    expect(posterior.shape).toBeCloseTo(18, 12);
    expect(posterior.rate).toBeCloseTo(6, 12);
    // Mean 3 a year = EB estimate 15 over the window (w = 1/6: 10/6 + 5/6 × 16 = 15).
    expect((5 * posterior.shape) / posterior.rate).toBeCloseTo(empiricalBayesEstimate(empiricalBayesWeight(0.5, 10), 10, 16), 12);
  });

  it("has the code's EB point estimate as its mean and Hauer's (1 − w)·E as its window variance, for any μ, k, n, T", () => {
    // Identities of the gamma–Poisson model (Hauer 1997, "Observational Before-After Studies in Road
    // Safety", ch. 7; Highway Safety Manual 2010, Part C, Appendix A): E{λ | n} = w·μ + (1 − w)·n/T with
    // w = 1/(1 + kμT); Var{λT | n} = (1 − w)·E{λT | n}.
    const spf = (k: number): SafetyPerformanceFunction => ({
      id: "p",
      appliesTo: ["intersection"],
      intercept: Math.log(1e-4),
      aadtExponent: 1,
      lengthExponent: 0,
      overdispersion: k,
      overdispersionPerKm: false,
      shares: completeCrashMatrix({ angle: { A: 0.2, O: 0.8 } }),
      source: "test",
    });
    let runs = 0;
    fc.assert(
      fc.property(
        fc.integer({ min: 1000, max: 80000 }),
        fc.double({ min: 0.01, max: 5, noNaN: true }),
        fc.integer({ min: 0, max: 60 }),
        fc.integer({ min: 0, max: 60 }),
        fc.integer({ min: 1, max: 10 }),
        (aadt, k, severe, other, years) => {
          const site: Site = {
            id: "S",
            name: "S",
            kind: "intersection",
            district: "D",
            tags: [],
            aadt,
            performanceFunction: "p",
            crashes: completeCrashMatrix({ angle: { A: severe, O: other } }),
            candidates: [],
            costOverrides: {},
          };
          const result = empiricalBayesCrashesPerYear(site, spf(k), years);
          const n = severe + other;
          const posterior = empiricalBayesPosterior(result.predictedPerYear, result.overdispersion, n, years);
          const mean = posterior.shape / posterior.rate;
          const w = empiricalBayesWeight(k, result.predictedPerYear * years);
          const relative = (a: number, b: number) => Math.abs(a - b) / Math.max(1e-12, Math.abs(b));
          expect(relative(mean, w * result.predictedPerYear + ((1 - w) * n) / years)).toBeLessThan(1e-10);
          // The code's EB crash matrix sums to the same per-year total.
          expect(relative(mean, sumCrashMatrix(result.expectedPerYear))).toBeLessThan(1e-10);
          expect(relative((years ** 2 * posterior.shape) / posterior.rate ** 2, (1 - w) * mean * years)).toBeLessThan(1e-10);
          runs += 1;
        },
      ),
      { seed: 12, numRuns: 300 },
    );
    expect(runs).toBe(300);
  });

  it("refuses a prior it cannot form", () => {
    expect(() => empiricalBayesPosterior(2, 0, 3, 5)).toThrow(RangeError);
    expect(() => empiricalBayesPosterior(0, 0.5, 3, 5)).toThrow(RangeError);
    expect(() => empiricalBayesPosterior(2, 0.5, -1, 5)).toThrow(RangeError);
    expect(() => empiricalBayesPosterior(2, 0.5, 3, 0)).toThrow(RangeError);
  });
});
