import { describe, expect, it } from "vitest";
import { naiveBeforeAfter } from "../../src/model/naiveBeforeAfter.js";

describe("naiveBeforeAfter (Hauer 1997, ch. 7)", () => {
  it("matches a hand computation with unequal periods", () => {
    // By hand: π_i = K (T_A/T_B): 12 × 2/3 = 8, 5 × 3/3 = 5, 20 × 2/5 = 8; Σ = 21.
    // Var(π_i) = K (T_A/T_B)²: 12 × 4/9 = 5.333333, 5, 20 × 0.16 = 3.2; Σ = 13.533333.
    // λ = 13; θ = (13/21) / (1 + 13.533333/441) = 0.619048 / 1.030688 = 0.600616; SE = 0.191160.
    const estimate = naiveBeforeAfter([
      { site: "A", beforeYears: 3, afterYears: 2, beforeObserved: 12, afterObserved: 4 },
      { site: "B", beforeYears: 3, afterYears: 3, beforeObserved: 5, afterObserved: 3 },
      { site: "C", beforeYears: 5, afterYears: 2, beforeObserved: 20, afterObserved: 6 },
    ])!;
    expect(estimate.expectedAfter).toBeCloseTo(21, 10);
    expect(estimate.expectedAfterVariance).toBeCloseTo(13.533333, 6);
    expect(estimate.theta).toBeCloseTo(0.600616, 6);
    expect(estimate.standardError).toBeCloseTo(0.19116, 5);
    expect(estimate.method).toBe("naive");
  });
  it("no sites, no crashes before or none after: null", () => {
    expect(naiveBeforeAfter([])).toBeNull();
    expect(naiveBeforeAfter([{ site: "A", beforeYears: 3, afterYears: 2, beforeObserved: 0, afterObserved: 4 }])).toBeNull();
    expect(naiveBeforeAfter([{ site: "A", beforeYears: 3, afterYears: 2, beforeObserved: 5, afterObserved: 0 }])).toBeNull();
  });
  it("refuses a period of no length", () => {
    expect(() => naiveBeforeAfter([{ site: "A", beforeYears: 0, afterYears: 2, beforeObserved: 5, afterObserved: 1 }])).toThrow(RangeError);
  });
});
