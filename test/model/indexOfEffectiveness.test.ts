import { describe, expect, it } from "vitest";
import { indexOfEffectiveness } from "../../src/model/indexOfEffectiveness.js";

describe("indexOfEffectiveness (Hauer 1997, ch. 4; HSM 2010 Part B, Appendix 9A eq. 9A.1-8)", () => {
  it("matches a hand computation: λ = 40, π̂ = 50, Var(π̂) = 25", () => {
    // By hand: Var(π̂)/π̂² = 25 / 2500 = 0.01; θ = (40/50) / 1.01 = 0.792079;
    // Var(θ) = 0.792079² × (1/40 + 0.01) / 1.01² = 0.627389 × 0.035 / 1.0201 = 0.021526;
    // SE = 0.146717; interval 0.792079 ∓ 1.96 × 0.146717 = 0.504513 … 1.079645; change −20.79 %.
    const estimate = indexOfEffectiveness("naive", 3, 40, 50, 25)!;
    expect(estimate.theta).toBeCloseTo(0.792079, 6);
    expect(estimate.standardError).toBeCloseTo(0.146717, 6);
    expect(estimate.lower95).toBeCloseTo(0.504513, 6);
    expect(estimate.upper95).toBeCloseTo(1.079645, 6);
    expect(estimate.percentChange).toBeCloseTo(-20.792079, 5);
    expect(estimate).toMatchObject({ method: "naive", sites: 3, observedAfter: 40, expectedAfter: 50, expectedAfterVariance: 25 });
  });

  it("with an exactly known π̂ (variance 0) is λ/π̂ with Poisson SE θ/sqrt(λ)", () => {
    // Hauer 1997 ch. 4: with Var(π̂) = 0, Var(θ) = θ²/λ. 25 after, 100 expected: θ = 0.25, SE = 0.05.
    const estimate = indexOfEffectiveness("empirical-bayes", 1, 25, 100, 0)!;
    expect(estimate.theta).toBeCloseTo(0.25, 12);
    expect(estimate.standardError).toBeCloseTo(0.05, 12);
  });

  it("clips the lower end of the interval at 0", () => {
    // λ = 1, π̂ = 2, Var 0: θ = 0.5, SE = 0.5, θ − 1.96 SE = −0.48 → 0.
    const estimate = indexOfEffectiveness("naive", 1, 1, 2, 0)!;
    expect(estimate.lower95).toBe(0);
    expect(estimate.upper95).toBeCloseTo(0.5 + 1.96 * 0.5, 12);
  });

  it("gives no estimate when nothing was observed after (λ = 0) or nothing was expected (π̂ = 0)", () => {
    expect(indexOfEffectiveness("naive", 2, 0, 10, 4)).toBeNull();
    expect(indexOfEffectiveness("naive", 2, 5, 0, 0)).toBeNull();
  });

  it("refuses negative or non-finite inputs", () => {
    expect(() => indexOfEffectiveness("naive", 1, -1, 10, 1)).toThrow(RangeError);
    expect(() => indexOfEffectiveness("naive", 1, 1, Number.NaN, 1)).toThrow(RangeError);
    expect(() => indexOfEffectiveness("naive", 1, 1, 10, Number.POSITIVE_INFINITY)).toThrow(RangeError);
  });
});
