import highsExport from "highs";
import { describe, expect, it } from "vitest";
import { lpBudgetMarginalValue } from "../../src/solver/lpBudgetMarginalValue.js";
import type { Programme } from "../../src/solver/types.js";
import { seededRandom } from "./randomProgramme.js";

// The package's declarations describe its CommonJS build; under ESM the default export is the loader itself.
const highsLoader = highsExport as unknown as () => Promise<{ solve(problem: string): { Status: string; Rows: { Dual: number }[] } }>;

// The LP relaxation in CPLEX LP format, for HiGHS (an independent reference LP solver, used only in tests).
function lpText(programme: Programme): string {
  const name = (g: number, a: number) => `x${g}_${a}`;
  const terms = (pick: (o: { cost: number; value: number }) => number) =>
    programme.groups.flatMap((group, g) => group.options.map((option, a) => `+ ${pick(option)} ${name(g, a)}`)).join(" ");
  const rows = programme.groups.map((group, g) => ` g${g}: ${group.options.map((_, a) => `+ ${name(g, a)}`).join(" ")} ${group.required ? "=" : "<="} 1`);
  const bounds = programme.groups.flatMap((group, g) => group.options.map((_, a) => ` 0 <= ${name(g, a)} <= 1`));
  return ["Maximize", ` obj: ${terms((o) => o.value)}`, "Subject To", ` budget: ${terms((o) => o.cost)} <= ${programme.budget}`, ...rows, "Bounds", ...bounds, "End"].join("\n");
}

function randomProgramme(seed: number): Programme {
  const random = seededRandom(seed);
  const int = (lo: number, hi: number) => lo + Math.floor(random() * (hi - lo + 1));
  const groups = Array.from({ length: int(3, 9) }, (_, g) => ({
    id: `G${g}`,
    required: random() < 0.15,
    options: Array.from({ length: int(1, 4) }, () => ({ cost: int(1, 60), value: int(1, 40) })),
  }));
  const dearest = groups.reduce((t, group) => t + Math.max(...group.options.map((o) => o.cost)), 0);
  // Integer costs put every LP breakpoint on a whole number; a budget ending in .5 is never one, so the dual is unique.
  return { budget: Math.floor(dearest * (0.1 + 0.8 * random())) + 0.5, groups, constraints: [] };
}

describe("lpBudgetMarginalValue", () => {
  it("equals the budget row's dual from HiGHS on seeded random LP relaxations", async () => {
    const highs = await highsLoader();
    let compared = 0;
    for (let seed = 1; seed <= 60; seed += 1) {
      const programme = randomProgramme(seed);
      const lambda = lpBudgetMarginalValue(programme);
      const solved = highs.solve(lpText(programme));
      if (solved.Status !== "Optimal") {
        // Only when the required sites' cheapest options exceed the budget.
        expect(lambda).toBeUndefined();
        continue;
      }
      expect(lambda).toBeDefined();
      expect(lambda!).toBeCloseTo(Math.abs(solved.Rows[0]!.Dual), 9);
      compared += 1;
    }
    expect(compared).toBeGreaterThanOrEqual(50);
  });

  it("is 0 when the budget buys every site's best option, and the fractional step's rate otherwise (hand-computed)", () => {
    const groups = [
      { id: "A", required: false, options: [{ cost: 10, value: 30 }, { cost: 30, value: 40 }] },
      { id: "B", required: false, options: [{ cost: 20, value: 20 }] },
    ];
    // Steps by rate: A 0→10 (3.0), A 10→30 (0.5), B 0→20 (1.0). Budget 25: A's first step, then 15 of B's → λ = 1.
    expect(lpBudgetMarginalValue({ budget: 25, groups, constraints: [] })).toBe(1);
    // Budget 35: A first step and B whole (30), then 5 of A's upgrade → λ = 0.5.
    expect(lpBudgetMarginalValue({ budget: 35, groups, constraints: [] })).toBe(0.5);
    expect(lpBudgetMarginalValue({ budget: 50, groups, constraints: [] })).toBe(0);
    // At the breakpoint 30 the next unit of budget buys A's upgrade: the right derivative, 0.5.
    expect(lpBudgetMarginalValue({ budget: 30, groups, constraints: [] })).toBe(0.5);
  });

  it("declines programmes with side constraints", () => {
    const programme: Programme = {
      budget: 10,
      groups: [{ id: "A", required: false, options: [{ cost: 5, value: 5 }] }],
      constraints: [{ id: "c", label: "cap", sense: "<=", rhs: 1, coefficients: [[1]] }],
    };
    expect(lpBudgetMarginalValue(programme)).toBeUndefined();
  });
});
