import { hullNumbers, type HullNumbers } from "./buildGroupHull.js";
import type { ProgrammeGroup } from "./types.js";

/**
 * Everything the single-budget engine needs that does not depend on the budget level: each
 * group's hull (in canonical order) and all hull segments sorted by incremental value per unit
 * cost. Built once per set of values and reused across budget levels (frontier).
 */
export interface BudgetLayout {
  /** Canonical position -> input group index (groups sorted by id, then input index). */
  readonly canonical: Int32Array;
  /** The groups (input order) whose option costs and values the layout was built from. */
  readonly groups: readonly ProgrammeGroup[];
  /** Hull per canonical position. */
  readonly hulls: readonly HullNumbers[];
  /** Sum of each group's cheapest hull vertex (doing nothing for optional groups). */
  readonly baseCost: number;
  readonly baseValue: number;
  /** Segments sorted by ratio descending, then canonical group, then position on the hull. */
  readonly segmentGroup: Int32Array;
  /** Position of the segment's cheaper end on its group's hull (the segment leads to position + 1). */
  readonly segmentFrom: Int32Array;
  readonly segmentCost: Float64Array;
  readonly segmentValue: Float64Array;
  readonly segmentRatio: Float64Array;
  /**
   * Every group's undominated choices (NO_OPTION included when optional), flattened: canonical
   * position k holds entries undominatedStart[k] .. undominatedStart[k + 1] - 1, each with its option
   * index, cost and value (0 and 0 for doing nothing), so a budget level's reduced values are one
   * pass over typed arrays.
   */
  readonly undominatedStart: Int32Array;
  readonly undominatedOption: Int32Array;
  readonly undominatedCost: Float64Array;
  readonly undominatedValue: Float64Array;
}

/**
 * Builds the budget layout: hulls by `hullNumbers`, then one sort of all segments by ratio
 * (ties broken by group position in id order, so the result does not depend on input order).
 * Cost O(N m log m + S log S) for N groups of m options and S segments.
 */
export function buildBudgetLayout(canonical: Int32Array, groups: readonly ProgrammeGroup[]): BudgetLayout {
  const n = canonical.length;
  const hulls: HullNumbers[] = new Array<HullNumbers>(n);
  let baseCost = 0;
  let baseValue = 0;
  let segmentCount = 0;
  for (let k = 0; k < n; k += 1) {
    const g = canonical[k]!;
    const hull = hullNumbers(groups[g]!.options, groups[g]!.required);
    hulls[k] = hull;
    const first = hull.vertices[0];
    if (first !== undefined && first >= 0) {
      baseCost += groups[g]!.options[first]!.cost;
      baseValue += groups[g]!.options[first]!.value;
    }
    segmentCount += Math.max(0, hull.vertices.length - 1);
  }
  const group = new Int32Array(segmentCount);
  const from = new Int32Array(segmentCount);
  const dc = new Float64Array(segmentCount);
  const dv = new Float64Array(segmentCount);
  const ratio = new Float64Array(segmentCount);
  let s = 0;
  for (let k = 0; k < n; k += 1) {
    const g = canonical[k]!;
    const vertices = hulls[k]!.vertices;
    const options = groups[g]!.options;
    const c = (a: number): number => (a < 0 ? 0 : options[a]!.cost);
    const v = (a: number): number => (a < 0 ? 0 : options[a]!.value);
    for (let p = 0; p + 1 < vertices.length; p += 1) {
      group[s] = k;
      from[s] = p;
      dc[s] = c(vertices[p + 1]!) - c(vertices[p]!);
      dv[s] = v(vertices[p + 1]!) - v(vertices[p]!);
      // Rounding must never let a later segment of a hull look steeper than an earlier one.
      ratio[s] = p === 0 ? dv[s]! / dc[s]! : Math.min(dv[s]! / dc[s]!, ratio[s - 1]!);
      s += 1;
    }
  }
  const undominatedStart = new Int32Array(n + 1);
  for (let k = 0; k < n; k += 1) undominatedStart[k + 1] = undominatedStart[k]! + hulls[k]!.undominated.length;
  const undominatedOption = new Int32Array(undominatedStart[n]!);
  const undominatedCost = new Float64Array(undominatedStart[n]!);
  const undominatedValue = new Float64Array(undominatedStart[n]!);
  for (let k = 0; k < n; k += 1) {
    const options = groups[canonical[k]!]!.options;
    hulls[k]!.undominated.forEach((a, i) => {
      const j = undominatedStart[k]! + i;
      undominatedOption[j] = a;
      undominatedCost[j] = a < 0 ? 0 : options[a]!.cost;
      undominatedValue[j] = a < 0 ? 0 : options[a]!.value;
    });
  }
  const order = new Int32Array(segmentCount);
  for (let i = 0; i < segmentCount; i += 1) order[i] = i;
  order.sort((x, y) => ratio[y]! - ratio[x]! || group[x]! - group[y]! || from[x]! - from[y]!);
  return {
    canonical,
    groups,
    hulls,
    baseCost,
    baseValue,
    segmentGroup: order.map((i) => group[i]!),
    segmentFrom: order.map((i) => from[i]!),
    segmentCost: Float64Array.from(order, (i) => dc[i]!),
    segmentValue: Float64Array.from(order, (i) => dv[i]!),
    segmentRatio: Float64Array.from(order, (i) => ratio[i]!),
    undominatedStart,
    undominatedOption,
    undominatedCost,
    undominatedValue,
  };
}
