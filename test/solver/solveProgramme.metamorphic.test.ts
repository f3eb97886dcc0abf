import { describe, expect, it } from "vitest";
import { checkSolution } from "../../src/solver/checkSolution.js";
import { solveProgramme } from "../../src/solver/solveProgramme.js";
import type { Programme } from "../../src/solver/types.js";
import { randomProgramme, seededRandom } from "./randomProgramme.js";

// Metamorphic relations: each transformation has a known effect on the optimum (none, or a
// known one), so the check needs no stored answer (the approach of YALPS's solver tests).

function shuffled(programme: Programme, seed: number): { programme: Programme; from: number[] } {
  const random = seededRandom(seed);
  const from = programme.groups.map((_, g) => g);
  for (let i = from.length - 1; i > 0; i -= 1) {
    const j = Math.floor(random() * (i + 1));
    [from[i], from[j]] = [from[j]!, from[i]!];
  }
  return {
    from,
    programme: {
      ...programme,
      groups: from.map((g) => programme.groups[g]!),
      constraints: programme.constraints.map((c) => ({ ...c, coefficients: from.map((g) => c.coefficients[g]) })),
    },
  };
}

function withDuplicateOption(programme: Programme, g: number): Programme {
  const copy = (row: readonly number[]): number[] => [...row, row[row.length - 1]!];
  return {
    ...programme,
    groups: programme.groups.map((group, h) =>
      h === g ? { ...group, options: [...group.options, group.options[group.options.length - 1]!] } : group,
    ),
    constraints: programme.constraints.map((c) => ({
      ...c,
      coefficients: c.coefficients.map((row, h) => (h === g && row !== undefined ? copy(row) : row)),
    })),
  };
}

const CASES = 40;

describe("metamorphic relations of the exact engine", () => {
  it(`shuffling the sites changes neither the optimum nor the choice per site: ${CASES} cases`, async () => {
    let ran = 0;
    for (let seed = 1; seed <= CASES; seed += 1) {
      const programme = randomProgramme(seed, { groups: 20 + (seed % 5) * 30, minOptions: 3, maxOptions: 6, maxCost: 1000, sideConstraints: seed % 4 === 0 });
      const base = await solveProgramme(programme);
      const { programme: moved, from } = shuffled(programme, seed + 77);
      const again = await solveProgramme(moved);
      expect(again.status, `seed ${seed}`).toBe(base.status);
      expect(again.objective, `seed ${seed}`).toBe(base.objective);
      // Ties are broken by site id, never by position, so the very same programme comes back.
      expect(from.map((g) => base.choice[g]), `seed ${seed}`).toEqual(again.choice);
      ran += 1;
    }
    expect(ran).toBe(CASES);
  });

  it(`duplicating an option keeps the optimum: ${CASES} cases`, async () => {
    let ran = 0;
    for (let seed = 101; seed <= 100 + CASES; seed += 1) {
      const programme = randomProgramme(seed, { groups: 30 + (seed % 4) * 40, minOptions: 3, maxOptions: 6, maxCost: 1000, sideConstraints: seed % 4 === 0 });
      const base = await solveProgramme(programme);
      const twin = withDuplicateOption(programme, seed % programme.groups.length);
      const again = await solveProgramme(twin);
      expect(again.objective, `seed ${seed}`).toBe(base.objective);
      expect(checkSolution(twin, again.choice).feasible).toBe(base.status === "optimal");
      ran += 1;
    }
    expect(ran).toBe(CASES);
  });

  it(`raising the budget never lowers the optimum, and its marginal value never rises: ${CASES / 4} ladders`, async () => {
    let steps = 0;
    for (let seed = 201; seed <= 200 + CASES / 4; seed += 1) {
      const programme = randomProgramme(seed, { groups: 150, minOptions: 3, maxOptions: 6, maxCost: 1000, budgetShare: 0.02, requiredChance: 0 });
      let previous: { objective: number; marginal: number } | undefined;
      for (let step = 0; step < 12; step += 1) {
        const solution = await solveProgramme({ ...programme, budget: programme.budget * (1 + step) });
        expect(solution.status).toBe("optimal");
        if (previous !== undefined) {
          expect(solution.objective).toBeGreaterThanOrEqual(previous.objective);
          // The LP value is concave in the budget (a sorted greedy), so its slope cannot grow.
          expect(solution.budgetMarginalValue).toBeLessThanOrEqual(previous.marginal);
        }
        previous = { objective: solution.objective, marginal: solution.budgetMarginalValue };
        steps += 1;
      }
    }
    expect(steps).toBe((CASES / 4) * 12);
  });

  it("doubling every value doubles the optimum and keeps the choice", async () => {
    let ran = 0;
    for (let seed = 301; seed <= 320; seed += 1) {
      const programme = randomProgramme(seed, { groups: 80, minOptions: 3, maxOptions: 6, maxCost: 1000 });
      const doubled: Programme = {
        ...programme,
        groups: programme.groups.map((g) => ({ ...g, options: g.options.map((o) => ({ cost: o.cost, value: 2 * o.value })) })),
      };
      const base = await solveProgramme(programme);
      const twice = await solveProgramme(doubled);
      expect(twice.objective).toBe(2 * base.objective);
      expect(twice.choice).toEqual(base.choice);
      ran += 1;
    }
    expect(ran).toBe(20);
  });
});

describe("tie-breaking", () => {
  const twin = (id: string) => ({ id, required: false, options: [{ cost: 10, value: 4 }, { cost: 10, value: 4 }] });

  it("funds the site with the smaller id when two are identical, whatever their order", async () => {
    for (const groups of [[twin("B"), twin("A")], [twin("A"), twin("B")]]) {
      const solution = await solveProgramme({ budget: 10, groups, constraints: [] });
      const chosen = groups.filter((_, g) => solution.choice[g] !== null).map((g) => g.id);
      expect(chosen).toEqual(["A"]);
      // Between identical options, the lower index wins.
      expect(solution.choice.filter((a) => a !== null)).toEqual([0]);
    }
  });
});
