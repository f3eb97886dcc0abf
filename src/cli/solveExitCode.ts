import type { SolveStatus } from "../solver/index.js";

/** Exit code when no list meets the budget, the must-fund sites and the rules (the output says why). */
export const EXIT_INFEASIBLE = 3;
/** Exit code when the solver gave no trustworthy list (engine failure, or time limit before any list). */
export const EXIT_NOT_SOLVED = 4;

/** What a command tells runCli besides its output: the exit code its result calls for (0 unless set). */
export interface CommandOutcome {
  exitCode: number;
}

/**
 * The exit code for a result that rests on every one of these lists (plan, compare, report,
 * uncertainty): 4 if any was not solved, else 3 if any is infeasible, else 0. A `time-limit` list
 * is verified feasible, only not proven optimal, so it counts as a result (its gap is reported).
 */
export function solveExitCode(statuses: readonly SolveStatus[]): number {
  if (statuses.includes("not-solved")) return EXIT_NOT_SOLVED;
  if (statuses.includes("infeasible")) return EXIT_INFEASIBLE;
  return 0;
}

/**
 * The exit code for a budget frontier: infeasible levels (budgets below the must-fund sites'
 * cost) are part of the result, so 0 while at least one level has a list; 3 when none has; 4 if
 * any level was not solved, since the frontier then has a hole.
 */
export function frontierExitCode(statuses: readonly SolveStatus[]): number {
  if (statuses.includes("not-solved")) return EXIT_NOT_SOLVED;
  if (!statuses.some((status) => status === "optimal" || status === "time-limit")) return EXIT_INFEASIBLE;
  return 0;
}

/** One stderr line for a list that is missing or unproven, so a piped run still says why; empty when optimal. */
export function solveStatusNote(status: SolveStatus, what: string, diagnosis: string | undefined, gap: number): string {
  if (status === "infeasible") return `error: no feasible list ${what}: ${diagnosis ?? "the budget, must-fund sites and rules conflict"} (exit ${EXIT_INFEASIBLE})\n`;
  if (status === "not-solved") return `error: no list ${what}: ${diagnosis ?? "the solver gave no answer"} (exit ${EXIT_NOT_SOLVED})\n`;
  if (status === "time-limit") return `warning: the list ${what} is feasible but not proven optimal (gap ${gap.toExponential(1)}): ${diagnosis ?? "the search reached its time limit"}\n`;
  return "";
}
