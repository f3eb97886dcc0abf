import { describe, expect, it } from "vitest";
import { verifyEngineResult } from "../../src/solver/verifyEngineResult.js";
import type { Programme } from "../../src/solver/types.js";

// Hand-made engine answers, good and bad, against a two-site programme with budget 10.
const programme: Programme = {
  budget: 10,
  groups: [
    { id: "A", required: false, options: [{ cost: 6, value: 3 }, { cost: 9, value: 4 }] },
    { id: "B", required: false, options: [{ cost: 4, value: 2 }] },
  ],
  constraints: [],
};

describe("verifyEngineResult", () => {
  it("never passes on an over-budget answer as optimal", () => {
    const solution = verifyEngineResult(programme, "lp-solver", { status: "optimal", choice: [1, 0], bound: 6, budgetMarginalValue: 0.5 });
    expect(solution.status).toBe("not-solved");
    expect(solution.choice).toEqual([null, null]);
    expect(solution.diagnosis).toContain("failed verification");
  });

  it("never passes on two options at one site", () => {
    const solution = verifyEngineResult(programme, "highs", { status: "optimal", choice: [-1, 0], bound: 6, budgetMarginalValue: 0.5 });
    expect(solution.status).toBe("not-solved");
  });

  it("recomputes objective and cost instead of trusting the engine", () => {
    const solution = verifyEngineResult(programme, "exact", { status: "optimal", choice: [0, 0], bound: 5, budgetMarginalValue: 0.5 });
    expect(solution).toMatchObject({ status: "optimal", objective: 5, cost: 10, bound: 5, gap: 0, engine: "exact" });
  });

  it("reports the gap to the engine's bound after a time-out", () => {
    const solution = verifyEngineResult(programme, "exact", { status: "time-limit", choice: [null, 0], bound: 6, budgetMarginalValue: 0.5 });
    expect(solution.status).toBe("time-limit");
    expect(solution.gap).toBeCloseTo((6 - 2) / 6, 12);
  });
});
