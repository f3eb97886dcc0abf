import type { Treatment } from "./types.js";

/** Which combinations may be formed at a site. */
export interface TreatmentSetLimits {
  readonly maxTreatments: number;
  /** Every set must contain all of these (must-fund). */
  readonly required?: readonly string[];
  /** No set may contain any of these (never-fund). */
  readonly forbidden?: readonly string[];
}

/**
 * Every non-empty combination of a site's candidate treatments with at most `maxTreatments`
 * members and no two from one exclusive group, in a stable order (by size, then candidate order).
 */
export function enumerateTreatmentSets(candidates: readonly Treatment[], limits: TreatmentSetLimits): Treatment[][] {
  const required = new Set(limits.required ?? []);
  const forbidden = new Set(limits.forbidden ?? []);
  const usable = candidates.filter((treatment) => !forbidden.has(treatment.id));
  const sets: Treatment[][] = [];
  const current: Treatment[] = [];
  const extend = (start: number) => {
    if (current.length > 0 && [...required].every((id) => current.some((t) => t.id === id))) sets.push([...current]);
    if (current.length === limits.maxTreatments) return;
    for (let index = start; index < usable.length; index++) {
      const next = usable[index]!;
      if (next.exclusiveGroup !== undefined && current.some((t) => t.exclusiveGroup === next.exclusiveGroup)) continue;
      current.push(next);
      extend(index + 1);
      current.pop();
    }
  };
  extend(0);
  return sets.sort((a, b) => a.length - b.length);
}
