import type { Highs } from "highs";
import { NO_OPTION } from "./buildGroupHull.js";
import { buildRestrictedModel } from "./buildRestrictedModel.js";
import { checkSolution } from "./checkSolution.js";
import { propagateRows } from "./propagateRows.js";
import { relaxationMultipliers } from "./relaxationMultipliers.js";
import { runHighs } from "./runHighs.js";
import { bindingRow, FOCUS_ROUNDS, focusChoices, MAX_BINDING_ROWS_FOR_HALVES, MIN_TIED_GROUPS, SLICE_NODES } from "./halvesFocus.js";
import { HALF_LIMIT, searchCoreByHalves, type CoreSearch, type CoreSearchResult } from "./searchCoreByHalves.js";
import { OPTIMALITY_TOLERANCE } from "./solveSingleBudget.js";
import type { EngineResult, Programme, SolveOptions } from "./types.js";

/** First guess at how far (relative to the bound) a useful option's reduced value may fall. */
const FIRST_THRESHOLD = 1e-5;

/**
 * How many HiGHS answers that fail `checkSolution` (HiGHS accepted them within its own tolerance)
 * are cut off and re-solved before the engine stops with the best verified programme it holds.
 */
export const MAX_REJECTED_ANSWERS = 20;

/** Largest half listed when no subset-sum is suspected: cheap next to a HiGHS run. */
const SMALL_HALF_LIMIT = 1 << 12;

/**
 * The exact engine for programmes with side constraints (caps, floors, shares, counts):
 * 1. Lagrange multipliers mu >= 0 for the budget and every side row, at the LP relaxation's optimum
 *    (`relaxationMultipliers`: the Lagrangian dual by cutting planes, HiGHS's LP duals if that fails).
 * 2. The Lagrangian bound U = sum_k mu_k rhs_k + sum_g max_a (value - sum_k mu_k coef_k), valid for
 *    any mu >= 0 and equal to the LP optimum at the LP duals. A programme using an option whose
 *    reduced value falls d below its group's best is worth at most U - d.
 * 3. A restriction keeps only options with d <= delta (most groups keep one), then row tightening
 *    (`propagateRows`) drops the choices no feasible programme can make. When the groups left
 *    with a choice have at most about 2^42 programmes between them, the restriction is searched
 *    exhaustively by halves (`searchCoreByHalves`): a binding K+A share floor with K+A as the
 *    objective ties every option outside its scope and turns the restriction into a subset-sum
 *    that branch and bound cannot close. Otherwise HiGHS solves it with gap 0, warm-started from
 *    the best programme so far; when four or more groups tie exactly, a short first HiGHS run is
 *    followed by the halves search on the groups that move the binding row most, to improve that
 *    programme, before HiGHS goes on. If the restriction's optimum
 *    z satisfies U - z <= delta, no dropped option can do better and z is proven optimal;
 *    otherwise delta grows (tenfold at most, never past U - z, where the next pass is exact for
 *    certain). An infeasible restriction widens delta tenfold, up to the whole programme.
 * Every programme is verified with `checkSolution` before it counts. One that HiGHS accepted within
 * its own tolerance but that fails the check is cut off by a no-good row and the restriction
 * solved again; a verified incumbent is never dropped: if the search must stop (time limit, too
 * many rejected answers, an engine failure), it is returned as `time-limit` with a valid bound.
 */
