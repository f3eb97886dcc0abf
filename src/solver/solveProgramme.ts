import { prepareProgramme } from "./prepareProgramme.js";
import type { Programme, Solution, SolveOptions } from "./types.js";

/**
 * Solves a programme: the one entry point for a single solve. `engine: "auto"` (default) is the
 * dedicated exact engine (hulls, LP bound, reduced-cost fixing and dynamic programming over
 * the small core left, for a single budget; Lagrangian reduction with an exhaustive search by
 * halves or HiGHS on the reduced model when there are side constraints). There is no fallback to
 * another engine: the answer names the engine that gave it (`Solution.engine`), and an engine that
 * cannot answer gives `not-solved` with a diagnosis. Every answer is checked by `checkSolution`
 * before it is returned and is never reported as optimal unless proven. Outcomes are statuses;
 * only malformed numbers throw (RangeError). For many re-solves use `prepareProgramme`.
 */
export function solveProgramme(programme: Programme, options: Partial<SolveOptions> = {}): Promise<Solution> {
  return prepareProgramme(programme, options).solve();
}
