import { describe, expect, it } from "vitest";
import { comparePlans } from "../../src/analysis/comparePlans.js";
import { planProgramme } from "../../src/analysis/planProgramme.js";
import { syntheticPlan } from "./syntheticPlan.js";

describe("comparePlans", () => {
  it("finds entering, leaving and changed sites on a hand-built case", async () => {
    // At 10: A's cheap option (5 KSI) + B (4 KSI) = 9. At 20: A's dear option (12) + C (6) = 18 beats A dear + B (16).
    const prepared = syntheticPlan(
      [
        { id: "A", options: [{ cost: 5, ksi: 5, treatments: ["x"] }, { cost: 12, ksi: 12, treatments: ["x", "y"] }] },
        { id: "B", options: [{ cost: 5, ksi: 4 }] },
        { id: "C", options: [{ cost: 8, ksi: 6 }] },
      ],
      0,
    );
    const low = await planProgramme(prepared, 10);
    const high = await planProgramme(prepared, 20);
    const comparison = comparePlans(low, high);
    expect(comparison.entering.map((p) => p.site)).toEqual(["C"]);
    expect(comparison.leaving.map((p) => p.site)).toEqual(["B"]);
    expect(comparison.changed.map((c) => [c.site, c.before.treatments, c.after.treatments])).toEqual([["A", ["x"], ["x", "y"]]]);
    expect(comparison.delta.spend).toBe(20 - 10);
    expect(comparison.delta.ksiAvoided).toBe(18 - 9);
    expect(comparison.delta.projects).toBe(0);
  });
});
