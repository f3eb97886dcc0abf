import { describe, expect, it } from "vitest";
import { planProgramme } from "../../../src/analysis/planProgramme.js";
import { preparePlan } from "../../../src/analysis/preparePlan.js";
import { oneAtATimeSensitivity } from "../../../src/analysis/uncertainty/oneAtATimeSensitivity.js";
import { constructedScenario } from "./constructedScenario.js";

// Uniform-series present-worth factor (P/A, i, n) = (1 − (1 + i)^−n) / i (standard engineering-economics formula).
const presentWorth = (rate: number, years: number) => (1 - (1 + rate) ** -years) / rate;

describe("oneAtATimeSensitivity", () => {
  it("moves each parameter alone and reports the chosen list's KSI, B/C and whether the best list changes (hand-computed case)", async () => {
    // A and B each avoid 10 years × 4 KSI a year × 0.3 = 12 KSI; C avoids 8. Two can be funded: A + B.
    const scenario = constructedScenario(
      [
        { id: "A", fatalAndSerious: 20, cmf: 0.7, standardError: 0.1 },
        { id: "B", fatalAndSerious: 20, cmf: 0.7, standardError: 0 },
        { id: "C", fatalAndSerious: 20, cmf: 0.8, standardError: 0 },
      ],
      2,
    );
    const plan = await planProgramme(preparePlan(scenario));
    expect(plan.totals.ksiAvoided).toBeCloseTo(24, 9);
    const result = await oneAtATimeSensitivity(plan);
    expect(result.rows.map((row) => row.parameter)).toEqual([
      "CMF t-A (angle; KABCO)",
      "service lives",
      "unit crash costs",
      "discount rate",
    ]);
    const [cmf, lives, costs, discount] = result.rows;
    // CMF 0.7 ± 2 × 0.1: A avoids 10 × 4 × 0.5 = 20 or 10 × 4 × 0.1 = 4 KSI.
    expect(cmf!.low.ksiAvoidedChange).toBeCloseTo(8, 9);
    expect(cmf!.low.listChanges).toBe(false);
    expect(cmf!.high.ksiAvoidedChange).toBeCloseTo(-8, 9);
    expect(cmf!.high.listChanges).toBe(true);
    expect(cmf!.high.entering).toEqual(["C: t-C"]);
    expect(cmf!.high.leaving).toEqual(["A: t-A"]);
    // Lives 10 × 0.75 = 7.5 → 8 years (rounded); 12.5 → 13, capped by the 10-year horizon.
    expect(lives!.low.ksiAvoidedChange).toBeCloseTo(24 * 0.8 - 24, 9);
    expect(lives!.high.ksiAvoidedChange).toBeCloseTo(0, 9);
    // Money moves B/C but not KSI avoided, nor (objective KSI) the list.
    expect(costs!.low.ksiAvoidedChange).toBe(0);
    expect(costs!.high.bcRatio).toBeCloseTo(plan.totals.bcRatio * 1.25, 6);
    expect(discount!.low.ksiAvoidedChange).toBe(0);
    expect(discount!.low.listChanges).toBe(false);
    // Benefit a year: 2 sites × 0.3 × (4 A crashes × 600,000 + 2 O crashes × 10,000) = 1,452,000; cost 200.
    expect(discount!.low.bcRatio).toBeCloseTo((1_452_000 * presentWorth(0.02, 10)) / 200, 3);
    expect(discount!.high.bcRatio).toBeCloseTo((1_452_000 * presentWorth(0.07, 10)) / 200, 3);
  });
});
