import { describe, expect, it } from "vitest";
import { createPcg32 } from "../../../src/model/random/pcg32.js";
import { samplePoisson } from "../../../src/model/random/samplePoisson.js";

const N = 200_000;

describe("samplePoisson (inversion by sequential search)", () => {
  // Poisson(μ): mean μ, variance μ, fourth central moment μ(1 + 3μ) (standard results). Tolerances are
  // 5 standard errors: sqrt(μ/N) for the mean, sqrt((μ4 − μ²)/N) for the variance. 75 takes the split path.
  for (const mean of [0.3, 4, 29, 75]) {
    it(`Poisson(${mean}) has mean and variance ${mean}`, () => {
      const random = createPcg32(BigInt(Math.round(mean * 10)), 5n);
      let sum = 0;
      let sumSquares = 0;
      let notCounts = 0;
      for (let i = 0; i < N; i += 1) {
        const x = samplePoisson(random, mean);
        if (!Number.isInteger(x) || x < 0) notCounts += 1;
        sum += x;
        sumSquares += x * x;
      }
      expect(notCounts).toBe(0);
      const sampleMean = sum / N;
      const sampleVariance = (sumSquares - N * sampleMean ** 2) / (N - 1);
      expect(Math.abs(sampleMean - mean)).toBeLessThan(5 * Math.sqrt(mean / N));
      expect(Math.abs(sampleVariance - mean)).toBeLessThan(5 * Math.sqrt((mean * (1 + 3 * mean) - mean ** 2) / N));
    });
  }

  it("P(0) matches exp(−μ) for μ = 1 (0.367879)", () => {
    const random = createPcg32(99n, 1n);
    let zeros = 0;
    for (let i = 0; i < N; i += 1) if (samplePoisson(random, 1) === 0) zeros += 1;
    const p = Math.exp(-1);
    expect(Math.abs(zeros / N - p)).toBeLessThan(5 * Math.sqrt((p * (1 - p)) / N));
  });

  it("a mean of 0 always gives 0, and a negative or infinite mean is refused", () => {
    const random = createPcg32(1n, 1n);
    expect(samplePoisson(random, 0)).toBe(0);
    expect(() => samplePoisson(random, -1)).toThrow(RangeError);
    expect(() => samplePoisson(random, Number.POSITIVE_INFINITY)).toThrow(RangeError);
  });
});
