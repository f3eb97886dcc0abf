import { describe, expect, it } from "vitest";
import { justifyPlan } from "../../src/analysis/justifyPlan.js";
import { lpBudgetMarginalValue } from "../../src/solver/lpBudgetMarginalValue.js";
import { planProgramme } from "../../src/analysis/planProgramme.js";
import { upgradeChecks } from "../../src/analysis/upgradeChecks.js";
import { syntheticPlan } from "./syntheticPlan.js";

describe("justifyPlan", () => {
  it("ranks funded projects by B/C and gives each left-out site its reason (hand-built case)", async () => {
    // Benefit defaults to 1000 × KSI and lifecycle cost to capital, except where given.
    const prepared = syntheticPlan(
      [
        { id: "A", options: [{ cost: 10, ksi: 8 }, { cost: 30, ksi: 12 }] }, // funded
        { id: "B", options: [{ cost: 20, ksi: 10 }] }, // funded
        { id: "X", options: [], excludedBy: "never-fund rule" },
        { id: "Z", options: [{ cost: 5, ksi: 0, benefit: 0 }] }, // no effect
        { id: "L", options: [{ cost: 40, ksi: 3, benefit: 20, lifecycle: 40 }] }, // B/C 0.5
        { id: "M", options: [{ cost: 35, ksi: 6 }] }, // pays its way, left out by the budget
      ],
      30,
    );
    const plan = await planProgramme(prepared);
    const justification = justifyPlan(plan);
    expect(justification.funded.map((f) => [f.site, f.bcRank, f.alternativesNotChosen])).toEqual([
      ["A", 1, 1], // B/C 800
      ["B", 2, 0], // B/C 500
    ]);
    const reasons = Object.fromEntries(justification.notFunded.map((n) => [n.site, n.reason]));
    expect(reasons).toEqual({ X: "excluded", Z: "no-effect", L: "bc-below-1", M: "budget" });
    // LP relaxation by hand: hull steps A 0→10 (0.8/unit), B 0→20 (0.5), A 10→30 (0.2), M 0→35 (0.171), L (0.075).
    // Budget 30 buys A's first step and B whole; the next step (A's upgrade) sets λ = 4/20 = 0.2 KSI per unit.
    expect(justification.budgetMarginalValue).toBeCloseTo(0.2, 12);
    // The exact engine reports λ itself; the fallback LP computation (checked against HiGHS) must agree with it.
    expect(justification.marginalValueSource).toBe("solver");
    expect(lpBudgetMarginalValue(plan.programme)).toBeCloseTo(0.2, 12);
    const m = justification.notFunded.find((n) => n.site === "M")!.threshold!;
    // M enters once 6 − 0.2 × cost > 0: cost < 30, i.e. at least 5 cheaper; or 7 − 6 = 1 more KSI at cost 35.
    expect(m.costThreshold).toBeCloseTo(30, 9);
    expect(m.costCut).toBeCloseTo(5, 9);
    expect(m.extraValueNeeded).toBeCloseTo(1, 9);
  });

  it("flags a chosen upgrade whose incremental B/C is below 1 (chosen for K+A crashes avoided, not money)", async () => {
    // One site; the upgrade adds 2 KSI worth 200 for 300 more lifecycle cost: ΔB/ΔC = 200/300 < 1, yet it avoids more KSI.
    const prepared = syntheticPlan([{ id: "A", options: [{ cost: 100, ksi: 5, benefit: 1000 }, { cost: 400, ksi: 7, benefit: 1200 }] }], 500);
    const [check] = upgradeChecks(await planProgramme(prepared));
    expect(check!.chosen).toEqual(["t1"]);
    expect(check!.stepFrom).toEqual(["t0"]);
    expect(check!.incrementalBcRatio).toBeCloseTo(200 / 300, 12);
    expect(check!.forKsiNotMoney).toBe(true);
    expect(check!.preferredOnMoney).toEqual(["t0"]);
  });
});
