import type { Programme } from "./types.js";

/**
 * Throws a RangeError when a programme holds numbers no engine can use (NaN, infinities,
 * negative costs or budget, ragged constraint rows). The model layer should never build such a
 * programme, so this is a programmer error, not bad user input.
 */
export function validateProgramme(programme: Programme): void {
  validateBudget(programme.budget);
  programme.groups.forEach((group, g) => {
    group.options.forEach((option, a) => {
      if (!Number.isFinite(option.cost) || option.cost < 0) {
        throw new RangeError(`group ${group.id} option ${a}: cost must be finite and >= 0, got ${option.cost}`);
      }
      if (!Number.isFinite(option.value)) {
        throw new RangeError(`group ${group.id} option ${a}: value must be finite, got ${option.value}`);
      }
    });
    for (const constraint of programme.constraints) {
      const row = constraint.coefficients[g];
      if (row === undefined) continue;
      if (row.length !== group.options.length || row.some((x) => !Number.isFinite(x))) {
        throw new RangeError(`constraint ${constraint.id}: row for group ${group.id} must hold one finite number per option`);
      }
    }
  });
  for (const constraint of programme.constraints) {
    if (!Number.isFinite(constraint.rhs)) {
      throw new RangeError(`constraint ${constraint.id}: rhs must be finite, got ${constraint.rhs}`);
    }
    if (constraint.coefficients.length > programme.groups.length) {
      throw new RangeError(`constraint ${constraint.id}: more coefficient rows than groups`);
    }
  }
}

/** Throws a RangeError unless the budget is a finite number >= 0 (all a budget-only re-solve needs checked). */
export function validateBudget(budget: number): void {
  if (!Number.isFinite(budget) || budget < 0) {
    throw new RangeError(`programme budget must be a finite number >= 0, got ${budget}`);
  }
}
