import { describe, expect, it } from "vitest";
import { growingSeriesPresentWorth } from "../../src/model/growingSeriesPresentWorth.js";
import { uniformSeriesPresentWorth } from "../../src/model/uniformSeriesPresentWorth.js";

describe("growingSeriesPresentWorth", () => {
  it("with no growth it is the uniform-series factor: (P/A, 4%, 20) = 13.5903 (4% interest table, from memory)", () => {
    expect(growingSeriesPresentWorth(0.04, 1, 0, 20)).toBeCloseTo(13.5903, 4);
    expect(growingSeriesPresentWorth(0.04, 1, 5, 20)).toBeCloseTo(uniformSeriesPresentWorth(0.04, 20) - uniformSeriesPresentWorth(0.04, 5), 12);
  });
  it("matches the geometric-gradient formula P = A1 [1 − (1+g)^n (1+i)^−n] / (i − g) (Newnan, Engineering Economic Analysis, geometric gradient)", () => {
    const i = 0.04;
    const g = 0.02;
    const n = 20;
    const firstAmount = 1 + g; // the series pays (1+g)^t at the end of year t
    const textbook = (firstAmount * (1 - Math.pow(1 + g, n) * Math.pow(1 + i, -n))) / (i - g);
    expect(growingSeriesPresentWorth(i, 1 + g, 0, n)).toBeCloseTo(textbook, 10);
  });
  it("is the year-by-year sum, including spans that start later and growth equal to the rate", () => {
    for (const [i, growth, start, end] of [[0.04, 1.015, 3, 12], [0.07, 0.98, 0, 9], [0.03, 1.03, 2, 7], [0, 1.02, 0, 10]] as const) {
      let sum = 0;
      for (let t = start + 1; t <= end; t++) sum += Math.pow(growth, t) / Math.pow(1 + i, t);
      expect(growingSeriesPresentWorth(i, growth, start, end)).toBeCloseTo(sum, 10);
    }
  });
});
