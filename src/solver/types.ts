/**
 * The integer program averta solves, as plain numbers: pick at most one option per group
 * (exactly one when the group is required) so that total value is largest, total cost is
 * within the budget, and every side constraint holds.
 */

/** One alternative at one site, reduced to what the optimiser needs. */
export interface ProgrammeOption {
  /** Charged against the budget (capital cost). */
  readonly cost: number;
  /** What the objective counts (KSI avoided, or benefit PV). */
  readonly value: number;
}

/** One site: its options, of which at most one (exactly one if `required`) is chosen. */
export interface ProgrammeGroup {
  readonly id: string;
  readonly options: readonly ProgrammeOption[];
  readonly required: boolean;
}

/**
 * A linear side constraint over the option variables:
 * sum over groups g and options a of coefficients[g][a] * x[g][a]  (sense)  rhs.
 * Policy rules (district caps and floors, KSI share floors, project counts) compile to these.
 */
export interface SideConstraint {
  readonly id: string;
  /** Plain words for reports, e.g. "spend in district North <= 1,200,000". */
  readonly label: string;
  readonly sense: "<=" | ">=";
  readonly rhs: number;
  /** coefficients[g][a]; a missing row means all zero for that group. */
  readonly coefficients: readonly (readonly number[] | undefined)[];
}

/** The prepared optimisation model. */
export interface Programme {
  readonly budget: number;
  readonly groups: readonly ProgrammeGroup[];
  readonly constraints: readonly SideConstraint[];
}

/**
 * - `optimal`: proven best (within `relativeGap`, or floating-point tolerance when it is 0); `choice` verified.
 * - `time-limit`: stopped early; `choice` is the best verified feasible programme found, `bound` still holds.
 * - `infeasible`: no programme meets the budget, the must-fund sites and every rule; see `diagnosis`.
 * - `not-solved`: no trustworthy answer (model too large for the engine, engine failure, or an answer
 *   that failed verification); `choice` is all null and `diagnosis` says why.
 */
export type SolveStatus = "optimal" | "infeasible" | "time-limit" | "not-solved";

/**
 * Which engine solves: `auto` is the exact engine (no fallback to another one); `highs` and
 * `lp-solver` hand the whole programme to a general MIP solver, for checking.
 */
export type EngineName = "auto" | "exact" | "lp-solver" | "highs";

export interface SolveOptions {
  readonly engine: EngineName;
  /** Wall-clock limit in seconds for engines that honour one. */
  readonly timeLimitSeconds: number;
  /** Relative gap at which the search may stop and still report `optimal` (0 = proven exact). */
  readonly relativeGap: number;
}

export const DEFAULT_SOLVE_OPTIONS: Required<SolveOptions> = {
  engine: "auto",
  timeLimitSeconds: 60,
  relativeGap: 0,
};

/** What every engine returns. Outcomes are statuses, never exceptions. */
export interface Solution {
  readonly status: SolveStatus;
  /** Index of the chosen option in each group, or null for none. */
  readonly choice: readonly (number | null)[];
  readonly objective: number;
  readonly cost: number;
  /** Upper bound on the optimum (LP relaxation or better); NaN when none is known. */
  readonly bound: number;
  /** (bound - objective) / max(1, |bound|); NaN when the bound is unknown. */
  readonly gap: number;
  /**
   * Objective gained per extra currency unit of budget at the LP optimum (0 if the budget is
   * slack): the ratio of the critical hull segment, or the budget row's LP dual when there are
   * side constraints. NaN when unknown (lp-solver engine, or no programme exists).
   */
  readonly budgetMarginalValue: number;
  readonly engine: Exclude<EngineName, "auto">;
  /** Why the model is infeasible, in plain words, when it is. */
  readonly diagnosis?: string;
}

/**
 * What one engine hands to the facade before verification: the facade recomputes objective and
 * cost with `checkSolution` and never trusts an engine's own arithmetic.
 */
export interface EngineResult {
  readonly status: SolveStatus;
  /** Chosen option per group (all null unless status is `optimal` or `time-limit`). */
  readonly choice: readonly (number | null)[];
  /** Proven upper bound on the optimum; NaN when the engine proves none. */
  readonly bound: number;
  readonly budgetMarginalValue: number;
  readonly diagnosis?: string;
}

/** Why an option cannot sit on its site's cost-value hull. */
export interface RemovedOption {
  /** Option index within its group. */
  readonly option: number;
  /**
   * `dominated`: another option (or doing nothing) costs no more and gives at least as much;
   * it is never needed under a single budget. `lp-dominated`: it lies on or below the straight
   * line between two hull neighbours; the budget-only LP never picks it, though an integer
   * optimum still may.
   */
  readonly reason: "dominated" | "lp-dominated";
  /** For `dominated`: the better option, or null for doing nothing. For `lp-dominated`: the cheaper neighbour. */
  readonly by: number | null;
  /** For `lp-dominated`: the dearer neighbour. */
  readonly and?: number | null;
  /** Plain words, e.g. "dominated by option 2: costs more, avoids less". */
  readonly explanation: string;
}

/** A site's upper convex hull of (cost, value): the options a budget-only LP would ever pick. */
export interface GroupHull {
  /** Hull vertices in increasing cost: option indices, null for doing nothing. */
  readonly vertices: readonly (number | null)[];
  readonly removed: readonly RemovedOption[];
}
