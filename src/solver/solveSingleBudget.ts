import { dynamicProgrammeCore } from "./dynamicProgrammeCore.js";
import type { BudgetLayout } from "./buildBudgetLayout.js";
import { NO_OPTION } from "./buildGroupHull.js";
import type { EngineResult, SolveOptions } from "./types.js";

/**
 * Relative tolerance at which the exact engines call a programme optimal: bounds within
 * 1e-9 x max(1, |bound|) of the incumbent are treated as equal, as the README states. It is
 * above the floating-point rounding of sums of up to ~10^5 terms (about 1e-12 relative) and far
 * below the precision of any input (CMFs carry two or three significant figures). It matters in
 * tie-heavy programmes (a binding K+A share floor makes a subset-sum), where the last few parts
 * in 10^10 would otherwise need an exponential proof.
 */
export const OPTIMALITY_TOLERANCE = 1e-9;

/**
 * The dedicated exact engine for the single-budget structure (multiple-choice knapsack):
 * 1. LP relaxation by taking hull segments in ratio order; the critical segment's ratio is the
 *    budget's marginal value lambda, and lambda x budget + sum of each group's best value - lambda x cost
 *    is the upper bound U (Lagrangian form, equal to the LP optimum).
 * 2. A greedy incumbent: the rounded-down LP filled with every later segment that still fits.
 * 3. Reduced-cost fixing: an option whose reduced value falls more than U - incumbent below its
 *    group's best cannot be in any better programme; most groups keep a single option.
 * 4. An exact search (`dynamicProgrammeCore`) over the few groups left (the core), first at a
 *    32x tighter threshold for a quick better incumbent, then widening until the proof holds.
 * Returns `optimal` only when the search finished; the bound is then within the tolerance.
 */
export function solveSingleBudget(layout: BudgetLayout, statedBudget: number, settings: Required<SolveOptions>): EngineResult {
  // Sums of costs in a different order can differ in the last bits; without this allowance a
  // programme that spends the budget exactly could be rejected. checkSolution allows 1e-9.
  const budget = statedBudget + BUDGET_ROUNDING_ALLOWANCE * Math.max(1, statedBudget);
  const started = Date.now();
  const { canonical, hulls } = layout;
  const n = canonical.length;
  const choice: (number | null)[] = new Array<number | null>(n).fill(null);
  const remaining0 = budget - layout.baseCost;
  if (remaining0 < 0) {
    return { status: "infeasible", choice, bound: Number.NaN, budgetMarginalValue: Number.NaN };
  }

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

  // 3. Lagrangian bound; per group its best option at lambda and how far the runner-up falls short.
  const reduced: ReducedValues = {
    best: new Float64Array(n),
    bestOption: new Int32Array(n),
    bestCost: new Float64Array(n),
    bestValue: new Float64Array(n),
    secondGap: new Float64Array(n),
  };
  const { undominatedStart, undominatedOption, undominatedCost, undominatedValue } = layout;
  let upper = lambda * budget;
  for (let k = 0; k < n; k += 1) {
    let first = Number.NEGATIVE_INFINITY;
    let second = Number.NEGATIVE_INFINITY;
    let firstAt = -1;
    for (let j = undominatedStart[k]!; j < undominatedStart[k + 1]!; j += 1) {
      const r = undominatedValue[j]! - lambda * undominatedCost[j]!;
      if (r > first) {
        second = first;
        first = r;
        firstAt = j;
      } else if (r > second) {
        second = r;
      }
    }
    reduced.best[k] = first;
    reduced.bestOption[k] = firstAt < 0 ? NO_OPTION : undominatedOption[firstAt]!;
    reduced.bestCost[k] = firstAt < 0 ? 0 : undominatedCost[firstAt]!;
    reduced.bestValue[k] = firstAt < 0 ? 0 : undominatedValue[firstAt]!;
    reduced.secondGap[k] = first - second;
    upper += first;
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
    const pass = searchRestricted(layout, budget, lambda, reduced, incumbentChoice, threshold, tolerance, deadline);
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
    // Fourfold wider, or straight to the proof when that would be most of the way there: a pass at
    // over half the final threshold costs nearly as much as the final pass and rarely shrinks it.
    const proof = upper - incumbentValue + tolerance;
    threshold = threshold * 4 >= PROOF_JUMP * proof ? proof : threshold * 4;
  }
}

