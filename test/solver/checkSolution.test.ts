import { describe, expect, it } from "vitest";
import { checkSolution } from "../../src/solver/checkSolution.js";
import type { Programme } from "../../src/solver/types.js";

// Hand-computed expectations on a three-site programme.
const programme: Programme = {
  budget: 100,
  groups: [
    { id: "A", required: true, options: [{ cost: 40, value: 3 }, { cost: 70, value: 5 }] },
    { id: "B", required: false, options: [{ cost: 30, value: 2 }, { cost: 0, value: 0.5 }] },
    { id: "C", required: false, options: [{ cost: 50, value: 4 }] },
  ],
  constraints: [
    {
      id: "count",
      label: "at most 2 projects",
      sense: "<=",
      rhs: 2,
      coefficients: [[1, 1], [1, 1], [1]],
    },
    {
      id: "floor-C",
      label: "spend at C >= 10",
      sense: ">=",
      rhs: 10,
      coefficients: [undefined, undefined, [50]],
    },
  ],
};

describe("checkSolution", () => {
  it("accepts a feasible choice and recomputes objective and cost", () => {
    const check = checkSolution(programme, [0, null, 0]);
    expect(check.problems).toEqual([]);
    expect(check.feasible).toBe(true);
    expect(check.objective).toBe(7);
    expect(check.cost).toBe(90);
  });

  it("rejects a choice over budget", () => {
    expect(checkSolution(programme, [1, null, 0]).feasible).toBe(false); // 70 + 50 = 120 > 100
  });

  it("rejects a required site left out", () => {
    expect(checkSolution(programme, [null, null, 0]).feasible).toBe(false);
  });

  it("rejects a broken <= rule and a broken >= rule", () => {
    const tooMany = checkSolution(programme, [0, 1, 0]); // 3 projects, cost 90
    expect(tooMany.feasible).toBe(false);
    expect(tooMany.problems).toHaveLength(1);
    const noFloor = checkSolution(programme, [0, 0, null]); // spend at C = 0 < 10
    expect(noFloor.feasible).toBe(false);
    expect(noFloor.problems).toHaveLength(1);
  });

  it("rejects impossible indices and a wrong length", () => {
    expect(checkSolution(programme, [2, null, 0]).feasible).toBe(false);
    expect(checkSolution(programme, [0.5, null, 0]).feasible).toBe(false);
    expect(checkSolution(programme, [0, null]).feasible).toBe(false);
  });

  it("allows floating-point dust on the budget but not a real overrun", () => {
    const dust: Programme = { ...programme, budget: 90 - 1e-12, constraints: [] };
    expect(checkSolution(dust, [0, null, 0]).feasible).toBe(true);
    const overrun: Programme = { ...programme, budget: 90 - 1e-3, constraints: [] };
    expect(checkSolution(overrun, [0, null, 0]).feasible).toBe(false);
  });
});
