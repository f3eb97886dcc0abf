import type { Highs, ModelData } from "highs";
import { describe, expect, it } from "vitest";
import { buildHighsModel } from "../../src/solver/buildHighsModel.js";
import { checkSolution, FEASIBILITY_RELATIVE_TOLERANCE } from "../../src/solver/checkSolution.js";
import { loadHighs } from "../../src/solver/loadHighs.js";
import { readHighsChoice } from "../../src/solver/readHighsChoice.js";
import { runHighs } from "../../src/solver/runHighs.js";
import type { CoreSearchResult } from "../../src/solver/searchCoreByHalves.js";
import { MAX_REJECTED_ANSWERS, solveWithSideConstraints } from "../../src/solver/solveWithSideConstraints.js";
import { DEFAULT_SOLVE_OPTIONS, type Programme } from "../../src/solver/types.js";
import { verifyEngineResult } from "../../src/solver/verifyEngineResult.js";
import { bruteForceOptimum } from "./bruteForceOptimum.js";
import { randomProgramme } from "./randomProgramme.js";

// References: exhaustive enumeration (bruteForceOptimum); the "lying" HiGHS below is the real
// solver with its integer answers replaced, to reproduce an answer HiGHS accepts within its own
// tolerance that checkSolution refuses.

/**
 * The real HiGHS, except that integer runs number `lieOn(call)` true report "optimal" with every
 * column set to 1: a point that picks several options per site, which checkSolution must refuse.
 */
function lyingHighs(real: Highs, lieOn: (call: number) => boolean): { highs: Highs; calls: () => number } {
  let integerRuns = 0;
  const bind = (target: object, key: string | symbol): unknown => {
    const value: unknown = Reflect.get(target, key);
    return typeof value === "function" ? (value as (...args: unknown[]) => unknown).bind(target) : value;
  };
  const highs = new Proxy(real, {
    get(target, key) {
      if (key !== "createModel") return bind(target, key);
      return (data: ModelData) => {
        const model = target.createModel(data);
        if (data.integrality === undefined) return model;
        integerRuns += 1;
        if (!lieOn(integerRuns)) return model;
        const info = new Proxy(model.info, { get: (i, k) => (k === "get" ? (name: string) => (name === "primal_solution_status" ? 2 : i.get(name as never)) : bind(i, k)) });
        return new Proxy(model, {
          get(m, k) {
            if (k === "run") return () => ({ ...m.run(), modelStatus: real.constants.modelStatus.optimal });
            if (k === "getSolution") return () => ({ ...m.getSolution(), colValue: new Float64Array(data.numCols).fill(1) });
            if (k === "info") return info;
            return bind(m, k);
          },
        });
      };
    },
  });
  return { highs, calls: () => integerRuns };
}

// Every restriction goes to HiGHS: the halves search is replaced by one that lists nothing.
const tooLarge = (): CoreSearchResult => ({ status: "too-large", objective: Number.NEGATIVE_INFINITY });

function programmeWithRules(seed: number): Programme {
  return randomProgramme(seed, { groups: 6, maxOptions: 4, sideConstraints: true, requiredChance: 0, budgetShare: 0.4 });
}

