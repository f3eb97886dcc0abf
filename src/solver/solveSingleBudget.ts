import { branchAndBoundCore } from "./branchAndBoundCore.js";
import type { BudgetLayout } from "./buildBudgetLayout.js";
import type { EngineResult, SolveOptions } from "./types.js";

/**
 * Relative tolerance at which the exact engines call a programme optimal: bounds within
 * 1e-10 x max(1, |bound|) of the incumbent are treated as equal. It only absorbs floating-point
 * rounding in sums of up to ~10^5 terms (about 1e-12 relative), so `optimal` means optimal.
 */
export const OPTIMALITY_TOLERANCE = 1e-10;

/**
 * The dedicated exact engine for the single-budget structure (multiple-choice knapsack):
 * 1. LP relaxation by taking hull segments in ratio order; the critical segment's ratio is the
 *    budget's marginal value lambda, and lambda x budget + sum of each group's best value - lambda x cost
 *    is the upper bound U (Lagrangian form, equal to the LP optimum).
 * 2. A greedy incumbent: the rounded-down LP filled with every later segment that still fits.
 * 3. Reduced-cost fixing: an option whose reduced value falls more than U - incumbent below its
 *    group's best cannot be in any better programme; most groups keep a single option.
 * 4. Branch-and-bound (`branchAndBoundCore`) over the few groups left (the core), first at a
 *    32x tighter threshold for a quick better incumbent, then widening until the proof holds.
 * Returns `optimal` only when the search finished; the bound is then within the tolerance.
 */
export function solveSingleBudget(layout: BudgetLayout, budget: number, settings: Required<SolveOptions>): EngineResult {
  const started = Date.now();
  const { canonical, hulls, costs, values } = layout;
  const n = canonical.length;
  const choice: (number | null)[] = new Array<number | null>(n).fill(null);
  const remaining0 = budget - layout.baseCost;
  if (remaining0 < 0) {
    return { status: "infeasible", choice, bound: Number.NaN, budgetMarginalValue: Number.NaN };
  }
  const cost = (g: number, a: number): number => (a < 0 ? 0 : costs[g]![a]!);
  const value = (g: number, a: number): number => (a < 0 ? 0 : values[g]![a]!);

  // 1. LP relaxation.
  const level = new Int32Array(n);
  let remaining = remaining0;
  let lpValue = layout.baseValue;
  let critical = -1;
  const segments = layout.segmentGroup.length;
  for (let s = 0; s < segments; s += 1) {
    if (layout.segmentCost[s]! <= remaining) {
      remaining -= layout.segmentCost[s]!;
      lpValue += layout.segmentValue[s]!;
      level[layout.segmentGroup[s]!] += 1;
    } else {
      critical = s;
      break;
    }
  }
  const setChoice = (k: number, a: number): void => {
    choice[canonical[k]!] = a < 0 ? null : a;
  };
  if (critical < 0) {
    // Every group can have its best option: the LP optimum is integral and the budget is slack.
    for (let k = 0; k < n; k += 1) setChoice(k, hulls[k]!.vertices[level[k]!]!);
    return { status: "optimal", choice, bound: lpValue, budgetMarginalValue: 0 };
  }
  const lambda = layout.segmentRatio[critical]!;

  // 2. Greedy incumbent.
  let incumbentValue = lpValue;
  let left = remaining;
  for (let s = critical + 1; s < segments; s += 1) {
    const k = layout.segmentGroup[s]!;
    if (level[k] !== layout.segmentFrom[s]! || layout.segmentCost[s]! > left) continue;
    left -= layout.segmentCost[s]!;
    incumbentValue += layout.segmentValue[s]!;
    level[k] += 1;
  }
  const incumbent: Int32Array = Int32Array.from(level, (p, k) => hulls[k]!.vertices[p]!);

  // 3. Lagrangian bound and reduced-cost fixing.
  const best = new Float64Array(n);
  let upper = lambda * budget;
  for (let k = 0; k < n; k += 1) {
    const g = canonical[k]!;
    let h = Number.NEGATIVE_INFINITY;
    for (const a of hulls[k]!.undominated) h = Math.max(h, value(g, a) - lambda * cost(g, a));
    best[k] = h;
    upper += h;
  }
  const tolerance = Math.max(OPTIMALITY_TOLERANCE, settings.relativeGap) * Math.max(1, Math.abs(upper));
  if (upper - incumbentValue <= tolerance) {
    for (let k = 0; k < n; k += 1) setChoice(k, incumbent[k]!);
    return { status: "optimal", choice, bound: Math.max(upper, incumbentValue), budgetMarginalValue: lambda };
  }
  // 4. Exact search over the core. A first pass uses a tighter threshold than the incumbent
  // allows (a much smaller core); its better incumbent then narrows the next, wider pass. A pass
  // whose optimum z meets U - z <= threshold is a proof, since every dropped option caps its
  // programmes below U - threshold.
  const deadline = started + settings.timeLimitSeconds * 1000;
  let incumbentChoice: Int32Array = incumbent;
  let threshold = Math.max(tolerance, (upper - incumbentValue) / FIRST_PASS_DIVISOR);
  for (;;) {
    const pass = searchRestricted(layout, budget, lambda, best, incumbentChoice, threshold, tolerance, deadline);
    incumbentChoice = pass.choice;
    incumbentValue = pass.value;
    if (!pass.proven) {
      for (let k = 0; k < n; k += 1) setChoice(k, incumbentChoice[k]!);
      return { status: "time-limit", choice, bound: upper, budgetMarginalValue: lambda };
    }
    if (upper - incumbentValue <= threshold) {
      for (let k = 0; k < n; k += 1) setChoice(k, incumbentChoice[k]!);
      return { status: "optimal", choice, bound: Math.max(incumbentValue, pass.bound), budgetMarginalValue: lambda };
    }
    threshold = Math.min(upper - incumbentValue + tolerance, threshold * 4);
  }
}

