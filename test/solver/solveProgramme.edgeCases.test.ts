import { describe, expect, it } from "vitest";
import { solveProgramme } from "../../src/solver/solveProgramme.js";
import type { EngineName, Programme } from "../../src/solver/types.js";

// Hand-worked programmes at the edges of the model; every engine must agree.
const ENGINES: readonly EngineName[] = ["exact", "highs", "lp-solver"];

describe.each(ENGINES)("edge cases, engine %s", (engine) => {
  it("solves an empty programme", async () => {
    const solution = await solveProgramme({ budget: 100, groups: [], constraints: [] }, { engine });
    expect(solution).toMatchObject({ status: "optimal", objective: 0, cost: 0, choice: [] });
  });

  it("takes free options with value even with a zero budget", async () => {
    const programme: Programme = {
      budget: 0,
      groups: [
        { id: "a", required: false, options: [{ cost: 0, value: 2 }, { cost: 5, value: 9 }] },
        { id: "b", required: false, options: [] },
        { id: "c", required: true, options: [{ cost: 0, value: 0 }] },
      ],
      constraints: [],
    };
    const solution = await solveProgramme(programme, { engine });
    expect(solution).toMatchObject({ status: "optimal", objective: 2, cost: 0, choice: [0, null, 0] });
  });

  it("funds nothing when no option has value", async () => {
    const programme: Programme = {
      budget: 50,
      groups: [{ id: "a", required: false, options: [{ cost: 10, value: 0 }, { cost: 0, value: 0 }] }],
      constraints: [],
    };
    const solution = await solveProgramme(programme, { engine });
    expect(solution.status).toBe("optimal");
    expect(solution.objective).toBe(0);
  });

  it("picks an LP-dominated option when the integer optimum needs it", async () => {
    // Budget 20: (10,5)+(10,5) = 10 beats (20,6) alone + nothing; with budget 20 and one site
    // each of options {10:5, 20:6, 30:12}: best single choice is 20:6 (30 does not fit), though
    // 20:6 lies below the chord from 10:5 to 30:12.
    const programme: Programme = {
      budget: 20,
      groups: [{ id: "a", required: false, options: [{ cost: 10, value: 5 }, { cost: 20, value: 6 }, { cost: 30, value: 12 }] }],
      constraints: [],
    };
    const solution = await solveProgramme(programme, { engine });
    expect(solution).toMatchObject({ status: "optimal", objective: 6, choice: [1] });
  });

  it("spends a budget exactly even when the sum of decimal costs rounds above it", async () => {
    // In binary floating point 0.1 + 0.2 + 0.3 = 0.6000000000000001 > 0.6 (IEEE 754 double).
    const programme: Programme = {
      budget: 0.6,
      groups: [0.1, 0.2, 0.3].map((cost, g) => ({ id: `s${g}`, required: false, options: [{ cost, value: 1 }] })),
      constraints: [],
    };
    const solution = await solveProgramme(programme, { engine });
    expect(solution).toMatchObject({ status: "optimal", objective: 3, choice: [0, 0, 0] });
  });
});
