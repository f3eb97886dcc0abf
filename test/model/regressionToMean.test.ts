import { describe, expect, it } from "vitest";
import { completeCrashMatrix, sumCrashMatrix } from "../../src/model/crashMatrix.js";
import { empiricalBayesCrashesPerYear } from "../../src/model/empiricalBayesCrashesPerYear.js";
import { createPcg32, type RandomSource } from "../../src/model/random/pcg32.js";
import { sampleGamma } from "../../src/model/random/sampleGamma.js";
import type { SafetyPerformanceFunction, Site } from "../../src/model/types.js";

/** Poisson variate by counting unit-rate exponential arrivals (Knuth, TAOCP vol. 2, §3.4.1; fine for small means). */
function samplePoisson(random: RandomSource, mean: number): number {
  let count = 0;
  let time = -Math.log(1 - random.nextUnitFloat());
  while (time < mean) {
    count++;
    time -= Math.log(1 - random.nextUnitFloat());
  }
  return count;
}

// A simulation of the selection effect described by Hauer (1997, Observational Before-After
// Studies in Road Safety, ch. 5): sites' true rates vary as Gamma around the SPF prediction
// (negative binomial with overdispersion k), the sites with the highest counts in a 5-year window
// are flagged, and their next 5 years are compared with each baseline's forecast.
describe("regression to the mean on sites flagged for high counts (seeded Poisson–gamma simulation)", () => {
  const k = 0.4;
  const spf: SafetyPerformanceFunction = {
    id: "sim",
    appliesTo: ["intersection"],
    intercept: Math.log(2 / 10_000), // 2 crashes a year at AADT 10 000
    aadtExponent: 1,
    lengthExponent: 0,
    overdispersion: k,
    overdispersionPerKm: false,
    shares: completeCrashMatrix({ angle: { A: 0.1, O: 0.9 } }),
    source: "simulation",
  };
  const years = 5;
  const random = createPcg32(20261203n, 7n);
  const sites = Array.from({ length: 4000 }, (_, i) => {
    const mean = 2;
    const trueRate = sampleGamma(random, 1 / k, 1 / (k * mean));
    const before = samplePoisson(random, trueRate * years);
    const after = samplePoisson(random, trueRate * years);
    const site: Site = { id: `S${i}`, name: "", kind: "intersection", district: "D", tags: [], aadt: 10_000, crashes: completeCrashMatrix({ angle: { O: before } }), candidates: ["t"], costOverrides: {} };
    return { site, before, after };
  });
  const flagged = [...sites].sort((a, b) => b.before - a.before).slice(0, 400);
  const nextPeriod = flagged.reduce((total, s) => total + s.after, 0);
  const observedForecast = flagged.reduce((total, s) => total + s.before, 0);
  const ebForecast = flagged.reduce((total, s) => total + sumCrashMatrix(empiricalBayesCrashesPerYear(s.site, spf, years).expectedPerYear) * years, 0);
  // Standard error of the next-period total: Poisson variation of the 400 sites' counts around their forecast.
  const standardError = Math.sqrt(nextPeriod);

  it("the observed baseline overstates the flagged sites' next period by far more than chance", () => {
    expect(observedForecast - nextPeriod).toBeGreaterThan(5 * standardError);
  });
  it("the Empirical Bayes baseline forecasts it within about two standard errors", () => {
    expect(Math.abs(ebForecast - nextPeriod)).toBeLessThan(2.5 * standardError);
    expect(flagged).toHaveLength(400);
  });
});
