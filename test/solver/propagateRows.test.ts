import { describe, expect, it } from "vitest";
import { NO_OPTION } from "../../src/solver/buildGroupHull.js";
import { checkSolution } from "../../src/solver/checkSolution.js";
import { splitHalves } from "../../src/solver/halfLists.js";
import { propagateRows } from "../../src/solver/propagateRows.js";
import type { Programme } from "../../src/solver/types.js";
import { randomProgramme } from "./randomProgramme.js";

// Reference: exhaustive enumeration of every programme (checkSolution decides feasibility).

function everyChoice(programme: Programme): number[][] {
  return programme.groups.map((group) => [...(group.required ? [] : [NO_OPTION]), ...group.options.map((_, a) => a)]);
}

// Per group, the choices some feasible programme makes.
function usedByFeasible(programme: Programme): Set<number>[] {
  const used = programme.groups.map(() => new Set<number>());
  const choice: (number | null)[] = programme.groups.map(() => null);
  const allowed = everyChoice(programme);
  const visit = (g: number): void => {
    if (g === programme.groups.length) {
      if (checkSolution(programme, choice).feasible) choice.forEach((a, h) => used[h]!.add(a ?? NO_OPTION));
      return;
    }
    for (const a of allowed[g]!) {
      choice[g] = a === NO_OPTION ? null : a;
      visit(g + 1);
    }
    choice[g] = null;
  };
  visit(0);
  return used;
}

describe("propagateRows", () => {
  it("keeps every choice a feasible programme makes, on 60 random programmes with side rules", () => {
    let dropped = 0;
    for (let seed = 1; seed <= 60; seed += 1) {
      const programme = randomProgramme(seed, { groups: 6, maxOptions: 4, sideConstraints: true, requiredChance: 0.15, budgetShare: 0.3 });
      const before = everyChoice(programme);
      const after = propagateRows(programme, before);
      const used = usedByFeasible(programme);
      after.forEach((kept, g) => {
        for (const a of used[g]!) expect(kept, `seed ${seed}, group ${g}, choice ${a}`).toContain(a);
        expect(kept.every((a) => before[g]!.includes(a))).toBe(true);
        dropped += before[g]!.length - kept.length;
      });
    }
    // It must also do something: random rules leave choices no feasible programme can make.
    expect(dropped).toBeGreaterThan(0);
  });

  it("a count limit of 1 with one tagged site that must be funded drops the other tagged sites' options", () => {
    const programme: Programme = {
      budget: 100,
      groups: [
        { id: "a", required: true, options: [{ cost: 10, value: 5 }] },
        { id: "b", required: false, options: [{ cost: 10, value: 4 }, { cost: 20, value: 6 }] },
        { id: "c", required: false, options: [{ cost: 10, value: 3 }] },
      ],
      constraints: [{ id: "count", label: "at most 1 tagged project", sense: "<=", rhs: 1, coefficients: [[1], [1, 1]] }],
    };
    expect(propagateRows(programme, everyChoice(programme))).toEqual([[0], [NO_OPTION], [NO_OPTION, 0]]);
  });

  it("leaves a group with no choice when no programme can meet a row, and does not change its input", () => {
    const programme: Programme = {
      budget: 5,
      groups: [{ id: "a", required: true, options: [{ cost: 10, value: 1 }] }],
      constraints: [],
    };
    const input = everyChoice(programme);
    expect(propagateRows(programme, input)).toEqual([[]]);
    expect(input).toEqual([[0]]);
  });
});

describe("splitHalves", () => {
  it("splits the core so the larger half is no bigger than a greedy split's, and often smaller", () => {
    // Choice counts 22, 22, 16, 12×4, 8, 8, 4×3, 2, 2: greedy (largest first to the smaller half) gives 2^21.04 and 2^20.2.
    const sizes = [22, 22, 16, 12, 12, 12, 12, 8, 8, 4, 4, 4, 2, 2];
    const choices = sizes.map((n) => Array.from({ length: n }, (_, a) => a));
    const core = sizes.map((_, g) => g);
    const halves = splitHalves(core, choices);
    const product = (half: readonly number[]): number => half.reduce((n, g) => n * sizes[g]!, 1);
    expect([...halves[0]!, ...halves[1]!].sort((x, y) => x - y)).toEqual(core);
    const total = product(core);
    const larger = Math.max(product(halves[0]!), product(halves[1]!));
    expect(larger).toBeLessThan(2 ** 21);
    // Never below the square root of the whole: the best any split can do.
    expect(larger).toBeGreaterThanOrEqual(Math.sqrt(total));
  });
});