describe("solveWithSideConstraints keeps what it has verified", () => {
  it("cuts off a HiGHS answer that fails the check and solves again, reaching the enumerated optimum", async () => {
    const real = await loadHighs();
    let solved = 0;
    let lied = 0;
    for (let seed = 1; seed <= 20; seed += 1) {
      const programme = programmeWithRules(seed);
      const reference = bruteForceOptimum(programme).objective;
      if (reference === null) continue;
      const lying = lyingHighs(real, (call) => call === 1);
      const raw = solveWithSideConstraints(lying.highs, programme, DEFAULT_SOLVE_OPTIONS, tooLarge);
      const solution = verifyEngineResult(programme, "exact", raw);
      // All ones is a real programme when each site kept one option; then HiGHS was not asked again.
      if (lying.calls() >= 2) lied += 1;
      expect(solution.status, `seed ${seed}`).toBe("optimal");
      expect(solution.objective, `seed ${seed}`).toBe(reference);
      solved += 1;
    }
    expect(solved).toBeGreaterThanOrEqual(15);
    expect(lied).toBeGreaterThanOrEqual(10);
  });

  it("returns its verified incumbent as time-limit, with bound and gap, when HiGHS keeps failing the check", async () => {
    const real = await loadHighs();
    const programme = programmeWithRules(3);
    const reference = bruteForceOptimum(programme).objective!;
    // The halves search hands over one feasible programme (the first site's cheapest option, or nothing) without a proof.
    const nothing: (number | null)[] = programme.groups.map(() => null);
    expect(checkSolution(programme, nothing).feasible).toBe(true);
    const incomplete = (): CoreSearchResult => ({ status: "incomplete", choice: [...nothing], objective: 0 });
    const lying = lyingHighs(real, () => true);
    const raw = solveWithSideConstraints(lying.highs, programme, DEFAULT_SOLVE_OPTIONS, incomplete);
    const solution = verifyEngineResult(programme, "exact", raw);
    // Where row tightening leaves a site one option, "every column 1" is a real programme and is kept;
    // every other answer is refused, and the search stops after the 21st refusal.
    expect(lying.calls()).toBeGreaterThanOrEqual(MAX_REJECTED_ANSWERS + 1);
    expect(solution.status).toBe("time-limit");
    expect(checkSolution(programme, solution.choice).feasible).toBe(true);
    expect(solution.objective).toBeGreaterThanOrEqual(0);
    expect(Number.isFinite(solution.bound)).toBe(true);
    expect(solution.bound).toBeGreaterThanOrEqual(reference - 1e-9);
    expect(solution.gap).toBeGreaterThanOrEqual(0);
    expect(solution.diagnosis).toMatch(/broke a rule/);
  });

  it("never reports a list the check refuses, even from HiGHS alone", async () => {
    const real = await loadHighs();
    for (let seed = 21; seed <= 30; seed += 1) {
      const programme = programmeWithRules(seed);
      const solution = verifyEngineResult(programme, "exact", solveWithSideConstraints(lyingHighs(real, (call) => call % 2 === 1).highs, programme, DEFAULT_SOLVE_OPTIONS, tooLarge));
      if (solution.status === "optimal" || solution.status === "time-limit") expect(checkSolution(programme, solution.choice).feasible, `seed ${seed}`).toBe(true);
      const reference = bruteForceOptimum(programme).objective;
      expect(solution.status, `seed ${seed}`).toBe(reference === null ? "infeasible" : "optimal");
    }
  });
});

describe("HiGHS settings and no-good rows", () => {
  it("asks HiGHS for the same 1e-9 feasibility tolerance as checkSolution", async () => {
    const real = await loadHighs();
    const seen: Record<string, unknown>[] = [];
    const recording = new Proxy(real, {
      get(target, key) {
        if (key !== "createModel") {
          const value: unknown = Reflect.get(target, key);
          return typeof value === "function" ? (value as () => unknown).bind(target) : value;
        }
        return (data: ModelData) => {
          const model = target.createModel(data);
          const set = model.options.set.bind(model.options);
          model.options.set = ((values: Record<string, unknown>) => {
            seen.push(values);
            return set(values as never);
          }) as typeof model.options.set;
          return model;
        };
      },
    });
    const programme = programmeWithRules(5);
    runHighs(recording, buildHighsModel(recording, programme, true).data, { timeLimitSeconds: 10, relativeGap: 0, absoluteGap: 0 });
    expect(seen).toHaveLength(1);
    expect(seen[0]).toMatchObject({ primal_feasibility_tolerance: FEASIBILITY_RELATIVE_TOLERANCE, mip_feasibility_tolerance: FEASIBILITY_RELATIVE_TOLERANCE });
  });

  it("a no-good row cuts off exactly the excluded programme: the next answer is the enumerated second best", async () => {
    const highs = await loadHighs();
    for (let seed = 40; seed <= 49; seed += 1) {
      const programme = programmeWithRules(seed);
      const values = enumerateFeasible(programme);
      if (values.length < 2) continue;
      const first = buildHighsModel(highs, programme, true);
      const best = readHighsChoice(first, runHighs(highs, first.data, { timeLimitSeconds: 10, relativeGap: 0, absoluteGap: 0 }).colValue, programme.groups.length)!;
      expect(checkSolution(programme, best).objective, `seed ${seed}`).toBe(values[0]);
      const second = buildHighsModel(highs, programme, true, undefined, [best]);
      const next = readHighsChoice(second, runHighs(highs, second.data, { timeLimitSeconds: 10, relativeGap: 0, absoluteGap: 0 }).colValue, programme.groups.length)!;
      expect(next, `seed ${seed}`).not.toEqual(best);
      // Another programme may tie with the best; the cut removes only the one excluded.
      expect(checkSolution(programme, next).objective, `seed ${seed}`).toBe(values[1]);
    }
  });
});

// Objectives of every feasible programme, best first (by enumeration, with the check as the judge).
function enumerateFeasible(programme: Programme): number[] {
  const values: number[] = [];
  const choice: (number | null)[] = programme.groups.map(() => null);
  const visit = (g: number): void => {
    if (g === programme.groups.length) {
      const check = checkSolution(programme, choice);
      if (check.feasible) values.push(check.objective);
      return;
    }
    const group = programme.groups[g]!;
    if (!group.required) {
      choice[g] = null;
      visit(g + 1);
    }
    group.options.forEach((_, a) => {
      choice[g] = a;
      visit(g + 1);
    });
    choice[g] = null;
  };
  visit(0);
  return values.sort((x, y) => y - x);
}
