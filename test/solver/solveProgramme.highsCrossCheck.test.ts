import { describe, expect, it } from "vitest";
import { checkSolution } from "../../src/solver/checkSolution.js";
import { buildHighsModel } from "../../src/solver/buildHighsModel.js";
import { loadHighs } from "../../src/solver/loadHighs.js";
import { runHighs } from "../../src/solver/runHighs.js";
import { solveProgramme } from "../../src/solver/solveProgramme.js";
import { randomProgramme } from "./randomProgramme.js";

// Independent reference: HiGHS 1.15.3 (branch-and-cut MIP solver) on the whole programme with
// mip_rel_gap 0. Costs (up to 10,000) and values (about 0-100,000) are whole numbers, so every sum
// is exact in floating point and distinct programmes differ by at least 1 in value: a 1e-9
// relative tolerance can only absorb rounding, never hide a worse programme.
const SIZES = [20, 50, 100, 200, 500];
const CASES = 50;

describe("exact engine against HiGHS (mip_rel_gap 0)", () => {
  it(`agrees on the optimum of ${CASES} seeded programmes of up to 500 sites, with and without rules`, async () => {
    let ran = 0;
    let withRules = 0;
    let infeasible = 0;
    for (let seed = 1001; seed < 1001 + CASES; seed += 1) {
      const sideConstraints = seed % 2 === 0;
      const programme = randomProgramme(seed, {
        groups: SIZES[seed % SIZES.length]!,
        minOptions: 3,
        maxOptions: 6,
        maxCost: 10_000,
        valueScale: 100,
        budgetShare: [0.05, 0.15, 0.3][seed % 3]!,
        requiredChance: seed % 4 === 1 ? 0.05 : 0,
        sideConstraints,
      });
      const exact = await solveProgramme(programme, { engine: "exact" });
      const reference = await solveProgramme(programme, { engine: "highs" });
      expect(exact.status, `seed ${seed}`).toBe(reference.status);
      if (reference.status === "optimal") {
        expect(checkSolution(programme, exact.choice).feasible, `seed ${seed}`).toBe(true);
        const scale = Math.max(1, Math.abs(reference.objective));
        expect(Math.abs(exact.objective - reference.objective) / scale, `seed ${seed}`).toBeLessThanOrEqual(1e-9);
        expect(exact.bound - exact.objective, `seed ${seed}`).toBeLessThanOrEqual(1e-9 * scale);
      } else {
        infeasible += 1;
      }
      if (sideConstraints) withRules += 1;
      ran += 1;
    }
    expect(ran).toBe(CASES);
    expect(withRules).toBe(CASES / 2);
    expect(infeasible).toBeLessThan(CASES / 4);
  });

  it("finds the budget's marginal value equal to HiGHS's LP dual on the budget row", async () => {
    // HiGHS's dual comes from its simplex basis; ours is the ratio of the critical hull segment.
    // When the greedy fills the budget exactly the dual is not unique; such cases are counted.
    let agreed = 0;
    let degenerate = 0;
    for (let seed = 2001; seed <= 2030; seed += 1) {
      const programme = randomProgramme(seed, { groups: 40 + (seed % 3) * 200, minOptions: 3, maxOptions: 6, maxCost: 10_000, valueScale: 100, requiredChance: 0 });
      const exact = await solveProgramme(programme, { engine: "exact" });
      const highs = await loadHighs();
      const lp = runHighs(highs, buildHighsModel(highs, programme, false).data, { timeLimitSeconds: 60, relativeGap: 0, absoluteGap: 0 });
      expect(lp.status).toBe("optimal");
      const dual = lp.rowDual[0]!;
      if (Math.abs(exact.budgetMarginalValue - dual) <= 1e-9 * Math.max(1, exact.budgetMarginalValue)) agreed += 1;
      else degenerate += 1;
    }
    expect(agreed + degenerate).toBe(30);
    expect(agreed).toBeGreaterThanOrEqual(27);
  });
});
