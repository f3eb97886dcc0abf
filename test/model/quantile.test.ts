import { describe, expect, it } from "vitest";
import { quantileSorted } from "../../src/model/quantile.js";

describe("quantileSorted (Hyndman–Fan type 7)", () => {
  it("matches NumPy's default percentile", () => {
    // numpy 2.4.6: np.percentile(np.arange(1, 11), [5, 50, 95]) -> [1.45, 5.5, 9.55]
    const oneToTen = Array.from({ length: 10 }, (_, i) => i + 1);
    expect(quantileSorted(oneToTen, 0.05)).toBeCloseTo(1.45, 12);
    expect(quantileSorted(oneToTen, 0.5)).toBeCloseTo(5.5, 12);
    expect(quantileSorted(oneToTen, 0.95)).toBeCloseTo(9.55, 12);
    // numpy 2.4.6: np.percentile([3.1, 0.2, 7.7, 5.0, 5.0, 9.9, -1.5, 2.25, 6.0], [5, 50, 95]) -> [-0.82, 5.0, 9.02]
    const sorted = [3.1, 0.2, 7.7, 5.0, 5.0, 9.9, -1.5, 2.25, 6.0].sort((a, b) => a - b);
    expect(quantileSorted(sorted, 0.05)).toBeCloseTo(-0.82, 12);
    expect(quantileSorted(sorted, 0.5)).toBeCloseTo(5.0, 12);
    expect(quantileSorted(sorted, 0.95)).toBeCloseTo(9.02, 12);
  });

  it("rejects no values and levels outside [0, 1]", () => {
    expect(() => quantileSorted([], 0.5)).toThrow(RangeError);
    expect(() => quantileSorted([1], 1.5)).toThrow(RangeError);
  });
});
