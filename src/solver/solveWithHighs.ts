import type { Highs } from "highs";
import { buildHighsModel } from "./buildHighsModel.js";
import { checkSolution } from "./checkSolution.js";
import { readHighsChoice } from "./readHighsChoice.js";
import { runHighs } from "./runHighs.js";
import { OPTIMALITY_TOLERANCE } from "./solveSingleBudget.js";
import { MAX_REJECTED_ANSWERS } from "./solveWithSideConstraints.js";
import type { EngineResult, Programme, SolveOptions } from "./types.js";

/**
 * The general MIP engine: the whole programme handed to HiGHS (branch-and-cut), with
 * mip_rel_gap set to the requested gap (0 by default, so `optimal` is a proof) and an absolute
 * gap of 1e-10 x the LP bound. An LP relaxation is solved first for the budget's dual value. An
 * answer HiGHS accepts within its tolerance but `checkSolution` refuses is cut off by a no-good row
 * and the model solved again (at most MAX_REJECTED_ANSWERS times).
 */
export function solveWithHighs(highs: Highs, programme: Programme, settings: Required<SolveOptions>): EngineResult {
  const started = Date.now();
  const none = programme.groups.map(() => null);
  const relaxation = runHighs(highs, buildHighsModel(highs, programme, false).data, {
    timeLimitSeconds: settings.timeLimitSeconds,
    relativeGap: 0,
    absoluteGap: 0,
  });
  if (relaxation.status === "infeasible") {
    return { status: "infeasible", choice: none, bound: Number.NaN, budgetMarginalValue: Number.NaN };
  }
  const lpBound = relaxation.status === "optimal" ? relaxation.bound : Number.NaN;
  const budgetMarginalValue = relaxation.status === "optimal" ? Math.max(0, relaxation.rowDual[0] ?? 0) : Number.NaN;
  const rejected: (number | null)[][] = [];
  for (;;) {
    const model = buildHighsModel(highs, programme, true, undefined, rejected);
    const run = runHighs(highs, model.data, {
      timeLimitSeconds: settings.timeLimitSeconds - (Date.now() - started) / 1000,
      relativeGap: settings.relativeGap,
      absoluteGap: Number.isNaN(lpBound) ? 1e-9 : OPTIMALITY_TOLERANCE * Math.max(1, Math.abs(lpBound)),
    });
    if (run.status === "infeasible") {
      return { status: "infeasible", choice: none, bound: Number.NaN, budgetMarginalValue };
    }
    const choice = readHighsChoice(model, run.colValue, programme.groups.length);
    if (choice === undefined || run.status === "failed") {
      return { status: "not-solved", choice: none, bound: Number.NaN, budgetMarginalValue, diagnosis: `HiGHS gave no usable programme (${run.detail}).` };
    }
    if (checkSolution(programme, choice).feasible || rejected.length >= MAX_REJECTED_ANSWERS || run.status === "time-limit") {
      return { status: run.status, choice, bound: run.bound, budgetMarginalValue };
    }
    rejected.push(choice);
  }
}
