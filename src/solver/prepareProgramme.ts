import { buildBudgetLayout, type BudgetLayout } from "./buildBudgetLayout.js";
import { buildGroupHull } from "./buildGroupHull.js";
import { canonicalGroupOrder } from "./canonicalGroupOrder.js";
import { diagnoseInfeasibility } from "./diagnoseInfeasibility.js";
import { loadHighs } from "./loadHighs.js";
import { pruneDominatedOptions } from "./pruneDominatedOptions.js";
import { reorderProgramme } from "./reorderProgramme.js";
import { solveSingleBudget } from "./solveSingleBudget.js";
import { solveWithHighs } from "./solveWithHighs.js";
import { solveWithLpSolver } from "./solveWithLpSolver.js";
import { solveWithSideConstraints } from "./solveWithSideConstraints.js";
import { validateBudget, validateProgramme } from "./validateProgramme.js";
import { emptySolution, verifyEngineResult } from "./verifyEngineResult.js";
import {
  DEFAULT_SOLVE_OPTIONS,
  type EngineName,
  type EngineResult,
  type GroupHull,
  type Programme,
  type ProgrammeGroup,
  type SideConstraint,
  type Solution,
  type SolveOptions,
} from "./types.js";

type ConcreteEngine = Exclude<EngineName, "auto">;

/** What changes between re-solves of one prepared programme; costs and sites stay fixed. */
export interface ProgrammeChange {
  readonly budget?: number;
  /** New value per option, values[g][a] in the programme's group and option order (uncertainty draws). */
  readonly values?: readonly (readonly number[])[];
  /** Replacement side constraints; rules whose coefficients depend on values must be recompiled by the caller. */
  readonly constraints?: readonly SideConstraint[];
}

/** A programme ready for many solves (budget frontier, uncertainty draws). */
export interface PreparedProgramme {
  readonly programme: Programme;
  /** Group g's cost-value hull and why each other option is off it (for justifications). */
  hull(group: number): GroupHull;
  /** Solves the programme with the change applied; every answer is verified as by `solveProgramme`. */
  solve(change?: ProgrammeChange): Promise<Solution>;
}

/**
 * Prepares a programme for repeated solving: the id order of the sites and, per set of values,
 * the hulls and sorted segments are built once and reused across budget levels, so a frontier of
 * 20-50 budgets costs little more than one solve; new values (same costs) rebuild only the
 * layout. Deterministic: the same programme and change give the same Solution.
 */
export function prepareProgramme(programme: Programme, options: Partial<SolveOptions> = {}): PreparedProgramme {
  validateProgramme(programme);
  const settings: Required<SolveOptions> = { ...DEFAULT_SOLVE_OPTIONS, ...options };
  const canonical = canonicalGroupOrder(programme.groups);
  const layouts = new Map<readonly ProgrammeGroup[], BudgetLayout>();
  const layoutFor = (groups: readonly ProgrammeGroup[]): BudgetLayout => {
    let layout = layouts.get(groups);
    if (layout === undefined) {
      // Keep the base layout and the latest draw only: draws are usually used once.
      for (const key of layouts.keys()) if (key !== programme.groups) layouts.delete(key);
      layout = buildBudgetLayout(canonical, groups);
      layouts.set(groups, layout);
    }
    return layout;
  };

  // The groups carrying one set of drawn values, kept while the caller re-uses that array.
  let drawn: { values: readonly (readonly number[])[]; groups: readonly ProgrammeGroup[] } | undefined;
  const groupsWithValues = (values: readonly (readonly number[])[] | undefined): readonly ProgrammeGroup[] => {
    if (values === undefined) return programme.groups;
    if (drawn?.values !== values) {
      const groups = programme.groups.map((group, g) => ({
        ...group,
        options: group.options.map((option, a) => ({ cost: option.cost, value: values[g]?.[a] ?? Number.NaN })),
      }));
      drawn = { values, groups };
    }
    return drawn.groups;
  };

  const runEngine = async (engine: ConcreteEngine, target: Programme): Promise<EngineResult> => {
    if (engine === "lp-solver") return solveWithLpSolver(target, settings);
    if (engine === "exact" && target.constraints.length === 0) return solveSingleBudget(layoutFor(target.groups), target.budget, settings);
    try {
      const highs = await loadHighs();
      const ordered = reorderProgramme(target, canonical);
      // The exact engine drops options another dominates in every row first; HiGHS, the reference, sees the model whole.
      const pruned = engine === "exact" ? pruneDominatedOptions(ordered) : undefined;
      const result =
        pruned !== undefined ? solveWithSideConstraints(highs, pruned.programme, settings) : solveWithHighs(highs, ordered, settings);
      const choice: (number | null)[] = new Array<number | null>(target.groups.length).fill(null);
      canonical.forEach((g, k) => {
        const picked = result.choice[k] ?? null;
        choice[g] = picked === null || pruned === undefined ? picked : pruned.kept[k]![picked]!;
      });
      return { ...result, choice };
    } catch (error) {
      // A WebAssembly fault (e.g. out of memory) is an engine outcome, not a programmer error.
      const detail = error instanceof Error ? error.message : String(error);
      return { status: "not-solved", choice: target.groups.map(() => null), bound: Number.NaN, budgetMarginalValue: Number.NaN, diagnosis: `HiGHS failed: ${detail}` };
    }
  };

  const solve = async (change: ProgrammeChange = {}): Promise<Solution> => {
    const target: Programme = {
      budget: change.budget ?? programme.budget,
      groups: groupsWithValues(change.values),
      constraints: change.constraints ?? programme.constraints,
    };
    // The prepared programme was validated whole; a budget-only change (a frontier level) needs only its budget checked.
    if (change.values !== undefined || change.constraints !== undefined) validateProgramme(target);
    else if (change.budget !== undefined) validateBudget(change.budget);
    // One engine per solve, never a silent second one: an answer says which engine gave it.
    const engine: ConcreteEngine = settings.engine === "auto" ? "exact" : settings.engine;
    const reason = diagnoseInfeasibility(target);
    if (reason !== undefined) return emptySolution(target, engine, "infeasible", reason);
    return verifyEngineResult(target, engine, await runEngine(engine, target));
  };

  return {
    programme,
    hull: (group) => buildGroupHull(programme.groups[group]!),
    solve,
  };
}
