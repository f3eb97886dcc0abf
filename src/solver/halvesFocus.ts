import { NO_OPTION } from "./buildGroupHull.js";
import type { Programme } from "./types.js";

/** Groups with exactly tied choices from which the restriction counts as a subset-sum and gets the halves search on a part. */
export const MIN_TIED_GROUPS = 4;

/**
 * Most rows (the budget among them) binding at the LP optimum for that subset-sum treatment: the
 * halves search sorts by one binding row, which pays off when one other row binds beside the
 * budget (a K+A share floor). With more, as under a programme's year rows, it does not: the
 * five-year demo took 3–9 s without it and ran into the 60 s limit with it.
 */
export const MAX_BINDING_ROWS_FOR_HALVES = 2;

/**
 * Branch-and-bound nodes of the short HiGHS runs on a restriction with ties, in turn: a very
 * short one for a first programme to search around, then a longer one (about a second on most
 * restrictions, ten on some), before HiGHS runs to the time limit.
 */
export const SLICE_NODES = [10, 1_000];

/** Most programmes per half of the focused search: it runs between HiGHS slices, so it stays well under a second. */
const FOCUS_HALF_LIMIT = 1 << 18;

/** How far round the groups each focus round after the first starts. */
const FOCUS_ROUND_STEP = 5;

/** Most focus rounds between two HiGHS runs; the rounds stop earlier once one brings no gain. */
export const FOCUS_ROUNDS = 12;

// What option a of group g puts on row r: row 0 is the budget (its cost), row r > 0 side constraint r − 1.
function rowUse(programme: Programme, r: number, g: number, a: number): number {
  if (a === NO_OPTION) return 0;
  return r === 0 ? programme.groups[g]!.options[a]!.cost : (programme.constraints[r - 1]!.coefficients[g]?.[a] ?? 0);
}

// The row the halves search matches on: the one whose multiplier times its spread over the
// restriction's choices is largest (the binding row that decides the fill); the budget when none binds.
export function bindingRow(programme: Programme, choices: readonly (readonly number[])[], rowMultipliers: readonly number[]): number {
  let bestRow = 0;
  let bestScore = 0;
  rowMultipliers.forEach((mu, r) => {
    if (mu <= 0) return;
    let spread = 0;
    choices.forEach((allowed, g) => {
      if (allowed.length < 2) return;
      let low = Number.POSITIVE_INFINITY;
      let high = Number.NEGATIVE_INFINITY;
      for (const a of allowed) {
        const x = rowUse(programme, r, g, a);
        low = Math.min(low, x);
        high = Math.max(high, x);
      }
      spread += high - low;
    });
    if (mu * spread > bestScore) {
      bestScore = mu * spread;
      bestRow = r;
    }
  });
  return bestRow;
}

/**
 * The restriction with every group held at the incumbent's choice except a few that move the
 * sort row, as many as fit in two halves of FOCUS_HALF_LIMIT programmes (largest first into the
 * smaller half, as `searchCoreByHalves` splits them). Round 0 frees the groups with the most
 * choices; round r > 0 takes the groups by spread on the sort row, largest first, starting r × step
 * places further round the list, so successive rounds free different groups (a large-neighbourhood
 * search whose every neighbourhood is searched exactly).
 */
export function focusChoices(programme: Programme, choices: readonly (readonly number[])[], held: readonly (number | null)[], sortRow: number, round = 0): number[][] {
  const spread = choices.map((allowed, g) => {
    const uses = allowed.map((a) => rowUse(programme, sortRow, g, a));
    return allowed.length < 2 ? 0 : Math.max(...uses) - Math.min(...uses);
  });
  const wanted = choices.map((_, g) => g).filter((g) => choices[g]!.length > 1).sort((x, y) => spread[y]! - spread[x]! || x - y);
  const start = wanted.length === 0 ? 0 : (round * FOCUS_ROUND_STEP) % wanted.length;
  const order =
    round === 0
      ? [...wanted].sort((x, y) => choices[y]!.length - choices[x]!.length || spread[y]! - spread[x]! || x - y)
      : [...wanted.slice(start), ...wanted.slice(0, start)];
  const picked = new Set<number>();
  const sizes = [1, 1];
  // A group that fits in neither half is left out.
  for (const g of order) {
    const h = sizes[0]! <= sizes[1]! ? 0 : 1;
    if (sizes[h]! * choices[g]!.length > FOCUS_HALF_LIMIT) continue;
    sizes[h] = sizes[h]! * choices[g]!.length;
    picked.add(g);
  }
  return choices.map((allowed, g) => (picked.has(g) ? [...allowed] : [held[g] ?? NO_OPTION]));
}
