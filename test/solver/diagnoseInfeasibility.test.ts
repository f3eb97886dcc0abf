import { describe, expect, it } from "vitest";
import { solveProgramme } from "../../src/solver/solveProgramme.js";
import type { Programme } from "../../src/solver/types.js";

// Hand-computed: must-fund cheapest options cost 60 + 90 = 150 against a budget of 100.
const overBudget: Programme = {
  budget: 100,
  groups: [
    { id: "A", required: true, options: [{ cost: 60, value: 3 }, { cost: 80, value: 5 }] },
    { id: "B", required: true, options: [{ cost: 120, value: 2 }, { cost: 90, value: 1 }] },
    { id: "C", required: false, options: [{ cost: 10, value: 4 }] },
  ],
  constraints: [],
};

describe("infeasible programmes", () => {
  it("names the shortfall when must-fund sites alone exceed the budget", async () => {
    const solution = await solveProgramme(overBudget);
    expect(solution.status).toBe("infeasible");
    expect(solution.diagnosis).toContain("150");
    expect(solution.diagnosis).toContain("50 more than the budget");
    expect(solution.choice).toEqual([null, null, null]);
  });

  it("names a rule that cannot be met on its own", async () => {
    const programme: Programme = {
      ...overBudget,
      budget: 1000,
      constraints: [
        { id: "count", label: "at most 1 project", sense: "<=", rhs: 1, coefficients: [[1, 1], [1, 1], [1]] },
      ],
    };
    const solution = await solveProgramme(programme);
    expect(solution.status).toBe("infeasible");
    expect(solution.diagnosis).toContain("at most 1 project");
  });

  it("reports a conflict between rules that each hold alone", async () => {
    // Spend at C >= 10 needs C funded; at most 2 projects with A and B required forbids it.
    const programme: Programme = {
      ...overBudget,
      budget: 1000,
      constraints: [
        { id: "count", label: "at most 2 projects", sense: "<=", rhs: 2, coefficients: [[1, 1], [1, 1], [1]] },
        { id: "floor", label: "spend at C >= 10", sense: ">=", rhs: 10, coefficients: [undefined, undefined, [10]] },
      ],
    };
    const solution = await solveProgramme(programme);
    expect(solution.status).not.toBe("optimal");
    expect(solution.choice).toEqual([null, null, null]);
  });
});