/** Relative allowance on the budget for floating-point rounding in sums of costs. */
const BUDGET_ROUNDING_ALLOWANCE = 1e-11;

/** How much tighter than the incumbent allows the first pass's threshold is. */
const FIRST_PASS_DIVISOR = 32;

/** A widening that would reach this share of the proof threshold goes to the proof threshold. */
const PROOF_JUMP = 0.5;

interface PassResult {
  /** Option per canonical group (NO_OPTION for none). */
  readonly choice: Int32Array;
  readonly value: number;
  readonly proven: boolean;
  /** Proven upper bound within the restriction. */
  readonly bound: number;
}

/** Per canonical group at lambda: best reduced value, the option giving it (its cost and value), and the runner-up's shortfall. */
interface ReducedValues {
  readonly best: Float64Array;
  readonly bestOption: Int32Array;
  readonly bestCost: Float64Array;
  readonly bestValue: Float64Array;
  readonly secondGap: Float64Array;
}

// Reduced-cost fixing at `threshold`, then the exact core search over the groups left with a choice.
// A group keeps its options within `threshold` of its best, plus the incumbent's; it is fixed
// when that leaves one, i.e. the incumbent holds its best option and the runner-up falls short.
function searchRestricted(
  layout: BudgetLayout,
  budget: number,
  lambda: number,
  reduced: ReducedValues,
  incumbent: Int32Array,
  threshold: number,
  tolerance: number,
  deadline: number,
): PassResult {
  const { canonical, groups } = layout;
  const cost = (g: number, a: number): number => (a < 0 ? 0 : groups[g]!.options[a]!.cost);
  const value = (g: number, a: number): number => (a < 0 ? 0 : groups[g]!.options[a]!.value);
  const choice = Int32Array.from(incumbent);
  const coreGroups: number[] = [];
  const coreCandidates: number[][] = [];
  let fixedCost = 0;
  let fixedValue = 0;
  const { undominatedStart, undominatedOption, undominatedCost, undominatedValue } = layout;
  for (let k = 0; k < canonical.length; k += 1) {
    const held = incumbent[k]!;
    if (held === reduced.bestOption[k] && reduced.secondGap[k]! > threshold) {
      fixedCost += reduced.bestCost[k]!;
      fixedValue += reduced.bestValue[k]!;
      continue;
    }
    coreGroups.push(k);
    const kept: number[] = [];
    for (let j = undominatedStart[k]!; j < undominatedStart[k + 1]!; j += 1) {
      const a = undominatedOption[j]!;
      if (a === held || reduced.best[k]! - (undominatedValue[j]! - lambda * undominatedCost[j]!) <= threshold) kept.push(a);
    }
    coreCandidates.push(kept);
  }
  // Groups that cost most to move off their best option go first: few partial programmes survive
  // them, so the states multiply only over the last, cheapest-to-move groups.
  const order = coreGroups.map((_, i) => i).sort((x, y) => reduced.secondGap[coreGroups[y]!]! - reduced.secondGap[coreGroups[x]!]! || x - y);
  coreGroups.splice(0, coreGroups.length, ...order.map((i) => coreGroups[i]!));
  coreCandidates.splice(0, coreCandidates.length, ...order.map((i) => coreCandidates[i]!));
  let incumbentCoreValue = 0;
  const coreIncumbent = Int32Array.from(coreGroups, (k, i) => {
    const a = incumbent[k]!;
    incumbentCoreValue += value(canonical[k]!, a);
    return coreCandidates[i]!.indexOf(a);
  });
  const core = dynamicProgrammeCore({
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
