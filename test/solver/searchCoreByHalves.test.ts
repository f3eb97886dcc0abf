import { describe, expect, it } from "vitest";
import { NO_OPTION } from "../../src/solver/buildGroupHull.js";
import { checkSolution } from "../../src/solver/checkSolution.js";
import { searchCoreByHalves } from "../../src/solver/searchCoreByHalves.js";
import type { Programme } from "../../src/solver/types.js";
import { bruteForceOptimum } from "./bruteForceOptimum.js";
import { randomProgramme, seededRandom } from "./randomProgramme.js";

// Reference: exhaustive enumeration (bruteForceOptimum) of the same restriction, written as a
// programme of its own (each group keeps only its allowed options). The generator's costs and
// values are whole numbers and its share rows quarters, so optima compare exactly.

/** Random allowed choices per group: a subset of its options, with doing nothing unless required. */
function randomChoices(programme: Programme, seed: number): number[][] {
  const next = seededRandom(seed);
  return programme.groups.map((group) => {
    const kept = group.options.flatMap((_, a) => (next() < 0.7 ? [a] : []));
    if (kept.length === 0 && group.options.length > 0) kept.push(0);
    return group.required ? kept : [NO_OPTION, ...kept];
  });
}

/** The restriction as a programme: each group keeps its allowed options, in order. */
function restricted(programme: Programme, choices: readonly (readonly number[])[]): Programme {
  const kept = choices.map((allowed) => allowed.filter((a) => a !== NO_OPTION));
  return {
    budget: programme.budget,
    groups: programme.groups.map((group, g) => ({ ...group, required: !choices[g]!.includes(NO_OPTION), options: kept[g]!.map((a) => group.options[a]!) })),
    constraints: programme.constraints.map((c) => ({ ...c, coefficients: c.coefficients.map((row, g) => (row === undefined ? undefined : kept[g]!.map((a) => row[a]!))) })),
  };
}

describe("searchCoreByHalves", () => {
  it("finds the enumerated optimum of 300 random restrictions with caps, floors, shares and counts", () => {
    let ran = 0;
    let infeasible = 0;
    for (let seed = 1; seed <= 300; seed += 1) {
      const programme = randomProgramme(seed, { groups: 3 + (seed % 5), maxOptions: 4, sideConstraints: seed % 4 !== 0, requiredChance: 0.15, budgetShare: [0.2, 0.4, 0.8][seed % 3]! });
      const choices = randomChoices(programme, seed + 7);
      const reference = bruteForceOptimum(restricted(programme, choices));
      for (const sortRow of [0, programme.constraints.length]) {
        const result = searchCoreByHalves({ programme, choices, sortRow, floor: Number.NEGATIVE_INFINITY, tolerance: 0, deadline: Number.POSITIVE_INFINITY });
        expect(result.status, `seed ${seed}`).toBe("complete");
        if (reference.objective === null) {
          expect(result.choice, `seed ${seed}`).toBeUndefined();
        } else {
          expect(result.choice, `seed ${seed}`).toBeDefined();
          const check = checkSolution(programme, result.choice!);
          expect(check.feasible, `seed ${seed}`).toBe(true);
          expect(check.objective, `seed ${seed}`).toBe(reference.objective);
          // Only the allowed choices are used.
          result.choice!.forEach((a, g) => expect(choices[g], `seed ${seed}`).toContain(a ?? NO_OPTION));
        }
      }
      if (reference.objective === null) infeasible += 1;
      ran += 1;
    }
    expect(ran).toBe(300);
    expect(infeasible).toBeGreaterThan(0);
    expect(infeasible).toBeLessThan(150);
  });

  it("reports nothing better than a floor at the optimum, and the optimum just below it", () => {
    const programme = randomProgramme(11, { groups: 6, maxOptions: 4, sideConstraints: true, requiredChance: 0 });
    const choices = programme.groups.map((group) => [NO_OPTION, ...group.options.map((_, a) => a)]);
    const optimum = bruteForceOptimum(programme).objective!;
    const base = { programme, choices, sortRow: 0, tolerance: 0, deadline: Number.POSITIVE_INFINITY };
    expect(searchCoreByHalves({ ...base, floor: optimum })).toEqual({ status: "complete", objective: optimum });
    expect(searchCoreByHalves({ ...base, floor: optimum - 0.5 }).objective).toBe(optimum);
  });

  it("refuses a restriction with more programmes than two halves can hold", () => {
    const group = { id: "g", required: false, options: Array.from({ length: 15 }, (_, a) => ({ cost: a, value: a })) };
    // 16 choices per group: 16^12 = 2^48 programmes, above two halves of 2^21.
    const programme: Programme = { budget: 10, groups: Array.from({ length: 12 }, (_, g) => ({ ...group, id: `g${g}` })), constraints: [] };
    const choices = programme.groups.map(() => [NO_OPTION, ...group.options.map((_, a) => a)]);
    const result = searchCoreByHalves({ programme, choices, sortRow: 0, floor: Number.NEGATIVE_INFINITY, tolerance: 0, deadline: Number.POSITIVE_INFINITY });
    expect(result.status).toBe("too-large");
  });
});
