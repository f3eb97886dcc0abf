import { hullNumbers } from "./buildGroupHull.js";
import { boundAt, sortSegments, suffixBound } from "./coreSegmentBound.js";

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
  /** States whose bound is within this of the incumbent are dropped (absolute, value units). */
  readonly tolerance: number;
  /** Date.now() after which the search stops. */
  readonly deadline: number;
}

export interface CoreResult {
  readonly choice: Int32Array;
  readonly value: number;
  /** True when the search finished: no choice beats `value` by more than the tolerance. */
  readonly proven: boolean;
  /** Largest bound of any dropped state (-Infinity if none): with `value`, the proven upper bound. */
  readonly prunedBound: number;
  /** States kept over all groups (a measure of the work done). */
  readonly states: number;
}

/** Most (cost, value) states kept after one group before the search gives up. */
const MAX_STATES = 2_000_000;

/**
 * Exact search over the core by dynamic programming on (cost, value) states, group by group
 * (Nemhauser-Ullmann style list of undominated partial programmes, as in Pisinger's 1995
 * minimal algorithm for the multiple-choice knapsack; both references from memory). A state is
 * dropped when another costs no more and gives at least as much, or when its value plus the LP
 * bound of the groups still to come (greedy over their hull segments, evaluated by binary search
 * on prefix sums) cannot beat
 * the incumbent by more than the tolerance. Unlike depth-first branching it does not stall on
 * subset-sum-like cores where many options share almost the same ratio.
 */
export function dynamicProgrammeCore(problem: CoreProblem): CoreResult {
  const groupCount = problem.candidateCosts.length;
  const costs = problem.candidateCosts;
  const values = problem.candidateValues;
  const tolerance = problem.tolerance;
  const hulls = costs.map((c, k) => hullNumbers(Array.from(c, (cost, a) => ({ cost, value: values[k]![a]! })), true));
  const sorted = sortSegments(hulls, costs, values);

  let bestValue = problem.incumbentValue;
  let prunedBound = Number.NEGATIVE_INFINITY;
  let stateCost = new Float64Array([0]);
  let stateValue = new Float64Array([0]);
  const parents: Int32Array[] = [];
  const picks: Int32Array[] = [];
  let stopped = false;

  for (let k = 0; k < groupCount && stateCost.length > 0; k += 1) {
    if (Date.now() > problem.deadline) {
      stopped = true;
      break;
    }
    const candidates = hulls[k]!.undominated;
    const next = suffixBound(sorted, k + 1);
    const m = candidates.length;
    if (stateCost.length * m > 6 * MAX_STATES) {
      stopped = true;
      break;
    }
    // States are sorted by cost with strictly rising values, so each candidate shifts them into
    // another sorted list: an m-way merge by (cost, value descending, state, candidate) gives the
    // same order a full sort would, in linear time (Nemhauser and Ullmann's merge, from memory).
    const kc = costs[k]!;
    const kv = values[k]!;
    const position = new Int32Array(m);
    // Per candidate, where its bound's segment walk stands (its budgets left only fall).
    const cursor = new Int32Array(m).fill(next.ratios.length);
    const budget = problem.budget;
    // Moves candidate j's pointer to its next state that fits and survives the bound.
    const advance = (j: number): void => {
      const a = candidates[j]!;
      for (let s = position[j]!; s < stateCost.length; s += 1) {
        const left = budget - (stateCost[s]! + kc[a]!);
        if (left < 0) {
          position[j] = stateCost.length; // costs only rise from here
          return;
        }
        const bound = stateValue[s]! + kv[a]! + boundAt(next, left, cursor, j);
        if (bound <= bestValue + tolerance) {
          if (bound > prunedBound) prunedBound = bound;
          continue;
        }
        position[j] = s;
        return;
      }
      position[j] = stateCost.length;
    };
    for (let j = 0; j < m; j += 1) advance(j);
    // Typed buffers, doubled when full (no per-state garbage; at most twice the states kept).
    let keepCost = new Float64Array(Math.max(1, Math.min(stateCost.length * m, 1024)));
    let keepValue = new Float64Array(keepCost.length);
    let keepParent = new Int32Array(keepCost.length);
    let keepPick = new Int32Array(keepCost.length);
    let kept = 0;
    let top = Number.NEGATIVE_INFINITY;
    for (;;) {
      let pick = -1;
      let pickCost = 0;
      let pickValue = 0;
      for (let j = 0; j < m; j += 1) {
        const s = position[j]!;
        if (s >= stateCost.length) continue;
        const a = candidates[j]!;
        const c = stateCost[s]! + kc[a]!;
        const v = stateValue[s]! + kv[a]!;
        if (pick < 0 || c < pickCost || (c === pickCost && (v > pickValue || (v === pickValue && s < position[pick]!)))) {
          pick = j;
          pickCost = c;
          pickValue = v;
        }
      }
      if (pick < 0) break;
      if (pickValue > top) {
        top = pickValue;
        if (kept === keepCost.length) {
          keepCost = grown(keepCost);
          keepValue = grown(keepValue);
          keepParent = grown(keepParent);
          keepPick = grown(keepPick);
        }
        keepCost[kept] = pickCost;
        keepValue[kept] = pickValue;
        keepParent[kept] = position[pick]!;
        keepPick[kept] = candidates[pick]!;
        kept += 1;
      }
      position[pick] += 1;
      advance(pick);
    }
    if (kept > MAX_STATES) {
      stopped = true;
      break;
    }
    stateCost = keepCost.slice(0, kept);
    stateValue = keepValue.slice(0, kept);
    parents.push(keepParent.slice(0, kept));
    picks.push(keepPick.slice(0, kept));
  }

  const choice = Int32Array.from(problem.incumbent);
  if (!stopped && parents.length === groupCount && stateValue.length > 0) {
    // Values rise with cost among kept states, so the last state is the best.
    let s = stateValue.length - 1;
    if (stateValue[s]! > bestValue) {
      bestValue = stateValue[s]!;
      for (let k = groupCount - 1; k >= 0; k -= 1) {
        choice[k] = picks[k]![s]!;
        s = parents[k]![s]!;
      }
    }
  }
  return { choice, value: bestValue, proven: !stopped, prunedBound, states: parents.reduce((n, p) => n + p.length, 0) };
}

// A buffer twice as long holding the same leading entries.
function grown<T extends Float64Array | Int32Array>(buffer: T): T {
  const bigger = new (buffer.constructor as new (length: number) => T)(buffer.length * 2);
  bigger.set(buffer);
  return bigger;
}
