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
          expect(solution.status, `seed ${seed}`).not.toBe("optimal");
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
});
