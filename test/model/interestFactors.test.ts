import { describe, expect, it } from "vitest";
import { singlePaymentPresentWorth } from "../../src/model/singlePaymentPresentWorth.js";
import { uniformSeriesPresentWorth } from "../../src/model/uniformSeriesPresentWorth.js";

// Each row: rate, years, P/F, P/A, decimals printed in the source table, source.
const TABLE = [
  // Newnan, Eschenbach & Lavelle, Engineering Economic Analysis, Appendix B, 1/4% compound interest factors.
  { rate: 0.0025, years: 10, pf: 0.9753, pa: 9.864, decimals: 3, source: "Newnan et al., Appendix B, 1/4% table" },
  { rate: 0.0025, years: 20, pf: 0.9513, pa: 19.4845, decimals: 4, source: "Table A-1, discrete cash flow compound interest factors, 0.25%" },
  // Discrete cash flow compound interest factor table A-1 (0.25%), printed to four decimals.
  { rate: 0.0025, years: 25, pf: 0.9395, pa: 24.2055, decimals: 4, source: "Table A-1, discrete cash flow compound interest factors, 0.25%" },
  // Standard interest tables at common public-works discount rates (from memory; four-decimal tables).
  { rate: 0.04, years: 20, pf: 0.4564, pa: 13.5903, decimals: 4, source: "4% table (from memory)" },
  { rate: 0.07, years: 10, pf: 0.5083, pa: 7.0236, decimals: 4, source: "7% table (from memory)" },
  { rate: 0.1, years: 5, pf: 0.6209, pa: 3.7908, decimals: 4, source: "10% table (from memory)" },
  { rate: 0.05, years: 10, pf: 0.6139, pa: 7.7217, decimals: 4, source: "5% table (from memory)" },
];

describe("interest factors against published compound interest tables", () => {
  it.each(TABLE)("(P/F, $rate, $years) and (P/A, $rate, $years) match $source", ({ rate, years, pf, pa, decimals }) => {
    expect(singlePaymentPresentWorth(rate, years)).toBeCloseTo(pf, 4);
    expect(uniformSeriesPresentWorth(rate, years)).toBeCloseTo(pa, decimals);
  });

  it("P/A at a zero rate is the number of years, and zero years is worth nothing", () => {
    expect(uniformSeriesPresentWorth(0, 12)).toBe(12);
    expect(uniformSeriesPresentWorth(0.05, 0)).toBe(0);
  });

  it("P/A is the sum of the year-by-year P/F factors (definition)", () => {
    let sum = 0;
    for (let year = 1; year <= 30; year++) sum += singlePaymentPresentWorth(0.035, year);
    expect(uniformSeriesPresentWorth(0.035, 30)).toBeCloseTo(sum, 10);
  });

  it("rejects a rate at or below -100%", () => {
    expect(() => uniformSeriesPresentWorth(-1, 5)).toThrow(RangeError);
    expect(() => singlePaymentPresentWorth(-1.5, 5)).toThrow(RangeError);
  });
});
