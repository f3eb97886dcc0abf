import { describe, expect, it } from "vitest";
import { completeCrashMatrix } from "../../src/model/crashMatrix.js";
import { createPcg32 } from "../../src/model/random/pcg32.js";
import { sampleSiteBaseline } from "../../src/model/sampleSiteBaseline.js";
import { observedCrashesPerYear } from "../../src/model/observedCrashesPerYear.js";
import type { Site } from "../../src/model/types.js";

const site: Site = {
  id: "X",
  name: "X",
  kind: "intersection",
  district: "D",
  tags: [],
  crashes: completeCrashMatrix({ pedestrian: { A: 3 }, angle: { A: 1, O: 12 } }),
  candidates: [],
  costOverrides: {},
};

describe("sampleSiteBaseline", () => {
  it("draws each severity's rate from Gamma(n, T): mean n/T, variance n/T², keeping the crash-type mix", () => {
    const years = 5;
    const random = createPcg32(5n, 5n);
    const n = 40_000;
    let sum = 0;
    let sumSquares = 0;
    let mixBroken = 0;
    let fatalDrawn = 0;
    for (let i = 0; i < n; i += 1) {
      const drawn = sampleSiteBaseline({ site: "X", expectedPerYear: observedCrashesPerYear(site.crashes, years), method: "observed" }, site, years, random).expectedPerYear;
      const serious = drawn.pedestrian.A + drawn.angle.A;
      if (Math.abs(drawn.pedestrian.A - 3 * drawn.angle.A) > 1e-12) mixBroken += 1;
      if (drawn.pedestrian.K !== 0 || drawn.angle.K !== 0) fatalDrawn += 1;
      sum += serious;
      sumSquares += serious * serious;
    }
    const mean = sum / n;
    const variance = sumSquares / n - mean * mean;
    // Gamma(4, 5): mean 0.8, variance 0.16 (shape/rate, shape/rate²); 5 standard errors.
    expect(Math.abs(mean - 0.8)).toBeLessThan(5 * Math.sqrt(0.16 / n));
    expect(Math.abs(variance - 0.16)).toBeLessThan(5 * 0.16 * Math.sqrt((3 + 6 / 4 - 1) / n));
    expect(mixBroken).toBe(0);
    expect(fatalDrawn).toBe(0);
  });

  it("holds a baseline of another method at its point estimate", () => {
    const expectedPerYear = observedCrashesPerYear(site.crashes, 5);
    const drawn = sampleSiteBaseline({ site: "X", expectedPerYear, method: "empirical-bayes" }, site, 5, createPcg32(1n, 1n));
    expect(drawn.sampled).toBe(false);
    expect(drawn.expectedPerYear).toBe(expectedPerYear);
  });
});
