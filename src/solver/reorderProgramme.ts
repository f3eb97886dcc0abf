import type { Programme } from "./types.js";

/**
 * The same programme with its groups (and every constraint's rows) listed in `order`
 * (order[k] = input index of the k-th group). Used to hand general engines the sites in id
 * order, so their tie-breaking cannot depend on the order the sites were listed in.
 */
export function reorderProgramme(programme: Programme, order: ArrayLike<number>): Programme {
  const pick = <T>(items: readonly T[]): T[] => Array.from(order, (g) => items[g]!);
  return {
    budget: programme.budget,
    groups: pick(programme.groups),
    constraints: programme.constraints.map((c) => ({
      ...c,
      coefficients: Array.from(order, (g) => c.coefficients[g]),
    })),
  };
}
