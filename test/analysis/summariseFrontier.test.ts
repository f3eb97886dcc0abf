import { describe, expect, it } from "vitest";
import type { FrontierLevel } from "../../src/analysis/budgetFrontier.js";
import { planProgramme } from "../../src/analysis/planProgramme.js";
import { summariseFrontier } from "../../src/analysis/summariseFrontier.js";
import { syntheticPlan } from "./syntheticPlan.js";

// Three independent sites, one option each, chosen so each 1M step buys exactly one site (hand-computed).
const prepared = syntheticPlan(
  [
    { id: "A", options: [{ cost: 1_000_000, ksi: 10 }] },
    { id: "B", options: [{ cost: 1_000_000, ksi: 6 }] },
    { id: "C", options: [{ cost: 1_000_000, ksi: 4 }] },
  ],
  0,
);

async function levels(budgets: readonly number[]): Promise<FrontierLevel[]> {
  return Promise.all(budgets.map(async (budget) => ({ budget, plan: await planProgramme(prepared, budget) })));
}

describe("summariseFrontier", () => {
  it("reports the marginal KSI per extra 1M and marks steps below half the first step's rate", async () => {
    const summary = summariseFrontier(await levels([0, 1_000_000, 2_000_000, 3_000_000]));
    expect(summary.rows.map((row) => row.ksiAvoided)).toEqual([0, 10, 16, 20]);
    expect(summary.rows.map((row) => row.marginalKsiPerMillion)).toEqual([null, 10, 6, 4]);
    expect(summary.referenceKsiPerMillion).toBe(10);
    // 6 is not below half of 10; 4 is.
    expect(summary.rows.map((row) => row.diminishing)).toEqual([false, false, false, true]);
    expect(summary.diminishingFrom).toBe(2_000_000);
  });

  it("scales a step's rate to 1M: a 2M step that buys 16 KSI is 8 per 1M", async () => {
    const summary = summariseFrontier(await levels([0, 2_000_000, 3_000_000]));
    expect(summary.rows.map((row) => row.marginalKsiPerMillion)).toEqual([null, 8, 4]);
    expect(summary.rows[2]!.diminishing).toBe(false); // 4 is exactly half of 8, not below it
    expect(summary.diminishingFrom).toBeNull();
  });

  it("gives no rate to or from a level that has no solved list (a must-fund site dearer than the budget)", async () => {
    const withRequired = syntheticPlan(
      [
        { id: "A", options: [{ cost: 500_000, ksi: 2 }], required: true },
        { id: "B", options: [{ cost: 1_000_000, ksi: 6 }] },
      ],
      0,
    );
    const frontier = await Promise.all([0, 1_000_000, 2_000_000].map(async (budget) => ({ budget, plan: await planProgramme(withRequired, budget) })));
    const summary = summariseFrontier(frontier);
    expect(summary.rows[0]!.status).toBe("infeasible");
    expect(summary.rows.map((row) => row.marginalKsiPerMillion)).toEqual([null, null, 6]);
    expect(summary.referenceKsiPerMillion).toBe(6);
  });
});
