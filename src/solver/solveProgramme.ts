import { prepareProgramme, type PreparedProgramme } from "./prepareProgramme.js";
import type { Programme, ProgrammeGroup, Solution, SolveOptions } from "./types.js";

// The latest prepared programme per groups array: a second solve of the same sites and rules at
// another budget (the optimum at the B/C ranking's spend) reuses its order and layout.
const preparedByGroups = new WeakMap<readonly ProgrammeGroup[], { key: string; constraints: Programme["constraints"]; prepared: PreparedProgramme }>();

/**
 * Solves a programme: the one entry point for a single solve. `engine: "auto"` (default) is the
 * dedicated exact engine (hulls, LP bound, reduced-cost fixing and dynamic programming over
 * the small core left, for a single budget; Lagrangian reduction with an exhaustive search by
 * halves or HiGHS on the reduced model when there are side constraints). There is no fallback to
 * another engine: the answer names the engine that gave it (`Solution.engine`), and an engine that
 * cannot answer gives `not-solved` with a diagnosis. Every answer is checked by `checkSolution`
 * before it is returned and is never reported as optimal unless proven. Outcomes are statuses;
 * only malformed numbers throw (RangeError). A programme that differs from the one solved before
 * only in its budget (same groups and constraints arrays, same options) is re-solved on the same
 * preparation, as `prepareProgramme` does for many re-solves; the answer is the same.
 */
export function solveProgramme(programme: Programme, options: Partial<SolveOptions> = {}): Promise<Solution> {
  const key = JSON.stringify(options);
  const cached = preparedByGroups.get(programme.groups);
  if (cached !== undefined && cached.key === key && cached.constraints === programme.constraints) return cached.prepared.solve({ budget: programme.budget });
  const prepared = prepareProgramme(programme, options);
  preparedByGroups.set(programme.groups, { key, constraints: programme.constraints, prepared });
  return prepared.solve();
}
