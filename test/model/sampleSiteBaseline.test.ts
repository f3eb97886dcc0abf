import { describe, expect, it } from "vitest";
import { completeCrashMatrix, sumCrashMatrix } from "../../src/model/crashMatrix.js";
import { empiricalBayesCrashesPerYear } from "../../src/model/empiricalBayesCrashesPerYear.js";
import { observedCrashesPerYear } from "../../src/model/observedCrashesPerYear.js";
import { createPcg32 } from "../../src/model/random/pcg32.js";
import { sampleSiteBaseline } from "../../src/model/sampleSiteBaseline.js";
import type { SiteBaseline } from "../../src/model/siteBaselines.js";
import { CRASH_TYPES, type CrashMatrix, type SafetyPerformanceFunction, type Site } from "../../src/model/types.js";

const YEARS = 5;
const N = 40_000;

const site = (crashes: Parameters<typeof completeCrashMatrix>[0], over: Partial<Site> = {}): Site => ({
  id: "X",
  name: "X",
  kind: "intersection",
  district: "D",
  tags: [],
  crashes: completeCrashMatrix(crashes),
  candidates: [],
  costOverrides: {},
  ...over,
});

const observed = (at: Site): SiteBaseline => ({ site: at.id, expectedPerYear: observedCrashesPerYear(at.crashes, YEARS), method: "observed" });

/** Mean and variance over N draws of `pick(drawn matrix)`, and a check run on every draw. */
function drawMoments(draw: () => CrashMatrix, pick: (m: CrashMatrix) => number, check: (m: CrashMatrix) => void = () => {}): { mean: number; variance: number } {
  let sum = 0;
  let sumSquares = 0;
  for (let i = 0; i < N; i += 1) {
    const drawn = draw();
    check(drawn);
    const x = pick(drawn);
    sum += x;
    sumSquares += x * x;
  }
  const mean = sum / N;
  return { mean, variance: sumSquares / N - mean * mean };
}

// Five standard errors of the sample mean and variance of a Gamma(shape, rate) sample: var/N and
// (kurtosis − 1)·var²/N with kurtosis 3 + 6/shape (standard large-sample results).
function expectGammaMoments(observed: { mean: number; variance: number }, shape: number, rate: number): void {
  const variance = shape / rate ** 2;
  expect(Math.abs(observed.mean - shape / rate)).toBeLessThan(5 * Math.sqrt(variance / N));
  expect(Math.abs(observed.variance - variance)).toBeLessThan(5 * variance * Math.sqrt((2 + 6 / shape) / N));
}

describe("sampleSiteBaseline: observed baselines under the Jeffreys prior", () => {
  // Jeffreys prior for a Poisson rate ∝ rate^(−1/2); with n crashes in T years the posterior is
  // Gamma(n + 1/2, T) (Jeffreys, Theory of Probability; Gelman et al., Bayesian Data Analysis, 3rd ed., from memory).
  it("draws a severity with n crashes from Gamma(n + 1/2, T), keeping its crash-type mix", () => {
    const at = site({ pedestrian: { A: 3 }, angle: { A: 1, O: 12 } });
    const random = createPcg32(5n, 5n);
    let mixBroken = 0;
    const moments = drawMoments(
      () => sampleSiteBaseline(observed(at), at, YEARS, random).expectedPerYear,
      (m) => m.pedestrian.A + m.angle.A,
      (m) => {
        if (Math.abs(m.pedestrian.A - 3 * m.angle.A) > 1e-12) mixBroken += 1;
      },
    );
    // n = 4 serious crashes in 5 years: Gamma(4.5, 5), mean 0.9 (the plan's observed rate is 0.8).
    expectGammaMoments(moments, 4.5, 5);
    expect(mixBroken).toBe(0);
  });

  it("gives a severity with no crashes a proper posterior, Gamma(1/2, T), mean 1/(2T) > 0, spread by the site's K+A crash-type mix", () => {
    const at = site({ pedestrian: { A: 3 }, angle: { A: 1, O: 12 } });
    const random = createPcg32(6n, 6n);
    let outsideMix = 0;
    let mixBroken = 0;
    const moments = drawMoments(
      () => sampleSiteBaseline(observed(at), at, YEARS, random).expectedPerYear,
      (m) => sumCrashMatrix(m, ["K"]),
      (m) => {
        // K+A crashes here are 3 pedestrian, 1 angle: the drawn K rate splits 3 : 1 and nowhere else.
        if (Math.abs(m.pedestrian.K - 3 * m.angle.K) > 1e-12) mixBroken += 1;
        if (CRASH_TYPES.some((type) => type !== "pedestrian" && type !== "angle" && m[type].K !== 0)) outsideMix += 1;
      },
    );
    expectGammaMoments(moments, 0.5, 5);
    expect(moments.mean).toBeGreaterThan(0);
    expect(mixBroken).toBe(0);
    expect(outsideMix).toBe(0);
  });

  it("spreads a zero-count severity by the site's B+C+O mix, by all its crashes when its group has none, and evenly when it has no crashes", () => {
    const random = createPcg32(7n, 7n);
    // B has no crashes; the other non-KSI crashes are 12 angle O: B lands on angle only.
    const mixed = site({ pedestrian: { A: 3 }, angle: { A: 1, O: 12 } });
    const b = sampleSiteBaseline(observed(mixed), mixed, YEARS, random).expectedPerYear;
    expect(b.angle.B).toBeGreaterThan(0);
    expect(sumCrashMatrix(b, ["B"])).toBeCloseTo(b.angle.B, 15);
    // No K+A crashes: K follows all its crashes, 2 rear-end : 1 angle.
    const noSevere = site({ "rear-end": { O: 8, C: 2 }, angle: { O: 5 } });
    const k = sampleSiteBaseline(observed(noSevere), noSevere, YEARS, random).expectedPerYear;
    expect(k["rear-end"].K).toBeCloseTo(2 * k.angle.K, 12);
    expect(sumCrashMatrix(k, ["K"])).toBeCloseTo(k["rear-end"].K + k.angle.K, 15);
    // No crashes at all: each severity's Gamma(1/2, T) rate is spread evenly over the crash types.
    const empty = site({});
    const random2 = createPcg32(8n, 8n);
    let uneven = 0;
    const moments = drawMoments(
      () => sampleSiteBaseline(observed(empty), empty, YEARS, random2).expectedPerYear,
      (m) => sumCrashMatrix(m, ["A"]),
      (m) => {
        if (CRASH_TYPES.some((type) => Math.abs(m[type].A - m.pedestrian.A) > 1e-15)) uneven += 1;
      },
    );
    expectGammaMoments(moments, 0.5, 5);
    expect(uneven).toBe(0);
  });
});

