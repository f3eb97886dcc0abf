import { NO_OPTION } from "./buildGroupHull.js";
import { listHalf, splitHalves } from "./halfLists.js";
import { MaxTree, RangeHeap } from "./rangeMaximum.js";
import type { Programme } from "./types.js";

/** Most programmes one half may hold. */
export const HALF_LIMIT = 1 << 21;

/** Most numbers one half may hold (its value and its use of each listed row, per programme): 64 MiB. */
const HALF_NUMBERS = 1 << 23;

/** Candidates tried per programme listed, in all, before the search gives up its proof (plus a fixed allowance). */
const POPS_PER_PROGRAMME = 64;

/** Once the proof is given up, most candidates tried for one first-half programme. */
const UNPROVEN_POPS_PER_QUERY = 64;

/** Most candidates tried in all once the proof is given up (the rest of the search only looks for better programmes). */
const UNPROVEN_POP_LIMIT = 1 << 21;

/** A restriction of a programme to search exhaustively. */
export interface CoreSearch {
  readonly programme: Programme;
  /** Per group, the choices allowed (option indices, NO_OPTION for none); one choice fixes the group. */
  readonly choices: readonly (readonly number[])[];
  /** The row the halves are matched on: 0 the budget, 1 + k side constraint k. */
  readonly sortRow: number;
  /** Only programmes worth more than this plus `tolerance` are of interest (an incumbent's value, or -Infinity). */
  readonly floor: number;
  /** Absolute value tolerance. */
  readonly tolerance: number;
  /** Date.now() after which the search stops unfinished. */
  readonly deadline: number;
  /** Most programmes per half (at most HALF_LIMIT); more gives `too-large`. */
  readonly halfLimit?: number;
  /** Go on looking for better programmes once the proof is lost (true), or stop there (false). */
  readonly keepLooking?: boolean;
}

/**
 * - `complete`: every allowed programme worth more than floor + tolerance was weighed; `choice` is the
 *   best of them, or absent when there is none (then no allowed programme beats the floor).
 * - `incomplete`: stopped early (deadline, or more near misses on the other rows than 64 per programme
 *   listed); `choice`, if present, is still a feasible programme better than the floor, but nothing
 *   is proven.
 * - `too-large`: the restriction has too many programmes to split into two halves of HALF_LIMIT.
 */
export interface CoreSearchResult {
  readonly status: "complete" | "incomplete" | "too-large";
  readonly choice?: (number | null)[];
  readonly objective: number;
}

/**
 * Exhaustive search of a restricted programme by meeting in the middle (Horowitz & Sahni, "Computing
 * partitions with applications to the knapsack problem", J. ACM 21(2), 1974; reference from memory):
 * the groups with more than one allowed choice are split into two halves of about equal size, every
 * programme of each half is listed with its value and its use of every row, the second half is sorted
 * by its use of `sortRow`, and for each first-half programme the best second-half programme that fits
 * that row is found with a range-maximum tree; the other rows are then checked, trying the next best
 * candidates when one is broken. Cost O(H log H) for halves of H programmes.
 *
 * Why: when a K+A share floor binds and K+A is the objective, the LP multipliers make every option
 * outside the floor's scope worth the same, so the restricted programme is a subset-sum (fill the
 * floor's room as exactly as possible) on which branch and bound cannot close the last 1e-7 of gap.
 * Listing halves does it exactly for up to about 2^42 programmes.
 *
 * Feasibility is judged as `checkSolution` does, but with the slack of 1e-9 of max(1, |right-hand
 * side|) only, so every programme this accepts `checkSolution` accepts too.
 */
