import { describe, expect, it } from "vitest";
import { lognormalFromMeanSd, sampleLognormal } from "../../../src/model/random/lognormalFromMeanSd.js";
import { createPcg32 } from "../../../src/model/random/pcg32.js";
import { sampleGamma } from "../../../src/model/random/sampleGamma.js";
import { sampleStandardNormal } from "../../../src/model/random/sampleStandardNormal.js";

const N = 200_000;

function moments(sample: () => number): { mean: number; variance: number } {
  let sum = 0;
  let sumSquares = 0;
  for (let i = 0; i < N; i += 1) {
    const x = sample();
    sum += x;
    sumSquares += x * x;
  }
  const mean = sum / N;
  return { mean, variance: (sumSquares - N * mean * mean) / (N - 1) };
}

// Tolerances are 5 standard errors of the sample statistic: sqrt(var / N) for the mean and
// sqrt((mu4 − var²) / N) for the variance, mu4 = kurtosis × var² (standard large-sample results,
// e.g. Kendall's Advanced Theory of Statistics vol. 1, sampling moments).
function expectMoments(observed: { mean: number; variance: number }, mean: number, variance: number, kurtosis: number): void {
  expect(Math.abs(observed.mean - mean)).toBeLessThan(5 * Math.sqrt(variance / N));
  expect(Math.abs(observed.variance - variance)).toBeLessThan(5 * Math.sqrt(((kurtosis - 1) * variance * variance) / N));
}

describe("sampleStandardNormal (Box–Muller)", () => {
  it("has mean 0, variance 1 (normal kurtosis 3)", () => {
    const random = createPcg32(11n, 1n);
    expectMoments(moments(() => sampleStandardNormal(random)), 0, 1, 3);
  });
});

describe("sampleGamma (Marsaglia–Tsang)", () => {
  // Gamma(k, rate): mean k/rate, variance k/rate², kurtosis 3 + 6/k (standard results).
  for (const [shape, rate] of [[0.5, 1], [1.5, 5], [3, 5], [40.5, 5]] as const) {
    it(`Gamma(${shape}, ${rate}) has mean ${shape}/${rate} and variance ${shape}/${rate}²`, () => {
      const random = createPcg32(BigInt(Math.round(shape * 10)), 2n);
      expectMoments(moments(() => sampleGamma(random, shape, rate)), shape / rate, shape / rate ** 2, 3 + 6 / shape);
    });
  }

  it("rejects a non-positive shape", () => {
    expect(() => sampleGamma(createPcg32(1n, 1n), 0, 1)).toThrow(RangeError);
  });
});

describe("lognormalFromMeanSd", () => {
  // CMF / SE pairs from the demo catalogue's published values (the roundabout studies it cites; HSM Part D).
  for (const [cmf, se] of [[0.473, 0.113], [1.132, 0.479], [0.33, 0.06], [2.43, 0.4], [0.65, 0.09]] as const) {
    it(`keeps the CMF ${cmf} as the mean and ${se} as the standard deviation`, () => {
      const parameters = lognormalFromMeanSd(cmf, se);
      // Analytic: exp(mu + sigma²/2) = cmf exactly.
      expect(Math.exp(parameters.mu + parameters.sigma ** 2 / 2)).toBeCloseTo(cmf, 12);
      const s2 = parameters.sigma ** 2;
      // Lognormal kurtosis exp(4s²) + 2 exp(3s²) + 3 exp(2s²) − 3 (Johnson, Kotz, Balakrishnan ch. 14).
      const kurtosis = Math.exp(4 * s2) + 2 * Math.exp(3 * s2) + 3 * Math.exp(2 * s2) - 3;
      const random = createPcg32(BigInt(Math.round(cmf * 1000)), 9n);
      expectMoments(moments(() => sampleLognormal(random, parameters)), cmf, se * se, kurtosis);
    });
  }

  it("has zero spread when the standard error is zero", () => {
    const parameters = lognormalFromMeanSd(0.8, 0);
    expect(parameters.sigma).toBe(0);
    expect(sampleLognormal(createPcg32(1n, 1n), parameters)).toBeCloseTo(0.8, 14);
  });
});
