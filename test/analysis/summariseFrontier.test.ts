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
    // The "first 1M" is measured from the first feasible level (1M, 2 KSI) to the next (2M, 8 KSI).
    expect(summary.referenceKsiPerMillion).toBe(6);
    expect(summary.referenceFromBudget).toBe(1_000_000);
    expect(summary.referenceToBudget).toBe(2_000_000);
  });

  it("measures the first 1M from the first feasible level over a level that was not solved", async () => {
    const solved = await levels([0, 1_000_000, 2_000_000, 3_000_000]);
    // Level 2M stands for an engine that gave no list: no rate to or from it, and the first 1M spans it.
    const frontier = solved.map((level, index) =>
      index === 2 ? { ...level, plan: { ...level.plan, solution: { ...level.plan.solution, status: "not-solved" as const } } } : level,
    );
    const summary = summariseFrontier(frontier);
    expect(summary.rows.map((row) => row.marginalKsiPerMillion)).toEqual([null, 10, null, null]);
    // From the first feasible level (0, 0 KSI) to the next with a list (1M, 10 KSI).
    expect(summary.referenceKsiPerMillion).toBe(10);
    const withoutFirst = summariseFrontier([{ ...frontier[0]!, plan: { ...frontier[0]!.plan, solution: { ...frontier[0]!.plan.solution, status: "infeasible" as const } } }, frontier[1]!, frontier[2]!, frontier[3]!]);
    // Level 0 infeasible and level 2M unsolved: from 1M (10 KSI) to 3M (20 KSI), 10 KSI over 2M = 5 per 1M.
    expect(withoutFirst.referenceKsiPerMillion).toBe(5);
    expect([withoutFirst.referenceFromBudget, withoutFirst.referenceToBudget]).toEqual([1_000_000, 3_000_000]);
  });

  it("gives no first 1M when fewer than two levels have a list", async () => {
    const [only] = await levels([1_000_000]);
    const summary = summariseFrontier([only!]);
    expect(summary.referenceKsiPerMillion).toBeNull();
    expect([summary.referenceFromBudget, summary.referenceToBudget]).toEqual([null, null]);
    expect(summary.diminishingFrom).toBeNull();
  });
});