export function searchCoreByHalves(search: CoreSearch): CoreSearchResult {
  const { programme, choices, sortRow, tolerance, deadline } = search;
  const { groups, constraints } = programme;
  const rowCount = 1 + constraints.length;
  // Each row as "sum of uses <= room": a >= row is negated.
  const room = new Float64Array(rowCount);
  const slack = new Float64Array(rowCount);
  room[0] = programme.budget;
  slack[0] = 1e-9 * Math.max(1, Math.abs(programme.budget));
  constraints.forEach((c, k) => {
    room[1 + k] = c.sense === "<=" ? c.rhs : -c.rhs;
    slack[1 + k] = 1e-9 * Math.max(1, Math.abs(c.rhs));
  });
  const use = (g: number, a: number, r: number): number => {
    if (a === NO_OPTION) return 0;
    if (r === 0) return groups[g]!.options[a]!.cost;
    const c = constraints[r - 1]!;
    const coefficient = c.coefficients[g]?.[a] ?? 0;
    return c.sense === "<=" ? coefficient : -coefficient;
  };
  const value = (g: number, a: number): number => (a === NO_OPTION ? 0 : groups[g]!.options[a]!.value);

  let fixedValue = 0;
  const fixedUse = new Float64Array(rowCount);
  const core: number[] = [];
  for (let g = 0; g < groups.length; g += 1) {
    const allowed = choices[g]!;
    if (allowed.length === 0) return { status: "complete", objective: search.floor };
    if (allowed.length > 1) {
      core.push(g);
      continue;
    }
    fixedValue += value(g, allowed[0]!);
    for (let r = 0; r < rowCount; r += 1) fixedUse[r] += use(g, allowed[0]!, r);
  }
  for (let r = 0; r < rowCount; r += 1) room[r] -= fixedUse[r]!;

  // Only rows the core can move are listed (memory: one number per row per programme); the others
  // hold the fixed groups' use alone, so one that is already broken leaves nothing feasible.
  const rows = [sortRow];
  for (let r = 0; r < rowCount; r += 1) {
    if (r === sortRow) continue;
    if (core.some((g) => choices[g]!.some((a) => use(g, a, r) !== 0))) rows.push(r);
    else if (room[r]! + slack[r]! < 0) return { status: "complete", objective: search.floor };
  }
  const halves = splitHalves(core, choices);
  const limit = Math.min(HALF_LIMIT, Math.floor(HALF_NUMBERS / (1 + rows.length)), search.halfLimit ?? HALF_LIMIT);
  if (halves.some((half) => half.reduce((n, g) => n * choices[g]!.length, 1) > limit)) return { status: "too-large", objective: search.floor };
  const listed = (g: number, a: number, k: number): number => use(g, a, rows[k]!);
  const first = listHalf(halves[0]!, choices, rows.length, listed, value);
  const second = listHalf(halves[1]!, choices, rows.length, listed, value);

  // Second half by its use of the sort row (listed first); the tree answers "best value among the first n".
  const order = Int32Array.from({ length: second.count }, (_, i) => i);
  const key = second.uses[0]!;
  order.sort((x, y) => key[x]! - key[y]! || x - y);
  const sortedKey = Float64Array.from(order, (i) => key[i]!);
  const sortedValue = Float64Array.from(order, (i) => second.values[i]!);
  const tree = new MaxTree(sortedValue);

  let best = search.floor;
  let bestPair: [number, number] | undefined;
  let proven = true;
  const firstOrder = Int32Array.from({ length: first.count }, (_, i) => i).sort((x, y) => first.values[y]! - first.values[x]! || x - y);
  const heap = new RangeHeap();
  const popBudget = POPS_PER_PROGRAMME * (first.count + second.count) + 65_536;
  let totalPops = 0;
  let unprovenPops = 0;
  let secondBest = Number.NEGATIVE_INFINITY;
  for (const v of second.values) secondBest = Math.max(secondBest, v);
  for (let q = 0; q < firstOrder.length; q += 1) {
    const i = firstOrder[q]!;
    const head = fixedValue + first.values[i]!;
    // First-half programmes come best first: once none can beat the best, no later one can.
    if (head + secondBest <= best + tolerance) break;
    const givenUp = !proven && (search.keepLooking === false || unprovenPops > UNPROVEN_POP_LIMIT);
    if (givenUp || ((q & 1023) === 0 && Date.now() > deadline)) {
      proven = false;
      break;
    }
    // Largest n with sortedKey[n - 1] within the sort row's room.
    const left = room[sortRow]! - first.uses[0]![i]! + slack[sortRow]!;
    let lo = 0;
    let hi = sortedKey.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (sortedKey[mid]! <= left) lo = mid + 1;
      else hi = mid;
    }
    if (lo === 0) continue;
    heap.clear();
    heap.push(tree, 0, lo);
    let pops = 0;
    while (heap.size > 0) {
      const top = heap.pop();
      if (head + sortedValue[top.at]! <= best + tolerance) break;
      const j = order[top.at]!;
      let fits = true;
      for (let k = 1; k < rows.length && fits; k += 1) {
        const r = rows[k]!;
        if (first.uses[k]![i]! + second.uses[k]![j]! > room[r]! + slack[r]!) fits = false;
      }
      if (fits) {
        best = head + sortedValue[top.at]!;
        bestPair = [i, j];
        break;
      }
      pops += 1;
      totalPops += 1;
      if (totalPops > popBudget) proven = false;
      if (!proven) unprovenPops += 1;
      if (!proven && pops >= UNPROVEN_POPS_PER_QUERY) break;
      if (top.from < top.at) heap.push(tree, top.from, top.at);
      if (top.at + 1 < top.to) heap.push(tree, top.at + 1, top.to);
    }
  }

  const status = proven ? "complete" : "incomplete";
  if (bestPair === undefined) return { status, objective: search.floor };
  const choice: (number | null)[] = groups.map((_, g) => {
    const a = choices[g]!.length === 1 ? choices[g]![0]! : NO_OPTION;
    return a === NO_OPTION ? null : a;
  });
  first.decode(bestPair[0], choice);
  second.decode(bestPair[1], choice);
  return { status, choice, objective: best };
}
