import { describe, expect, it } from "vitest";
import { lifecycleCostPV, yearsInService } from "../../src/model/lifecycleCostPV.js";

// Single-payment present-worth factors from a 4% compound interest table (Newnan, Engineering
// Economic Analysis, 4% table; from memory): (P/F, 4%, 10) = 0.6756, (P/F, 4%, 15) = 0.5553,
// (P/F, 4%, 20) = 0.4564. (P/A, 4%, 20) = 13.5903.
describe("lifecycleCostPV under each renewal rule (capital 100 000, 4%, 20-year horizon)", () => {
  it("none: capital plus upkeep over the capped life", () => {
    expect(lifecycleCostPV(100_000, 1_000, 30, 0.04, 20, "none")).toBeCloseTo(100_000 + 1_000 * 13.5903, -1);
    expect(yearsInService(10, 20, "none")).toBe(10);
  });
  it("renew, life 10: one renewal at year 10, and nothing unexpired at the horizon", () => {
    expect(lifecycleCostPV(100_000, 0, 10, 0.04, 20, "renew")).toBeCloseTo(100_000 * (1 + 0.6756), -1);
    expect(yearsInService(10, 20, "renew")).toBe(20);
  });
  it("renew, life 15: renewal at year 15, its 10 unexpired years credited at straight-line value from year 20", () => {
    const expected = 100_000 * (1 + 0.5553) - 100_000 * (10 / 15) * 0.4564;
    expect(lifecycleCostPV(100_000, 0, 15, 0.04, 20, "renew")).toBeCloseTo(expected, -1);
  });
  it("residual-value, life 30: no renewal, 10 of 30 years' value credited at the horizon", () => {
    expect(lifecycleCostPV(100_000, 0, 30, 0.04, 20, "residual-value")).toBeCloseTo(100_000 - 100_000 * (10 / 30) * 0.4564, -1);
    // A life inside the horizon leaves nothing to credit.
    expect(lifecycleCostPV(100_000, 0, 10, 0.04, 20, "residual-value")).toBe(100_000);
  });
});
