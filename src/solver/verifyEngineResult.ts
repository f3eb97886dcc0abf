import { checkSolution } from "./checkSolution.js";
import type { EngineName, EngineResult, Programme, Solution } from "./types.js";

const CONFLICT =
  "No programme meets the budget, the must-fund sites and all rules together, although each can be met on its own; relax a rule or raise the budget.";

/**
 * Turns an engine's raw answer into a Solution: objective and cost recomputed by
 * `checkSolution`, and an answer that fails verification replaced by status `not-solved`
 * (never reported as optimal). Gap = (bound - objective) / max(1, |bound|).
 */
export function verifyEngineResult(programme: Programme, engine: Exclude<EngineName, "auto">, raw: EngineResult): Solution {
  if (raw.status === "infeasible" || raw.status === "not-solved") {
    const fallback = raw.status === "infeasible" ? CONFLICT : `The ${engine} engine gave no answer.`;
    return emptySolution(programme, engine, raw.status, raw.diagnosis ?? fallback, raw.budgetMarginalValue);
  }
  const check = checkSolution(programme, raw.choice);
  if (!check.feasible) {
    return emptySolution(
      programme,
      engine,
      "not-solved",
      `The ${engine} engine returned a programme that failed verification (${check.problems[0]}); it was discarded.`,
      raw.budgetMarginalValue,
    );
  }
  // An engine that proves no bound: its own claim of optimality is the only bound; none after a time-out.
  const claimed = raw.status === "optimal" ? check.objective : Number.NaN;
  const bound = Number.isNaN(raw.bound) ? claimed : Math.max(raw.bound, check.objective);
  return {
    status: raw.status,
    choice: raw.choice,
    objective: check.objective,
    cost: check.cost,
    bound,
    gap: (bound - check.objective) / Math.max(1, Math.abs(bound)),
    budgetMarginalValue: raw.budgetMarginalValue,
    engine,
    ...(raw.diagnosis === undefined ? {} : { diagnosis: raw.diagnosis }),
  };
}

/** A Solution with nothing chosen, for infeasible and unsolved outcomes. */
export function emptySolution(
  programme: Programme,
  engine: Exclude<EngineName, "auto">,
  status: "infeasible" | "not-solved",
  diagnosis: string,
  budgetMarginalValue = Number.NaN,
): Solution {
  return {
    status,
    choice: programme.groups.map(() => null),
    objective: 0,
    cost: 0,
    bound: Number.NaN,
    gap: Number.NaN,
    budgetMarginalValue,
    engine,
    diagnosis,
  };
}
