import type { Highs } from "highs";
import { buildHighsModel } from "./buildHighsModel.js";
import { lagrangianMultipliers, rowForm } from "./lagrangianMultipliers.js";
import { lpBudgetMarginalValue } from "./lpBudgetMarginalValue.js";
import { runHighs } from "./runHighs.js";
import type { Programme } from "./types.js";

/** Multipliers of the LP relaxation's rows, each >= 0 on its row written as "<=" (>= rows negated). */
export type RelaxationMultipliers =
  | { readonly status: "found"; readonly budget: number; readonly constraints: readonly number[]; readonly method: "lagrangian" | "highs-lp" }
  | { readonly status: "infeasible" }
  | { readonly status: "not-solved"; readonly detail: string };

/**
 * The relaxation's multipliers, by the Lagrangian dual first (`lagrangianMultipliers`, started from
 * the budget's LP rate without the side rows): on 20,000 sites with caps, a K+A share floor and a
 * count it reaches the LP optimum to about 1e-15 in about 50 evaluations and 0.7 s, where HiGHS's
 * LP takes about 20 s. When it does not converge (an infeasible relaxation has an unbounded dual,
 * or the iterations run out), HiGHS solves the LP and its row duals are used, as before.
 * Both are exact where it matters: any multipliers give a valid bound, and the caller proves the
 * optimum against that bound.
 */
export function relaxationMultipliers(highs: Highs, programme: Programme, deadline: number): RelaxationMultipliers {
  const form = rowForm(programme);
  const start = new Float64Array(form.rowCount);
  start[0] = lpBudgetMarginalValue({ ...programme, constraints: [] }) ?? 0;
  const dual = lagrangianMultipliers(highs, programme, form, start, deadline);
  if (dual.converged) return { status: "found", budget: dual.multipliers[0]!, constraints: Array.from(dual.multipliers.subarray(1)), method: "lagrangian" };

  const relaxation = runHighs(highs, buildHighsModel(highs, programme, false).data, {
    timeLimitSeconds: (deadline - Date.now()) / 1000,
    relativeGap: 0,
    absoluteGap: 0,
  });
  if (relaxation.status === "infeasible") return { status: "infeasible" };
  if (relaxation.status !== "optimal") return { status: "not-solved", detail: relaxation.detail };
  const { groups, constraints } = programme;
  // HiGHS can end "optimal" with no solution to hand back (its point misses the 1e-9 row tolerance by
  // rounding on rows of 1e7): without duals, the Lagrangian's own multipliers bound just as validly.
  if (relaxation.rowDual.length < 1 + groups.length + constraints.length) {
    return { status: "found", budget: dual.multipliers[0]!, constraints: Array.from(dual.multipliers.subarray(1)), method: "lagrangian" };
  }
  return {
    status: "found",
    budget: Math.max(0, relaxation.rowDual[0]!),
    // A >= row is negated, so its multiplier is minus its dual.
    constraints: constraints.map((c, k) => Math.max(0, (c.sense === "<=" ? 1 : -1) * relaxation.rowDual[1 + groups.length + k]!)),
    method: "highs-lp",
  };
}
