import { prepareProgramme, type SolveOptions } from "../solver/index.js";
import { buildProgramme } from "./buildProgramme.js";
import { assemblePlan, type PlanResult } from "./planProgramme.js";
import type { PreparedPlan } from "./preparePlan.js";

/** The optimal list at one budget level of a frontier. */
export interface FrontierLevel {
  readonly budget: number;
  readonly plan: PlanResult;
}

/** Evenly spaced budget levels from `from` to `to` inclusive (`steps` intervals, so steps + 1 levels). */
export function budgetLevels(from: number, to: number, steps: number): number[] {
  if (!(steps >= 1) || !Number.isInteger(steps)) throw new RangeError(`steps must be a whole number >= 1, got ${steps}`);
  if (!(to >= from)) throw new RangeError(`budget range must rise: from ${from} to ${to}`);
  // Whole currency units: a level of 4,820,766.67 reads as noise in a finance table.
  return Array.from({ length: steps + 1 }, (_, index) => (index === steps ? to : Math.round(from + ((to - from) * index) / steps)));
}

/**
 * Solves the prepared scenario to optimality at each budget level, in the order given. The
 * programme is prepared once, so the hulls and their sort are shared by every level.
 */
export async function budgetFrontier(
  prepared: PreparedPlan,
  levels: readonly number[],
  solveOptions: Partial<SolveOptions> = {},
  // Called after each level: a programme's levels take seconds each, so the CLI shows a bar on a terminal.
  onLevel?: (done: number, total: number) => void,
): Promise<FrontierLevel[]> {
  const frontier: FrontierLevel[] = [];
  if (levels.length === 0) return frontier;
  const { rules, programme: years } = prepared.scenario;
  const build = (budget: number) => buildProgramme(prepared.sites, rules, prepared.objective, budget, years);
  const solver = prepareProgramme(build(levels[0]!), solveOptions);
  for (const budget of levels) {
    // In a multi-year programme every year's budget row scales with the level.
    const constraints = years === undefined ? solver.programme.constraints : build(budget).constraints;
    const solution = await solver.solve(years === undefined ? { budget } : { budget, constraints });
    frontier.push({ budget, plan: assemblePlan(prepared, budget, { ...solver.programme, budget, constraints }, solution) });
    onLevel?.(frontier.length, levels.length);
  }
  return frontier;
}
