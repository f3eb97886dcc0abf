import { describe, expect, it } from "vitest";
import { NO_OPTION } from "../../src/solver/buildGroupHull.js";
import { buildHighsModel } from "../../src/solver/buildHighsModel.js";
import { buildRestrictedModel } from "../../src/solver/buildRestrictedModel.js";
import { checkSolution } from "../../src/solver/checkSolution.js";
import { lagrangianMultipliers, lagrangianValue, rowForm } from "../../src/solver/lagrangianMultipliers.js";
import { loadHighs } from "../../src/solver/loadHighs.js";
import { relaxationMultipliers } from "../../src/solver/relaxationMultipliers.js";
import { runHighs } from "../../src/solver/runHighs.js";
import { bruteForceOptimum } from "./bruteForceOptimum.js";
import { randomProgramme, seededRandom } from "./randomProgramme.js";

// References: HiGHS's own LP relaxation of the whole programme (an independent LP solver: LP
// duality says the Lagrangian dual's minimum equals the LP optimum), and exhaustive enumeration.

const settled = { timeLimitSeconds: 30, relativeGap: 0, absoluteGap: 0 };

describe("lagrangianMultipliers", () => {
  it("reaches HiGHS's LP optimum (1e-9 relative) and bounds the enumerated optimum, on 40 random programmes with side rules", async () => {
    const highs = await loadHighs();
    let compared = 0;
    for (let seed = 1; seed <= 40; seed += 1) {
      const programme = randomProgramme(seed, { groups: 7, maxOptions: 4, sideConstraints: true, requiredChance: 0.1, budgetShare: 0.35, valueScale: 1000 });
      const lp = runHighs(highs, buildHighsModel(highs, programme, false).data, settled);
      const form = rowForm(programme);
      const dual = lagrangianMultipliers(highs, programme, form, new Float64Array(form.rowCount), Date.now() + 30_000);
      const optimum = bruteForceOptimum(programme).objective;
      if (optimum !== null) expect(dual.bound, `seed ${seed}`).toBeGreaterThanOrEqual(optimum - 1e-9 * Math.max(1, optimum));
      if (lp.status !== "optimal") continue;
      expect(dual.converged, `seed ${seed}`).toBe(true);
      expect(Math.abs(dual.bound - lp.bound) / Math.max(1, Math.abs(lp.bound)), `seed ${seed}`).toBeLessThan(1e-9);
      compared += 1;
    }
    expect(compared).toBeGreaterThanOrEqual(30);
  });

  it("gives a valid upper bound at any multipliers, not only at the minimum", async () => {
    const random = seededRandom(5);
    for (let seed = 41; seed <= 60; seed += 1) {
      const programme = randomProgramme(seed, { groups: 6, maxOptions: 4, sideConstraints: true, requiredChance: 0, budgetShare: 0.4 });
      const optimum = bruteForceOptimum(programme).objective;
      if (optimum === null) continue;
      const form = rowForm(programme);
      const y = Float64Array.from({ length: form.rowCount }, () => random() * 2);
      expect(lagrangianValue(programme, form, y, new Float64Array(form.rowCount))).toBeGreaterThanOrEqual(optimum - 1e-9);
    }
  });

  it("falls back to HiGHS's LP when the relaxation is infeasible (the dual has no minimum)", async () => {
    const highs = await loadHighs();
    const programme = {
      budget: 10,
      groups: [{ id: "a", required: true, options: [{ cost: 20, value: 1 }] }],
      constraints: [],
    };
    expect(relaxationMultipliers(highs, programme, Date.now() + 30_000)).toEqual({ status: "infeasible" });
  });
});

describe("buildRestrictedModel", () => {
  it("folds fixed groups into the right-hand sides: HiGHS's optimum plus their value equals the whole restricted model's, and lifts to a feasible programme", async () => {
    const highs = await loadHighs();
    let checked = 0;
    for (let seed = 61; seed <= 90; seed += 1) {
      const programme = randomProgramme(seed, { groups: 8, maxOptions: 4, sideConstraints: true, requiredChance: 0.1, budgetShare: 0.4 });
      const random = seededRandom(seed);
      // Fix about half the groups at a random choice; leave the others open.
      const choices = programme.groups.map((group) => {
        const all = [...(group.required ? [] : [NO_OPTION]), ...group.options.map((_, a) => a)];
        return random() < 0.5 ? [all[Math.floor(random() * all.length)]!] : all;
      });
      const keep = programme.groups.map((group, g) => group.options.map((_, a) => choices[g]!.includes(a)));
      const mustPick = programme.groups.map((group, g) => !group.required && !choices[g]!.includes(NO_OPTION));
      const whole = runHighs(highs, buildHighsModel(highs, programme, true, { keep, mustPick }).data, settled);
      const restricted = buildRestrictedModel(highs, programme, choices, []);
      const run = runHighs(highs, restricted.data, settled);
      expect(run.status, `seed ${seed}`).toBe(whole.status);
      if (whole.status !== "optimal") continue;
      expect(run.bound + restricted.fixedValue).toBeCloseTo(whole.bound, 9);
      const choice = restricted.lift(run.colValue)!;
      const check = checkSolution(programme, choice);
      expect(check.feasible, `seed ${seed}`).toBe(true);
      expect(check.objective).toBeCloseTo(whole.bound, 9);
      choice.forEach((a, g) => expect(choices[g]).toContain(a ?? NO_OPTION));
      // The start vector of a lifted programme reads back as the same programme.
      expect(restricted.lift(restricted.start(choice))).toEqual(choice);
      checked += 1;
    }
    expect(checked).toBeGreaterThanOrEqual(15);
  });
});
