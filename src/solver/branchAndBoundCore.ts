import { hullNumbers } from "./buildGroupHull.js";

/**
 * A multiple-choice knapsack in which every group must take exactly one candidate (doing
 * nothing, when allowed, is passed in as a zero candidate).
 */
export interface CoreProblem {
  readonly candidateCosts: readonly Float64Array[];
  readonly candidateValues: readonly Float64Array[];
  readonly budget: number;
  /** A feasible choice (candidate per group) to start from, and its value. */
  readonly incumbent: Int32Array;
  readonly incumbentValue: number;
  /** Nodes whose bound is within this of the incumbent are pruned (absolute, value units). */
  readonly tolerance: number;
  /** Date.now() after which the search stops. */
  readonly deadline: number;
}

export interface CoreResult {
  readonly choice: Int32Array;
  readonly value: number;
  /** True when the search finished: no choice beats `value` by more than the tolerance. */
  readonly proven: boolean;
  /** Largest bound of any pruned node (-Infinity if none): with `value`, the proven upper bound. */
  readonly prunedBound: number;
  readonly nodes: number;
}

/**
 * Depth-first branch-and-bound for the core left after reduced-cost fixing. Each node's bound is
 * the LP relaxation (greedy over hull segments sorted by ratio, Sinha & Zoltners 1979); each
 * node also completes its rounded-down LP greedily to improve the incumbent. The search
 * branches on the LP's fractional group, one child per candidate in order of reduced value at
 * that node's critical ratio, and skips a child whose Lagrangian bound already falls short.
 */
export function branchAndBoundCore(problem: CoreProblem): CoreResult {
  const groups = problem.candidateCosts.length;
  const costs = problem.candidateCosts;
  const values = problem.candidateValues;
  const hulls = costs.map((c, k) => hullNumbers(Array.from(c, (cost, a) => ({ cost, value: values[k]![a]! })), true));
  // Candidates worth branching on: dominated ones never help under a single budget.
  const branchable = hulls.map((h) => h.undominated);

  let segmentCount = 0;
  for (const h of hulls) segmentCount += h.vertices.length - 1;
  const rawGroup = new Int32Array(segmentCount);
  const rawFrom = new Int32Array(segmentCount);
  const rawRatio = new Float64Array(segmentCount);
  let s = 0;
  hulls.forEach((h, k) => {
    for (let p = 0; p + 1 < h.vertices.length; p += 1) {
      const a = h.vertices[p]!;
      const b = h.vertices[p + 1]!;
      const ratio = (values[k]![b]! - values[k]![a]!) / (costs[k]![b]! - costs[k]![a]!);
      rawGroup[s] = k;
      rawFrom[s] = p;
      rawRatio[s] = p === 0 ? ratio : Math.min(ratio, rawRatio[s - 1]!);
      s += 1;
    }
  });
  const order = Int32Array.from(rawGroup, (_, i) => i).sort(
    (x, y) => rawRatio[y]! - rawRatio[x]! || rawGroup[x]! - rawGroup[y]! || rawFrom[x]! - rawFrom[y]!,
  );
  const segGroup = order.map((i) => rawGroup[i]!);
  const segFrom = order.map((i) => rawFrom[i]!);
  const segRatio = Float64Array.from(order, (i) => rawRatio[i]!);
  const segCost = new Float64Array(segmentCount);
  const segValue = new Float64Array(segmentCount);
  for (let i = 0; i < segmentCount; i += 1) {
    const k = segGroup[i]!;
    const vertices = hulls[k]!.vertices;
    const a = vertices[segFrom[i]!]!;
    const b = vertices[segFrom[i]! + 1]!;
    segCost[i] = costs[k]![b]! - costs[k]![a]!;
    segValue[i] = values[k]![b]! - values[k]![a]!;
  }

  const fixed = new Int32Array(groups).fill(-1);
  const level = new Int32Array(groups);
  let freeBaseCost = 0;
  let freeBaseValue = 0;
  for (let k = 0; k < groups; k += 1) {
    const base = hulls[k]!.vertices[0]!;
    freeBaseCost += costs[k]![base]!;
    freeBaseValue += values[k]![base]!;
  }
  let fixedCost = 0;
  let fixedValue = 0;

  const best = Int32Array.from(problem.incumbent);
  let bestValue = problem.incumbentValue;
  let prunedBound = Number.NEGATIVE_INFINITY;
  let nodes = 0;
  let stopped = false;
  const tolerance = problem.tolerance;

  const recordIncumbent = (value: number): void => {
    bestValue = value;
    for (let k = 0; k < groups; k += 1) {
      best[k] = fixed[k]! >= 0 ? fixed[k]! : hulls[k]!.vertices[level[k]!]!;
    }
  };

  const visit = (): void => {
    nodes += 1;
    if ((nodes & 1023) === 0 && Date.now() > problem.deadline) stopped = true;
    if (stopped) return;
    let remaining = problem.budget - fixedCost - freeBaseCost;
    if (remaining < 0) return;
    level.fill(0);
    let value = fixedValue + freeBaseValue;
    let critical = -1;
    for (let i = 0; i < segmentCount; i += 1) {
      const k = segGroup[i]!;
      if (fixed[k]! >= 0) continue;
      if (segCost[i]! <= remaining) {
        remaining -= segCost[i]!;
        value += segValue[i]!;
        level[k] += 1;
      } else {
        critical = i;
        break;
      }
    }
    if (critical < 0) {
      // The LP optimum is integral, so it is this node's best choice.
      if (value > bestValue) recordIncumbent(value);
      return;
    }
    const lambda = segRatio[critical]!;
    const bound = value + remaining * lambda;
    const branchGroup = segGroup[critical]!;
    // Round down, then fill greedily with whatever still fits.
    let filled = value;
    let left = remaining;
    for (let i = critical + 1; i < segmentCount; i += 1) {
      const k = segGroup[i]!;
      if (fixed[k]! >= 0 || level[k] !== segFrom[i]! || segCost[i]! > left) continue;
      left -= segCost[i]!;
      filled += segValue[i]!;
      level[k] += 1;
    }
    if (filled > bestValue) recordIncumbent(filled);
    if (bound <= bestValue + tolerance) {
      prunedBound = Math.max(prunedBound, bound);
      return;
    }

    const kCosts = costs[branchGroup]!;
    const kValues = values[branchGroup]!;
    const children = [...branchable[branchGroup]!];
    const reduced = (a: number): number => kValues[a]! - lambda * kCosts[a]!;
    children.sort((x, y) => reduced(y) - reduced(x) || x - y);
    const top = reduced(children[0]!);
    const base = hulls[branchGroup]!.vertices[0]!;
    freeBaseCost -= kCosts[base]!;
    freeBaseValue -= kValues[base]!;
    for (const a of children) {
      const childBound = bound - (top - reduced(a));
      if (childBound <= bestValue + tolerance) {
        prunedBound = Math.max(prunedBound, childBound);
        continue;
      }
      fixed[branchGroup] = a;
      fixedCost += kCosts[a]!;
      fixedValue += kValues[a]!;
      visit();
      fixedCost -= kCosts[a]!;
      fixedValue -= kValues[a]!;
      fixed[branchGroup] = -1;
      if (stopped) break;
    }
    freeBaseCost += kCosts[base]!;
    freeBaseValue += kValues[base]!;
  };
  visit();
  return { choice: best, value: bestValue, proven: !stopped, prunedBound, nodes };
}
