import { NO_OPTION } from "./buildGroupHull.js";
import { FEASIBILITY_RELATIVE_TOLERANCE } from "./checkSolution.js";
import type { Programme } from "./types.js";

/** Rounds of tightening at most; each round can only remove choices, so this bounds the work. */
const MAX_ROUNDS = 8;

/**
 * Bound tightening on row activities (the presolve step of every MIP code; e.g. Achterberg et al.,
 * "Presolve reductions in mixed integer programming", INFORMS J. Computing 32(2), 2020, from memory):
 * on each row written as "sum of uses <= room", a choice whose use plus the least the other groups
 * can put on the row exceeds the room is dropped, and rounds repeat while anything is dropped.
 * Example: a project-count limit of 1 on a tag, with one tagged site that must be funded, drops
 * every option of the other tagged sites, which shrinks the space the halves search lists.
 *
 * Only choices that no feasible programme uses are dropped: the room is widened by the largest slack
 * `checkSolution` could allow on that row. A group left with no choice means the restriction holds no
 * feasible programme. Returns new lists; `choices` is not changed.
 */
export function propagateRows(programme: Programme, choices: readonly (readonly number[])[]): number[][] {
  const { groups, constraints } = programme;
  const result = choices.map((allowed) => [...allowed]);
  const rows = [{ room: programme.budget, use: (g: number, a: number) => groups[g]!.options[a]!.cost }];
  for (const c of constraints) {
    const sign = c.sense === "<=" ? 1 : -1;
    rows.push({ room: sign * c.rhs, use: (g, a) => sign * (c.coefficients[g]?.[a] ?? 0) });
  }
  const useOf = (row: (typeof rows)[number], g: number, a: number): number => (a === NO_OPTION ? 0 : row.use(g, a));

  for (let round = 0; round < MAX_ROUNDS; round += 1) {
    let dropped = false;
    for (const row of rows) {
      // Least use per group, and the largest |use| any programme could add to the row's magnitude.
      const least = result.map((allowed, g) => Math.min(...allowed.map((a) => useOf(row, g, a))));
      let leastTotal = 0;
      let magnitude = Math.abs(row.room);
      result.forEach((allowed, g) => {
        leastTotal += least[g]!;
        magnitude += Math.max(0, ...allowed.map((a) => Math.abs(useOf(row, g, a))));
      });
      if (!Number.isFinite(leastTotal)) return result; // a group has no choice left: nothing to tighten
      const limit = row.room + FEASIBILITY_RELATIVE_TOLERANCE * Math.max(1, magnitude);
      result.forEach((allowed, g) => {
        const others = leastTotal - least[g]!;
        const kept = allowed.filter((a) => others + useOf(row, g, a) <= limit);
        if (kept.length < allowed.length) {
          result[g] = kept;
          dropped = true;
        }
      });
      if (result.some((allowed) => allowed.length === 0)) return result;
    }
    if (!dropped) break;
  }
  return result;
}
