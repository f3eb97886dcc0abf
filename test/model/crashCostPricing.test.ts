import { describe, expect, it } from "vitest";
import { combinedKsiUnitCost } from "../../src/model/combinedKsiUnitCost.js";
import { escalationFactorFromIndex, escalationFactorFromRate } from "../../src/model/escalationFactor.js";
import { resolveCrashCosts } from "../../src/model/resolveCrashCosts.js";
import { handSite } from "./fixtures.js";

const STATED = { K: 11_295_400, A: 655_000, B: 198_500, C: 125_600, O: 11_900 };

describe("escalation factors", () => {
  it("at an annual rate: (F/P, 3%, 10) = 1.3439 and (F/P, 4%, 20) = 2.1911 (compound interest tables, from memory)", () => {
    expect(escalationFactorFromRate(0.03, 2016, 2026)).toBeCloseTo(1.3439, 4);
    expect(escalationFactorFromRate(0.04, 2005, 2025)).toBeCloseTo(2.1911, 4);
    expect(escalationFactorFromRate(0.03, 2026, 2016)).toBeCloseTo(1 / 1.3439, 4);
  });
  it("by a price index: the ratio of the two years' index values (common practice)", () => {
    expect(escalationFactorFromIndex(240, 300)).toBe(1.25);
  });
});

describe("combined K+A unit cost", () => {
  it("is the K:A-weighted average of the K and A unit costs (common practice)", () => {
    expect(combinedKsiUnitCost(11_295_400, 655_000, 0.1)).toBeCloseTo(1_719_040, 6);
    expect(combinedKsiUnitCost(10, 2, 0)).toBe(2);
    expect(combinedKsiUnitCost(10, 2, 1)).toBe(10);
  });
  it("weights by the sites' own observed K and A crashes unless a share or a unit cost is given", () => {
    // handSite: 1 K and 4 A crashes, so the fatal share is 0.2.
    const costs = resolveCrashCosts({ perCrash: STATED, source: "t" }, undefined, [handSite()]);
    expect(costs.ksiCosting).toMatchObject({ method: "combined", fatalShare: 0.2 });
    expect(costs.perCrash.K).toBeCloseTo(0.2 * STATED.K + 0.8 * STATED.A, 6);
    expect(costs.perCrash.A).toBe(costs.perCrash.K);
    expect(costs.perCrash.B).toBe(STATED.B);
    const given = resolveCrashCosts({ perCrash: STATED, source: "t", ksiCosting: { method: "combined", unitCost: 1_500_000 } }, undefined, [handSite()]);
    expect(given.perCrash.K).toBe(1_500_000);
    const bySeverity = resolveCrashCosts({ perCrash: STATED, source: "t", ksiCosting: { method: "by-severity" } }, undefined, [handSite()]);
    expect(bySeverity.perCrash).toEqual(STATED);
  });
  it("escalates every unit cost, the combined one included, by the same factor", () => {
    const costs = resolveCrashCosts(
      { perCrash: STATED, source: "t", priceYear: 2016, escalation: { annualRate: 0.03 }, ksiCosting: { method: "by-severity" } },
      2026,
      [],
    );
    expect(costs.escalationFactor).toBeCloseTo(1.3439, 4);
    expect(costs.perCrash.O).toBeCloseTo(STATED.O * 1.343916, 0);
    expect(costs.statedPerCrash).toEqual(STATED);
    expect(costs.escalation).toMatch(/2016 to 2026/);
  });
});
