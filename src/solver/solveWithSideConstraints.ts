import type { Highs } from "highs";
import { buildHighsModel, type HighsModel } from "./buildHighsModel.js";
import { checkSolution } from "./checkSolution.js";
import { readHighsChoice } from "./readHighsChoice.js";
import { runHighs } from "./runHighs.js";
import { OPTIMALITY_TOLERANCE } from "./solveSingleBudget.js";
import type { EngineResult, Programme, SolveOptions } from "./types.js";

/** First guess at how far (relative to the bound) a useful option's reduced value may fall. */
const FIRST_THRESHOLD = 1e-5;

/**
 * The exact engine for programmes with side constraints (caps, floors, shares, counts):
 * 1. LP relaxation of the whole programme by HiGHS; its row duals are Lagrange multipliers mu
 *    for the budget and every side row.
 * 2. The Lagrangian bound U = sum_k mu_k rhs_k + sum_g max_a (value - sum_k mu_k coef_k), valid for
 *    any mu >= 0 and equal to the LP optimum at the LP duals. A programme using an option whose
 *    reduced value falls d below its group's best is worth at most U - d.
 * 3. A restricted MIP keeps only options with d <= delta (most groups keep one) and is solved by
 *    HiGHS with gap 0, warm-started from the best programme so far. If its optimum z satisfies
 *    U - z <= delta, no dropped option can do better and z is proven optimal; otherwise delta
 *    grows (tenfold at most, never past U - z, where the next solve is exact for certain).
 *    An infeasible restriction widens delta tenfold, up to the whole programme.
 * The restricted models are a few percent of the full one, which is where the speed comes from.
 */
export function solveWithSideConstraints(highs: Highs, programme: Programme, settings: Required<SolveOptions>): EngineResult {
  const started = Date.now();
  const secondsLeft = (): number => settings.timeLimitSeconds - (Date.now() - started) / 1000;
  const { groups, constraints, budget } = programme;
  const none = groups.map(() => null);

  const relaxation = runHighs(highs, buildHighsModel(highs, programme, false).data, {
    timeLimitSeconds: secondsLeft(),
    relativeGap: 0,
    absoluteGap: 0,
  });
  if (relaxation.status === "infeasible") {
    return { status: "infeasible", choice: none, bound: Number.NaN, budgetMarginalValue: Number.NaN };
  }
  if (relaxation.status !== "optimal") {
    return { status: "not-solved", choice: none, bound: Number.NaN, budgetMarginalValue: Number.NaN, diagnosis: `The LP relaxation did not finish (${relaxation.detail}).` };
  }
  // Multipliers on rows written as "<=": a >= row is negated, so its multiplier is minus its dual.
  const budgetMultiplier = Math.max(0, relaxation.rowDual[0]!);
  const signs = constraints.map((c) => (c.sense === "<=" ? 1 : -1));
  const multipliers = constraints.map((_, k) => Math.max(0, signs[k]! * relaxation.rowDual[1 + groups.length + k]!));

  let upper = budgetMultiplier * budget;
  constraints.forEach((c, k) => {
    upper += multipliers[k]! * signs[k]! * c.rhs;
  });
  const reduced: Float64Array[] = [];
  const best = new Float64Array(groups.length);
  groups.forEach((group, g) => {
    const r = Float64Array.from(group.options, (option, a) => {
      let x = option.value - budgetMultiplier * option.cost;
      constraints.forEach((c, k) => {
        const coefficient = c.coefficients[g]?.[a] ?? 0;
        if (coefficient !== 0) x -= multipliers[k]! * signs[k]! * coefficient;
      });
      return x;
    });
    reduced.push(r);
    best[g] = Math.max(group.required ? Number.NEGATIVE_INFINITY : 0, ...r);
    upper += best[g]!;
  });
  const scale = Math.max(1, Math.abs(upper));
  const tolerance = Math.max(OPTIMALITY_TOLERANCE, settings.relativeGap) * scale;

  let threshold = FIRST_THRESHOLD * scale;
  let incumbent: { choice: (number | null)[]; objective: number } | undefined;
  for (;;) {
    const widest = !Number.isFinite(threshold);
    // The incumbent's options always stay, so every restriction contains the best programme so far.
    const held = incumbent?.choice;
    const keep = groups.map((group, g) =>
      group.options.map((_, a) => held?.[g] === a || best[g]! - reduced[g]![a]! <= threshold),
    );
    const mustPick = groups.map((group, g) => !group.required && best[g]! > threshold && (held === undefined || held[g] !== null));
    const model = buildHighsModel(highs, programme, true, { keep, mustPick });
    const run = runHighs(highs, model.data, {
      timeLimitSeconds: secondsLeft(),
      relativeGap: settings.relativeGap,
      absoluteGap: tolerance,
      ...(incumbent === undefined ? {} : { start: startingPoint(model, incumbent.choice) }),
    });
    const choice = readHighsChoice(model, run.colValue, groups.length);
    let verified = false;
    if (choice !== undefined && run.status !== "failed") {
      const check = checkSolution(programme, choice);
      verified = check.feasible;
      if (check.feasible && (incumbent === undefined || check.objective > incumbent.objective)) {
        incumbent = { choice, objective: check.objective };
      }
    }
    if (run.status === "time-limit" || run.status === "failed" || secondsLeft() <= 0) {
      if (incumbent === undefined) {
        return { status: "not-solved", choice: none, bound: upper, budgetMarginalValue: budgetMultiplier, diagnosis: `No feasible programme was found before the time limit (${run.detail}).` };
      }
      return { status: "time-limit", choice: incumbent.choice, bound: upper, budgetMarginalValue: budgetMultiplier };
    }
    if (run.status === "infeasible") {
      if (widest) return { status: "infeasible", choice: none, bound: Number.NaN, budgetMarginalValue: budgetMultiplier };
      threshold = threshold * 10 > scale ? Number.POSITIVE_INFINITY : threshold * 10;
      continue;
    }
    if (!verified || incumbent === undefined) {
      return { status: "not-solved", choice: none, bound: upper, budgetMarginalValue: budgetMultiplier, diagnosis: "HiGHS returned a programme that failed verification." };
    }
    // Any programme using a dropped option is worth less than U - threshold.
    if (widest || upper - incumbent.objective <= threshold) {
      const bound = Math.max(incumbent.objective, Number.isFinite(run.bound) ? run.bound : incumbent.objective);
      return { status: "optimal", choice: incumbent.choice, bound, budgetMarginalValue: budgetMultiplier };
    }
    // Widen step by step: each solve improves the incumbent, which keeps the next restriction small.
    threshold = Math.min(upper - incumbent.objective + tolerance, threshold * 10);
  }
}

// The incumbent as column values of a restricted model (its options are always kept there).
function startingPoint(model: HighsModel, choice: readonly (number | null)[]): Float64Array {
  return Float64Array.from(model.columnGroup, (g, j) => (choice[g] === model.columnOption[j] ? 1 : 0));
}
