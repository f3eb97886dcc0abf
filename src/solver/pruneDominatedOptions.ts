import type { Programme } from "./types.js";

/** Largest group compared pairwise (a site with 60 alternatives in each of 10 years has 600). */
const MAX_PRUNED_GROUP = 1_000;

/** A programme without its dominated options, and the way back to the original option indices. */
export interface PrunedProgramme {
  readonly programme: Programme;
  /** kept[g][a'] = the original index of option a' of group g in the pruned programme. */
  readonly kept: readonly (readonly number[])[];
  /** How many options were dropped. */
  readonly dropped: number;
}

/**
 * Drops every option that another option of its group dominates in every row: worth no less,
 * costing no more, and using no more of any "<=" row and no less of any ">=" row (the first of
 * exactly equal options stays). A programme using a dominated option stays feasible, and is worth
 * no less, with its dominator instead, so the optimum is unchanged. A multi-year programme has
 * many: a build year that gives the same K+A as an earlier one but spends later.
 */
export function pruneDominatedOptions(programme: Programme): PrunedProgramme {
  const rows = programme.constraints;
  // Each option's row usage as "<=" rows, so one comparison direction serves every row.
  const usage = (g: number, a: number): number[] => rows.map((row) => (row.sense === "<=" ? 1 : -1) * (row.coefficients[g]?.[a] ?? 0));
  let dropped = 0;
  const kept = programme.groups.map((group, g) => {
    const options = group.options;
    // The pairwise test is quadratic: very large groups are left whole (correct, only less pruned).
    if (options.length < 2 || options.length > MAX_PRUNED_GROUP) return options.map((_, a) => a);
    const use = options.map((_, a) => usage(g, a));
    const survivors: number[] = [];
    options.forEach((option, a) => {
      const dominated = options.some((other, b) => {
        if (b === a || other.value < option.value || other.cost > option.cost) return false;
        const uses = use[b]!;
        if (!uses.every((x, k) => x <= use[a]![k]!)) return false;
        const equal = other.value === option.value && other.cost === option.cost && uses.every((x, k) => x === use[a]![k]!);
        // Of exactly equal options the first stays.
        return !equal || b < a;
      });
      if (dominated) dropped += 1;
      else survivors.push(a);
    });
    return survivors;
  });
  if (dropped === 0) return { programme, kept, dropped };
  return {
    programme: {
      budget: programme.budget,
      groups: programme.groups.map((group, g) => ({ ...group, options: kept[g]!.map((a) => group.options[a]!) })),
      constraints: rows.map((row) => ({ ...row, coefficients: row.coefficients.map((coefficients, g) => (coefficients === undefined ? undefined : kept[g]!.map((a) => coefficients[a] ?? 0))) })),
    },
    kept,
    dropped,
  };
}
