import { describe, expect, it } from "vitest";
import { summariseSelection } from "../../src/analysis/summariseSelection.js";
import { benefitCostRatio, byBcRatioDescending } from "../../src/model/benefitCostRatio.js";
import { evaluateAlternative } from "../../src/model/evaluateAlternative.js";
import { observedCrashesPerYear } from "../../src/model/observedCrashesPerYear.js";
import { totalsJson } from "../../src/report/totalsJson.js";
import { toCsv } from "../../src/report/toCsv.js";
import { ALL_SEVERITIES, HAND_ECONOMICS, handSite, treatment } from "./fixtures.js";

describe("B/C at zero cost is undefined, never 0", () => {
  it("is the plain ratio when there is a cost", () => {
    expect(benefitCostRatio(300, 100)).toBe(3);
    expect(benefitCostRatio(0, 100)).toBe(0);
  });

  it("an empty selection has no B/C: NaN, null in JSON, blank in CSV", () => {
    const totals = summariseSelection([]);
    expect(Number.isNaN(totals.bcRatio)).toBe(true);
    expect(totalsJson(totals).bcRatio).toBeNull();
    expect(toCsv(["bc"], [[totals.bcRatio]])).toBe("bc\r\n\r\n");
  });

  it("a zero-cost treatment that avoids crashes has an unbounded B/C, null in JSON", () => {
    const site = handSite();
    const free = treatment({ id: "free", cost: { basis: "per-site", amount: 0 }, serviceLifeYears: 5, effects: [{ crashTypes: ["pedestrian"], severities: ALL_SEVERITIES, cmf: 0.9, source: "test" }] });
    const alternative = evaluateAlternative(site, [free], observedCrashesPerYear(site.crashes, 5), HAND_ECONOMICS);
    expect(alternative.lifecycleCostPV).toBe(0);
    expect(alternative.bcRatio).toBe(Infinity);
    expect(totalsJson(summariseSelection([alternative])).bcRatio).toBeNull();
  });

  it("orders ratios highest first with undefined ones last", () => {
    expect([1, NaN, Infinity, 3].sort(byBcRatioDescending)).toEqual([Infinity, 3, 1, NaN]);
  });
});
