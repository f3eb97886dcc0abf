import type { Highs, ModelData } from "highs";
import { FEASIBILITY_RELATIVE_TOLERANCE } from "./checkSolution.js";

/** What one HiGHS run left behind, copied out before the model is disposed. */
export interface HighsRun {
  /** `time-limit`: stopped by the time, node or iteration limit before a proof. */
  readonly status: "optimal" | "infeasible" | "time-limit" | "failed";
  /** Column values; empty when HiGHS holds no feasible point. */
  readonly colValue: Float64Array;
  /** Row duals (LP runs only, when HiGHS calls them feasible; for a maximisation a binding <= row has a positive dual). */
  readonly rowDual: Float64Array;
  /** Proven upper bound (MIP dual bound, or the LP optimum). */
  readonly bound: number;
  readonly detail: string;
}

export interface HighsRunSettings {
  readonly timeLimitSeconds: number;
  /** mip_rel_gap: 0 for a proof (HiGHS's default 1e-4 stops at suboptimal answers it calls optimal). */
  readonly relativeGap: number;
  /** mip_abs_gap, in objective units. */
  readonly absoluteGap: number;
  /** A feasible 0-1 point to start the MIP search from (one value per column). */
  readonly start?: Float64Array;
  /** Most branch-and-bound nodes (mip_max_nodes): a limit that, unlike time, gives the same answer on every machine. */
  readonly maxNodes?: number;
}

/**
 * HiGHS's primal and MIP feasibility tolerances: the relative slack `checkSolution` allows
 * (1e-9 of a row's magnitude, never less than 1e-9), so that HiGHS's own defaults (1e-7 on rows,
 * 1e-6 on integrality) cannot hand back a programme that breaks a rule by more than the check
 * accepts. Near a rule with right-hand side 0 (a K+A share floor) the defaults let HiGHS exploit
 * the slack; what still slips through is caught by the check and cut off by the caller.
 */
export const HIGHS_FEASIBILITY_TOLERANCE = FEASIBILITY_RELATIVE_TOLERANCE;

/**
 * Runs HiGHS on one model and always disposes it. Options: no output, the given gaps and time
 * limit (HiGHS can overrun its time limit during set-up on very large models; callers that need
 * a hard stop run it in a worker thread), and feasibility tolerances of 1e-9.
 */
export function runHighs(highs: Highs, data: ModelData, settings: HighsRunSettings): HighsRun {
  // A model without columns (no site has options, or every site is fixed) is solved by choosing
  // nothing, if every row allows 0 (a no-good row on the only point does not); HiGHS is not asked.
  if (data.numCols === 0) {
    const zeroFits = Array.from(data.rowLower, (lower, r) => lower <= 1e-9 && data.rowUpper[r]! >= -1e-9).every(Boolean);
    if (!zeroFits) return { status: "infeasible", colValue: new Float64Array(0), rowDual: new Float64Array(0), bound: Number.NaN, detail: "infeasible" };
    return { status: "optimal", colValue: new Float64Array(0), rowDual: new Float64Array(data.numRows), bound: 0, detail: "empty" };
  }
  const model = highs.createModel(data);
  try {
    model.options.set({
      output_flag: false,
      mip_rel_gap: settings.relativeGap,
      mip_abs_gap: settings.absoluteGap,
      time_limit: Math.max(0.001, settings.timeLimitSeconds),
      primal_feasibility_tolerance: HIGHS_FEASIBILITY_TOLERANCE,
      mip_feasibility_tolerance: HIGHS_FEASIBILITY_TOLERANCE,
      ...(settings.maxNodes === undefined ? {} : { mip_max_nodes: settings.maxNodes }),
    });
    if (settings.start !== undefined) model.setSolution({ colValue: settings.start });
    const { modelStatus } = model.run();
    const codes = highs.constants.modelStatus;
    const integer = data.integrality !== undefined;
    const hasPoint = Number(model.info.get("primal_solution_status")) === 2;
    // An LP's duals can be feasible when its point misses the 1e-9 row tolerance by rounding: keep them.
    const hasDuals = !integer && Number(model.info.get("dual_solution_status")) === 2;
    const solution = hasPoint || hasDuals ? model.getSolution() : undefined;
    const colValue = hasPoint ? solution!.colValue : new Float64Array(0);
    const rowDual = !integer && solution !== undefined ? solution.rowDual : new Float64Array(0);
    const bound = integer ? Number(model.info.get("mip_dual_bound")) : hasPoint ? model.getObjectiveValue() : Number.NaN;
    if (modelStatus === codes.optimal) return { status: "optimal", colValue, rowDual, bound, detail: "optimal" };
    if (modelStatus === codes.infeasible || modelStatus === codes.unboundedOrInfeasible) {
      return { status: "infeasible", colValue: new Float64Array(0), rowDual, bound: Number.NaN, detail: "infeasible" };
    }
    if (modelStatus === codes.timeLimit || modelStatus === codes.interrupted || modelStatus === codes.iterationLimit || modelStatus === codes.solutionLimit) {
      return { status: "time-limit", colValue, rowDual, bound, detail: `stopped with model status ${modelStatus}` };
    }
    return { status: "failed", colValue, rowDual, bound: Number.NaN, detail: `HiGHS ended with model status ${modelStatus}` };
  } catch (error) {
    const detail = error instanceof Error ? error.message : String(error);
    return { status: "failed", colValue: new Float64Array(0), rowDual: new Float64Array(0), bound: Number.NaN, detail };
  } finally {
    model.dispose();
  }
}
