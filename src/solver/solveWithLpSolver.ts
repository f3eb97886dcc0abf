import lpSolverExport from "javascript-lp-solver";
import type { ModelDefinition } from "javascript-lp-solver";
import type { EngineResult, Programme, SolveOptions } from "./types.js";

// The package's declarations describe its CommonJS build; under ESM the default export is the solver itself.
const lpSolver = lpSolverExport as unknown as { Solve(model: ModelDefinition): Record<string, unknown> };

/**
 * Largest programme handed to javascript-lp-solver. Its dense tableau and slow LP relaxation
 * (about 100 s at 200 sites when we measured it) make larger models hang rather than fail,
 * and its time limit is only checked between branch-and-bound nodes.
 */
export const LP_SOLVER_MAX_GROUPS = 300;

/**
 * Solves a programme with javascript-lp-solver (general simplex branch-and-bound, integer
 * variables via `ints`). Its output is untrusted: values must round to 0/1 within 1e-6 or the
 * answer is discarded; the facade then verifies feasibility. It reports no bound, so `optimal`
 * here means only that the search ended before the time limit (bound = NaN until verified).
 */
export function solveWithLpSolver(programme: Programme, options: Required<SolveOptions>): EngineResult {
  const { groups } = programme;
  const none = groups.map(() => null);
  if (groups.length > LP_SOLVER_MAX_GROUPS) {
    return {
      status: "not-solved",
      choice: none,
      bound: Number.NaN,
      budgetMarginalValue: Number.NaN,
      diagnosis: `The lp-solver engine is limited to ${LP_SOLVER_MAX_GROUPS} sites (this programme has ${groups.length}); use the exact or highs engine.`,
    };
  }
  const model = buildModel(programme, options.timeLimitSeconds);
  const started = Date.now();
  const result = lpSolver.Solve(model);
  const elapsedSeconds = (Date.now() - started) / 1000;
  if (result.feasible !== true) {
    return {
      status: "not-solved",
      choice: none,
      bound: Number.NaN,
      budgetMarginalValue: Number.NaN,
      diagnosis: "javascript-lp-solver found no feasible programme; it cannot prove infeasibility, so try the exact engine.",
    };
  }
  const choice: (number | null)[] = [];
  for (let g = 0; g < groups.length; g += 1) {
    let chosen: number | null = null;
    for (let a = 0; a < groups[g]!.options.length; a += 1) {
      const raw = result[variableName(g, a)];
      const x = typeof raw === "number" ? raw : 0;
      if (Math.abs(x - Math.round(x)) > 1e-6 || x < -1e-6 || x > 1 + 1e-6) {
        return {
          status: "not-solved",
          choice: none,
          bound: Number.NaN,
          budgetMarginalValue: Number.NaN,
          diagnosis: `javascript-lp-solver returned a fractional value (${x}) for site ${groups[g]!.id}; its answer was discarded.`,
        };
      }
      // More than one option set to 1 is left for the facade's verifier to reject.
      if (Math.round(x) === 1) chosen = chosen === null ? a : -1;
    }
    choice.push(chosen);
  }
  const timedOut = elapsedSeconds >= 0.95 * options.timeLimitSeconds;
  return {
    status: timedOut ? "time-limit" : "optimal",
    choice,
    bound: Number.NaN,
    budgetMarginalValue: Number.NaN,
  };
}

function variableName(g: number, a: number): string {
  return `x${g}_${a}`;
}

function buildModel(programme: Programme, timeLimitSeconds: number): ModelDefinition {
  const constraintsSpec: Record<string, { max?: number; min?: number; equal?: number }> = {
    budget: { max: programme.budget },
  };
  const variables: Record<string, Record<string, number>> = {};
  const ints: Record<string, 1> = {};
  programme.groups.forEach((group, g) => {
    constraintsSpec[`g${g}`] = group.required ? { equal: 1 } : { max: 1 };
    group.options.forEach((option, a) => {
      const name = variableName(g, a);
      const column: Record<string, number> = { value: option.value, budget: option.cost, [`g${g}`]: 1 };
      programme.constraints.forEach((constraint, k) => {
        const coefficient = constraint.coefficients[g]?.[a] ?? 0;
        if (coefficient !== 0) column[`s${k}`] = coefficient;
      });
      variables[name] = column;
      ints[name] = 1;
    });
  });
  programme.constraints.forEach((constraint, k) => {
    constraintsSpec[`s${k}`] = constraint.sense === "<=" ? { max: constraint.rhs } : { min: constraint.rhs };
  });
  return {
    optimize: "value",
    opType: "max",
    constraints: constraintsSpec,
    variables,
    ints,
    options: { tolerance: 0, timeout: Math.max(1, Math.round(timeLimitSeconds * 1000)) },
  };
}
