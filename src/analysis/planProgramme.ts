import { solveProgramme, type Programme, type Solution, type SolveOptions } from "../solver/index.js";
import { buildProgramme } from "./buildProgramme.js";
import type { FundedProject } from "./fundedProject.js";
import type { PreparedPlan } from "./preparePlan.js";
import { justifyTiming, type ProjectTiming } from "./justifyTiming.js";
import { summariseSelection, type ProgrammeTotals } from "./summariseSelection.js";
import { summariseYears, type ProgrammeYearSummary } from "./summariseYears.js";

/** The optimal capital list at one budget, with what it achieves. */
export interface PlanResult {
  readonly prepared: PreparedPlan;
  readonly budget: number;
  readonly programme: Programme;
  readonly solution: Solution;
  readonly funded: readonly FundedProject[];
  readonly totals: ProgrammeTotals;
  /** In a multi-year programme: the programme year by year, and why each project is in its year. */
  readonly years?: readonly ProgrammeYearSummary[];
  readonly timing?: readonly ProjectTiming[];
}

/** Solves the prepared scenario at `budget` and gathers the funded projects and totals. */
export async function planProgramme(
  prepared: PreparedPlan,
  budget: number = prepared.scenario.budget,
  solveOptions: Partial<SolveOptions> = {},
): Promise<PlanResult> {
  const programme = buildProgramme(prepared.sites, prepared.scenario.rules, prepared.objective, budget, prepared.scenario.programme);
  const solution = await solveProgramme(programme, solveOptions);
  return assemblePlan(prepared, budget, programme, solution);
}

/** Turns a solver's choice vector back into funded projects and totals. */
export function assemblePlan(prepared: PreparedPlan, budget: number, programme: Programme, solution: Solution): PlanResult {
  const funded: FundedProject[] = [];
  solution.choice.forEach((index, group) => {
    if (index === null) return;
    const entry = prepared.sites[group]!;
    funded.push({ entry, alternative: entry.alternatives[index]!, index });
  });
  const totals = summariseSelection(funded.map((project) => project.alternative));
  const years = prepared.scenario.programme;
  if (years === undefined) return { prepared, budget, programme, solution, funded, totals };
  const byYear = summariseYears(funded, years, budget);
  const committed = new Set(years.committed.map((project) => project.site));
  return { prepared, budget, programme, solution, funded, totals, years: byYear, timing: justifyTiming(funded, years, byYear, committed) };
}
