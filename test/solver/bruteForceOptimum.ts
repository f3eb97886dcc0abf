import type { Programme } from "../../src/solver/types.js";

/** Best objective found by enumerating every choice, or null when no choice is feasible. */
export interface BruteForceResult {
  readonly objective: number | null;
  readonly combinations: number;
}

/**
 * Independent reference for tiny programmes: tries every combination (each group: none, unless
 * required, or one of its options) and keeps the best value among those meeting the budget and
 * every side constraint exactly (test generators use sums that are exact in floating point,
 * with a 1e-9 allowance for the share rows whose coefficients are quarters).
 */
export function bruteForceOptimum(programme: Programme): BruteForceResult {
  const { groups, constraints } = programme;
  const choice: number[] = groups.map(() => -1);
  let best: number | null = null;
  let combinations = 0;
  const visit = (g: number, cost: number, value: number): void => {
    if (cost > programme.budget) return;
    if (g === groups.length) {
      combinations += 1;
      for (const constraint of constraints) {
        let lhs = 0;
        choice.forEach((a, h) => {
          if (a >= 0) lhs += constraint.coefficients[h]?.[a] ?? 0;
        });
        if (constraint.sense === "<=" ? lhs > constraint.rhs + 1e-9 : lhs < constraint.rhs - 1e-9) return;
      }
      if (best === null || value > best) best = value;
      return;
    }
    const group = groups[g]!;
    if (!group.required) {
      choice[g] = -1;
      visit(g + 1, cost, value);
    }
    group.options.forEach((option, a) => {
      choice[g] = a;
      visit(g + 1, cost + option.cost, value + option.value);
    });
    choice[g] = -1;
  };
  visit(0, 0, 0);
  return { objective: best, combinations };
}