export function solveWithSideConstraints(
  highs: Highs,
  programme: Programme,
  settings: Required<SolveOptions>,
  // Replaceable so tests can send every restriction to HiGHS.
  coreSearch: (search: CoreSearch) => CoreSearchResult = searchCoreByHalves,
): EngineResult {
  const started = Date.now();
  const deadline = started + settings.timeLimitSeconds * 1000;
  const secondsLeft = (): number => (deadline - Date.now()) / 1000;
  const { groups, constraints, budget } = programme;
  const none = groups.map(() => null);

  const relaxation = relaxationMultipliers(highs, programme, deadline);
  if (relaxation.status === "infeasible") {
    return { status: "infeasible", choice: none, bound: Number.NaN, budgetMarginalValue: Number.NaN };
  }
  if (relaxation.status !== "found") {
    return { status: "not-solved", choice: none, bound: Number.NaN, budgetMarginalValue: Number.NaN, diagnosis: `The LP relaxation did not finish (${relaxation.detail}).` };
  }
  // Multipliers on rows written as "<=" (a >= row negated).
  const budgetMultiplier = relaxation.budget;
  const signs = constraints.map((c) => (c.sense === "<=" ? 1 : -1));
  const multipliers = relaxation.constraints;

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
  const rowMultipliers = [budgetMultiplier, ...multipliers];
  // Groups where two or more choices tie exactly at the LP multipliers: the subset-sum signature.
  const tie = 1e-9 * scale;
  const tiedGroups = groups.filter((group, g) => reduced[g]!.filter((r) => best[g]! - r <= tie).length + (!group.required && best[g]! <= tie ? 1 : 0) >= 2).length;
  const bindingRows = rowMultipliers.filter((mu) => mu > 0).length;
  const degenerate = tiedGroups >= MIN_TIED_GROUPS && bindingRows <= MAX_BINDING_ROWS_FOR_HALVES;

  let threshold = FIRST_THRESHOLD * scale;
  let incumbent: { choice: (number | null)[]; objective: number } | undefined;
  // Proven bound on programmes inside the current restriction, when a pass stops unfinished.
  let restrictedBound = Number.POSITIVE_INFINITY;
  const rejected: (number | null)[][] = [];
  // How many short HiGHS runs the current threshold has had.
  let slicedAt = Number.NaN;
  let slices = 0;
  const accept = (choice: (number | null)[]): boolean => {
    const check = checkSolution(programme, choice);
    if (check.feasible && (incumbent === undefined || check.objective > incumbent.objective)) {
      incumbent = { choice, objective: check.objective };
    }
    return check.feasible;
  };
  // Stopping early: the best verified programme, with the LP bound tightened by what the pass proved.
  const stop = (why: string): EngineResult => {
    if (incumbent === undefined) {
      return { status: "not-solved", choice: none, bound: upper, budgetMarginalValue: budgetMultiplier, diagnosis: `No feasible programme was found before the search stopped (${why}).` };
    }
    const outside = Number.isFinite(threshold) ? upper - threshold : Number.NEGATIVE_INFINITY;
    const bound = Math.max(incumbent.objective, Math.min(upper, Math.max(restrictedBound, outside)));
    return { status: "time-limit", choice: incumbent.choice, bound, budgetMarginalValue: budgetMultiplier, diagnosis: `The search stopped before the optimum was proven (${why}); the best verified programme is reported with its bound.` };
  };
  const infeasible: EngineResult = { status: "infeasible", choice: none, bound: Number.NaN, budgetMarginalValue: budgetMultiplier };
  // After a restriction without any feasible programme: tenfold wider, then the whole programme.
  const widenTenfold = (t: number): number => (t * 10 > scale ? Number.POSITIVE_INFINITY : t * 10);
  const proven = (bound: number): EngineResult => ({
    status: "optimal",
    choice: incumbent!.choice,
    bound: Math.max(incumbent!.objective, bound),
    budgetMarginalValue: budgetMultiplier,
  });

  for (;;) {
    restrictedBound = Number.POSITIVE_INFINITY;
    // The Lagrangian bound holds for every programme: an incumbent within tolerance of it is optimal.
    if (incumbent !== undefined && upper - incumbent.objective <= tolerance) return proven(incumbent.objective);
    if (secondsLeft() <= 0) return stop("time limit");
    // Only options within U - z of their group's best can be in a programme better than the incumbent z.
    if (incumbent !== undefined && upper - incumbent.objective + tolerance < threshold) threshold = upper - incumbent.objective + tolerance;
    const widest = !Number.isFinite(threshold);
    // The incumbent's options always stay, so every restriction contains the best programme so far.
    const held = incumbent?.choice;
    const worthPicking = groups.map((group, g) => !group.required && best[g]! > threshold && (held === undefined || held[g] !== null));
    // Then drop what no feasible programme can use (it never drops the incumbent's options).
    const choices = propagateRows(
      programme,
      groups.map((group, g) => {
        const kept = group.options.flatMap((_, a) => (held?.[g] === a || best[g]! - reduced[g]![a]! <= threshold ? [a] : []));
        return group.required || worthPicking[g] ? kept : [NO_OPTION, ...kept];
      }),
    );
    if (choices.some((allowed) => allowed.length === 0)) {
      // No programme of the restriction meets every rule: widen it (the incumbent, if any, is in it, so there is none yet).
      if (widest) return infeasible;
      threshold = widenTenfold(threshold);
      continue;
    }
    const sortRow = bindingRow(programme, choices, rowMultipliers);

    // 1. The whole restriction by halves, when it is small enough.
    // Without ties HiGHS does well, so only small restrictions are listed, and only while a proof is in reach.
    const exhaustive = coreSearch({
      programme,
      choices,
      sortRow,
      floor: incumbent?.objective ?? Number.NEGATIVE_INFINITY,
      tolerance,
      deadline,
      halfLimit: degenerate ? HALF_LIMIT : SMALL_HALF_LIMIT,
      keepLooking: degenerate,
    });
    let verifiedAll = true;
    if (exhaustive.choice !== undefined) verifiedAll = accept(exhaustive.choice);
    if (exhaustive.status === "complete" && verifiedAll) {
      if (incumbent === undefined) {
        if (widest) return infeasible;
        threshold = widenTenfold(threshold);
        continue;
      }
      // Any programme using a dropped option is worth less than U - threshold.
      if (widest || upper - incumbent.objective <= threshold) return proven(incumbent.objective);
      threshold = Math.min(upper - incumbent.objective + tolerance, threshold * 10);
      continue;
    }

    // 2. HiGHS on the restriction. With ties, a short first run: if it does not finish, the halves
    // search improves its programme on the groups that move the binding row most (which narrows the
    // restriction) before HiGHS goes on.
    const model = buildRestrictedModel(highs, programme, choices, rejected);
    if (slicedAt !== threshold) slices = 0;
    const slice = degenerate && exhaustive.status === "too-large" && slices < SLICE_NODES.length;
    const sliceNodes = SLICE_NODES[slices];
    if (slice) {
      slicedAt = threshold;
      slices += 1;
    }
    const run = runHighs(highs, model.data, {
      timeLimitSeconds: secondsLeft(),
      // Limited by nodes, not seconds, so the answer does not depend on the machine.
      ...(slice ? { maxNodes: sliceNodes } : {}),
      relativeGap: settings.relativeGap,
      absoluteGap: tolerance,
      ...(incumbent === undefined ? {} : { start: model.start(incumbent.choice) }),
    });
    const choice = model.lift(run.colValue);
    // HiGHS's bound is on the open groups; the fixed ones add their value.
    const runBound = run.bound + model.fixedValue;
    if (choice !== undefined && run.status !== "failed" && !accept(choice)) {
      // HiGHS accepted it within its tolerance; the check did not: cut off exactly this point and solve again.
      rejected.push(choice);
      if (rejected.length > MAX_REJECTED_ANSWERS) return stop(`${rejected.length} HiGHS answers broke a rule by more than the 1e-9 tolerance`);
      continue;
    }
    if (run.status === "failed") return stop(run.detail);
    if (run.status === "time-limit") {
      if (Number.isFinite(runBound)) restrictedBound = runBound;
      if (!slice || secondsLeft() <= 0) return stop("time limit");
      // Then exact searches of neighbourhoods of the incumbent, until one brings nothing or the
      // Lagrangian bound proves it (in a subset-sum near-exact fills are many, but HiGHS rarely finds one).
      for (let round = 0; round < FOCUS_ROUNDS && incumbent !== undefined && upper - incumbent.objective > tolerance && secondsLeft() > 0; round += 1) {
        const focused = focusChoices(programme, choices, incumbent.choice, sortRow, round);
        const improved = coreSearch({ programme, choices: focused, sortRow, floor: incumbent.objective, tolerance, deadline });
        if (improved.choice !== undefined) accept(improved.choice);
      }
      continue;
    }
    if (run.status === "infeasible") {
      if (widest) return infeasible;
      threshold = widenTenfold(threshold);
      continue;
    }
    if (choice === undefined || incumbent === undefined) return stop("HiGHS gave no usable programme");
    // Any programme using a dropped option is worth less than U - threshold.
    if (widest || upper - incumbent.objective <= threshold) return proven(Number.isFinite(runBound) ? runBound : incumbent.objective);
    // Widen step by step: each solve improves the incumbent, which keeps the next restriction small.
    threshold = Math.min(upper - incumbent.objective + tolerance, threshold * 10);
  }
}