/** How much tighter than the incumbent allows the first pass's threshold is. */
const FIRST_PASS_DIVISOR = 32;

interface PassResult {
  /** Option per canonical group (NO_OPTION for none). */
  readonly choice: Int32Array;
  readonly value: number;
  readonly proven: boolean;
  /** Proven upper bound within the restriction. */
  readonly bound: number;
}

// Reduced-cost fixing at `threshold`, then branch-and-bound over the groups left with a choice.
function searchRestricted(
  layout: BudgetLayout,
  budget: number,
  lambda: number,
  best: Float64Array,
  incumbent: Int32Array,
  threshold: number,
  tolerance: number,
  deadline: number,
): PassResult {
  const { canonical, hulls, costs, values } = layout;
  const cost = (g: number, a: number): number => (a < 0 ? 0 : costs[g]![a]!);
  const value = (g: number, a: number): number => (a < 0 ? 0 : values[g]![a]!);
  const choice = Int32Array.from(incumbent);
  const coreGroups: number[] = [];
  const coreCandidates: number[][] = [];
  let fixedCost = 0;
  let fixedValue = 0;
  for (let k = 0; k < canonical.length; k += 1) {
    const g = canonical[k]!;
    // The incumbent's own option always stays, so the restriction always contains it.
    const kept = hulls[k]!.undominated.filter(
      (a) => a === incumbent[k] || best[k]! - (value(g, a) - lambda * cost(g, a)) <= threshold,
    );
    if (kept.length === 1) {
      fixedCost += cost(g, kept[0]!);
      fixedValue += value(g, kept[0]!);
    } else {
      coreGroups.push(k);
      coreCandidates.push(kept);
    }
  }
  let incumbentCoreValue = 0;
  const coreIncumbent = Int32Array.from(coreGroups, (k, i) => {
    const a = incumbent[k]!;
    incumbentCoreValue += value(canonical[k]!, a);
    return coreCandidates[i]!.indexOf(a);
  });
  const core = branchAndBoundCore({
    candidateCosts: coreGroups.map((k, i) => Float64Array.from(coreCandidates[i]!, (a) => cost(canonical[k]!, a))),
    candidateValues: coreGroups.map((k, i) => Float64Array.from(coreCandidates[i]!, (a) => value(canonical[k]!, a))),
    budget: budget - fixedCost,
    incumbent: coreIncumbent,
    incumbentValue: incumbentCoreValue,
    tolerance,
    deadline,
  });
  coreGroups.forEach((k, i) => {
    choice[k] = coreCandidates[i]![core.choice[i]!]!;
  });
  return {
    choice,
    value: fixedValue + core.value,
    proven: core.proven,
    bound: fixedValue + core.prunedBound,
  };
}