describe("sampleSiteBaseline: Empirical Bayes baselines from their gamma posterior", () => {
  // SPF N = 1e-4 × AADT (2 a year at AADT 20 000), k = 0.5; 16 crashes observed in 5 years.
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
  const at = site({ pedestrian: { A: 4 }, "rear-end": { O: 12 } }, { aadt: 20000, performanceFunction: "hand" });
  const estimate = empiricalBayesCrashesPerYear(at, spf, YEARS).expectedPerYear;
  const baseline: SiteBaseline = { site: "X", expectedPerYear: estimate, method: "empirical-bayes" };

  it("averages to the EB estimate within its standard error, with Hauer's variance (1 − w)·E, scaling every cell alike", () => {
    // w = 1/(1 + 0.5 × 10) = 1/6; E = 15 over the window, 3 a year (Hauer et al. 2002, TRR 1784; worked in test/model/empiricalBayes.test.ts).
    // Hauer 1997, ch. 7: Var = (1 − w)·E = 12.5 over the window, 0.5 a year² — i.e. Gamma(18, 6).
    expect(sumCrashMatrix(estimate)).toBeCloseTo(3, 12);
    const random = createPcg32(9n, 9n);
    let shapeBroken = 0;
    expect(sampleSiteBaseline(baseline, at, YEARS, random, spf).sampled).toBe(true);
    const moments = drawMoments(
      () => sampleSiteBaseline(baseline, at, YEARS, random, spf).expectedPerYear,
      (m) => sumCrashMatrix(m),
      (m) => {
        const scale = sumCrashMatrix(m) / 3;
        if (CRASH_TYPES.some((type) => Math.abs(m[type].A - estimate[type].A * scale) > 1e-12 || Math.abs(m[type].O - estimate[type].O * scale) > 1e-12)) shapeBroken += 1;
      },
    );
    expect(Math.abs(moments.mean - 3)).toBeLessThan(5 * Math.sqrt(0.5 / N));
    expectGammaMoments(moments, 18, 6);
    expect(shapeBroken).toBe(0);
  });

  it("needs the site's performance function, and holds a method without a posterior at its point estimate", () => {
    expect(() => sampleSiteBaseline(baseline, at, YEARS, createPcg32(1n, 1n))).toThrow(RangeError);
    const other = { ...baseline, method: "no-posterior" as SiteBaseline["method"] };
    const drawn = sampleSiteBaseline(other, at, YEARS, createPcg32(1n, 1n), spf);
    expect(drawn.sampled).toBe(false);
    expect(drawn.expectedPerYear).toBe(estimate);
  });
});
