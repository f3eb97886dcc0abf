import type { Programme } from "./types.js";

/** Relative slack allowed on the budget and on side constraints, for floating-point sums only. */
export const FEASIBILITY_RELATIVE_TOLERANCE = 1e-9;

/** Outcome of verifying one choice against a programme. */
export interface SolutionCheck {
  /** True when every problem list is empty. */
  readonly feasible: boolean;
  /** Plain-words violations, one per broken condition. */
  readonly problems: readonly string[];
  /** Total value of the chosen options, recomputed from the programme. */
  readonly objective: number;
  /** Total cost of the chosen options, recomputed from the programme. */
  readonly cost: number;
}

/**
 * Verifies a choice (one option index or null per group) against a programme: valid indices,
 * at most one option per group, every required group chosen, total cost within the budget and
 * every side constraint met, each up to a relative tolerance of 1e-9 of the row's magnitude.
 * Recomputes objective and cost so no engine's own arithmetic is trusted.
 */
export function checkSolution(programme: Programme, choice: readonly (number | null)[]): SolutionCheck {
  const problems: string[] = [];
  const { groups } = programme;
  if (choice.length !== groups.length) {
    problems.push(`choice lists ${choice.length} sites but the programme has ${groups.length}`);
    return { feasible: false, problems, objective: 0, cost: 0 };
  }
  let objective = 0;
  let cost = 0;
  let costMagnitude = 0;
  for (let g = 0; g < groups.length; g += 1) {
    const group = groups[g]!;
    const a = choice[g];
    if (a === null || a === undefined) {
      if (group.required) problems.push(`site ${group.id} must be funded but no option is chosen`);
      continue;
    }
    if (!Number.isInteger(a) || a < 0 || a >= group.options.length) {
      problems.push(`site ${group.id}: option index ${a} does not exist`);
      continue;
    }
    const option = group.options[a]!;
    objective += option.value;
    cost += option.cost;
    costMagnitude += Math.abs(option.cost);
  }
  if (problems.length > 0) return { feasible: false, problems, objective, cost };

  const budgetSlack = FEASIBILITY_RELATIVE_TOLERANCE * Math.max(1, Math.abs(programme.budget), costMagnitude);
  if (cost > programme.budget + budgetSlack) {
    problems.push(`total cost ${cost} exceeds the budget ${programme.budget} by ${cost - programme.budget}`);
  }
  for (const constraint of programme.constraints) {
    let lhs = 0;
    let magnitude = Math.abs(constraint.rhs);
    for (let g = 0; g < groups.length; g += 1) {
      const a = choice[g];
      const row = constraint.coefficients[g];
      if (a === null || a === undefined || row === undefined) continue;
      const term = row[a] ?? 0;
      lhs += term;
      magnitude += Math.abs(term);
    }
    const slack = FEASIBILITY_RELATIVE_TOLERANCE * Math.max(1, magnitude);
    const broken = constraint.sense === "<=" ? lhs > constraint.rhs + slack : lhs < constraint.rhs - slack;
    if (broken) {
      problems.push(`rule ${constraint.id} (${constraint.label}) is broken: ${lhs} ${constraint.sense} ${constraint.rhs} fails`);
    }
  }
  return { feasible: problems.length === 0, problems, objective, cost };
}
