import type { PlanResult } from "../analysis/planProgramme.js";

/** Whether the solver returned a list at this budget (optimal, or the best found by a time limit). */
export function hasList(plan: PlanResult): boolean {
  return plan.solution.status === "optimal" || plan.solution.status === "time-limit";
}
