import { describe, expect, it } from "vitest";
import { checkSolution } from "../../src/solver/checkSolution.js";
import { solveProgramme } from "../../src/solver/solveProgramme.js";
import type { EngineName } from "../../src/solver/types.js";
import { bruteForceOptimum } from "./bruteForceOptimum.js";
import { randomProgramme } from "./randomProgramme.js";

// Reference: exhaustive enumeration (bruteForceOptimum), a method independent of every engine.
// Costs and values are whole numbers, so optima are compared exactly.
const CASES = 240;
const ENGINES: readonly EngineName[] = ["auto", "exact", "highs", "lp-solver"];

describe("solveProgramme against brute-force enumeration", () => {
  for (const engine of ENGINES) {
    it(`engine ${engine}: ${CASES} seeded random small programmes reach the enumerated optimum`, async () => {
      let ran = 0;
      let infeasible = 0;
      for (let seed = 1; seed <= CASES; seed += 1) {
        const programme = randomProgramme(seed, {
          groups: 2 + (seed % 5),
          maxOptions: 3 + (seed % 2),
          sideConstraints: seed % 2 === 0,
          requiredChance: seed % 3 === 0 ? 0.4 : 0.1,
          budgetShare: [0.1, 0.3, 0.6, 1.2][seed % 4]!,
        });
        const reference = bruteForceOptimum(programme);
        const solution = await solveProgramme(programme, { engine });
        if (reference.objective === null) {
          infeasible += 1;
          // javascript-lp-solver cannot prove infeasibility (only the up-front diagnosis can); the others must.
          const allowed = engine === "lp-solver" ? ["infeasible", "not-solved"] : ["infeasible"];
          expect(allowed, `seed ${seed}`).toContain(solution.status);
          expect(solution.choice.every((a) => a === null), `seed ${seed}`).toBe(true);
        } else {
          expect(solution.status, `seed ${seed}`).toBe("optimal");
          expect(checkSolution(programme, solution.choice).feasible, `seed ${seed}`).toBe(true);
          expect(solution.objective, `seed ${seed}`).toBe(reference.objective);
          expect(solution.bound, `seed ${seed}`).toBeGreaterThanOrEqual(reference.objective - 1e-9);
        }
        ran += 1;
      }
      expect(ran).toBe(CASES);
      // The generator must exercise both outcomes, or this test proves little.
      expect(infeasible).toBeGreaterThan(0);
      expect(infeasible).toBeLessThan(CASES / 2);
    });
  }

  it("exact engine: 200 programmes with fractional values and many zero costs and values", async () => {
    let ran = 0;
    for (let seed = 5001; seed <= 5200; seed += 1) {
      const base = randomProgramme(seed, { groups: 3 + (seed % 4), maxOptions: 4, budgetShare: [0, 0.2, 0.5][seed % 3]!, sideConstraints: seed % 3 === 0 });
      // Values become fractions with no exact binary form (x / 7), and every fifth cost is zero.
      const programme = {
        ...base,
        groups: base.groups.map((g, i) => ({
          ...g,
          options: g.options.map((o, a) => ({ cost: (i + a) % 5 === 0 ? 0 : o.cost, value: (i * a) % 4 === 1 ? 0 : o.value / 7 })),
        })),
      };
      const reference = bruteForceOptimum(programme);
      const solution = await solveProgramme(programme, { engine: "exact" });
      if (reference.objective === null) {
        expect(solution.status, `seed ${seed}`).toBe("infeasible");
      } else {
        expect(solution.status, `seed ${seed}`).toBe("optimal");
        expect(checkSolution(programme, solution.choice).feasible).toBe(true);
        expect(Math.abs(solution.objective - reference.objective), `seed ${seed}`).toBeLessThanOrEqual(1e-9 * Math.max(1, reference.objective));
      }
      ran += 1;
    }
    expect(ran).toBe(200);
  });
});
