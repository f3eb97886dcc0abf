// The LP optimum of groups `first`.. as a function of their budget (-Infinity if even their
// cheapest options do not fit): base values plus the greedy over their segments in ratio order.
// Built per layer from one global sort, so memory stays linear in the number of segments.
export interface SuffixBound {
  readonly prefixCost: Float64Array;
  readonly prefixValue: Float64Array;
  readonly ratios: Float64Array;
  readonly fixedCost: number;
  readonly fixedValue: number;
}

export function suffixBound(sorted: SortedSegments, first: number): SuffixBound {
  let count = 0;
  for (let j = 0; j < sorted.group.length; j += 1) if (sorted.group[j]! >= first) count += 1;
  const prefixCost = new Float64Array(count + 1);
  const prefixValue = new Float64Array(count + 1);
  const ratios = new Float64Array(count);
  let i = 0;
  for (let j = 0; j < sorted.group.length; j += 1) {
    if (sorted.group[j]! < first) continue;
    prefixCost[i + 1] = prefixCost[i]! + sorted.cost[j]!;
    prefixValue[i + 1] = prefixValue[i]! + sorted.value[j]!;
    ratios[i] = sorted.ratio[j]!;
    i += 1;
  }
  return { prefixCost, prefixValue, ratios, fixedCost: sorted.suffixBaseCost[first]!, fixedValue: sorted.suffixBaseValue[first]! };
}

/**
 * The bound at `budget`, given `cursors[j]`: an index at or above the answer, which is the largest i
 * with prefixCost[i] <= room (segments before i fit whole, segment i in part). It moves the cursor
 * to the answer: a caller whose budgets only fall keeps it, so a whole layer walks the segments once
 * instead of a binary search per state; the answer is the same.
 */
export function boundAt(bound: SuffixBound, budget: number, cursors: Int32Array, j: number): number {
  const room = budget - bound.fixedCost;
  if (room < 0) return Number.NEGATIVE_INFINITY;
  let lo = cursors[j]!;
  while (lo > 0 && bound.prefixCost[lo]! > room) lo -= 1;
  cursors[j] = lo;
  const partial = lo < bound.ratios.length ? (room - bound.prefixCost[lo]!) * bound.ratios[lo]! : 0;
  return bound.fixedValue + bound.prefixValue[lo]! + partial;
}

export interface SortedSegments {
  readonly group: Int32Array;
  readonly cost: Float64Array;
  readonly value: Float64Array;
  readonly ratio: Float64Array;
  /** Sum over groups k.. of their cheapest hull vertex (index groupCount holds 0). */
  readonly suffixBaseCost: Float64Array;
  readonly suffixBaseValue: Float64Array;
}

// All hull segments of all groups, sorted by ratio descending (ties: group, then position).
export function sortSegments(
  hulls: readonly { readonly vertices: readonly number[] }[],
  costs: readonly Float64Array[],
  values: readonly Float64Array[],
): SortedSegments {
  const groupCount = hulls.length;
  const suffixBaseCost = new Float64Array(groupCount + 1);
  const suffixBaseValue = new Float64Array(groupCount + 1);
  const rows: { ratio: number; cost: number; value: number; group: number; from: number }[] = [];
  for (let k = groupCount - 1; k >= 0; k -= 1) {
    const vertices = hulls[k]!.vertices;
    suffixBaseCost[k] = suffixBaseCost[k + 1]! + costs[k]![vertices[0]!]!;
    suffixBaseValue[k] = suffixBaseValue[k + 1]! + values[k]![vertices[0]!]!;
    let previousRatio = Number.POSITIVE_INFINITY;
    for (let p = 0; p + 1 < vertices.length; p += 1) {
      const cost = costs[k]![vertices[p + 1]!]! - costs[k]![vertices[p]!]!;
      const value = values[k]![vertices[p + 1]!]! - values[k]![vertices[p]!]!;
      // Rounding must never let a later segment of a hull look steeper than an earlier one.
      previousRatio = Math.min(previousRatio, value / cost);
      rows.push({ ratio: previousRatio, cost, value, group: k, from: p });
    }
  }
  rows.sort((x, y) => y.ratio - x.ratio || x.group - y.group || x.from - y.from);
  return {
    group: Int32Array.from(rows, (r) => r.group),
    cost: Float64Array.from(rows, (r) => r.cost),
    value: Float64Array.from(rows, (r) => r.value),
    ratio: Float64Array.from(rows, (r) => r.ratio),
    suffixBaseCost,
    suffixBaseValue,
  };
}
