import type { TreatmentSetLimits } from "./enumerateTreatmentSets.js";
import type { Treatment } from "./types.js";

/**
 * How many sets `enumerateTreatmentSets` would list, counted without listing them: the
 * coefficients of the generating polynomial (1 + m x) per exclusive group of m usable treatments
 * and (1 + x) per ungrouped one, a must-fund treatment contributing x alone (its group can give
 * no other), truncated at degree `maxTreatments`; the empty set is not counted. Cost
 * O(candidates x maxTreatments), no allocation per set, so a site with thousands of candidates is
 * measured before anything is built. Counts past 2^53 are approximate, which only matters against
 * limits far below that.
 * Example: 40 ungrouped candidates, at most 3 each: 40 + 780 + 9,880 = 10,700.
 */
export function countTreatmentSets(candidates: readonly Treatment[], limits: TreatmentSetLimits): number {
  const required = new Set(limits.required ?? []);
  const forbidden = new Set(limits.forbidden ?? []);
  const usable = candidates.filter((treatment) => !forbidden.has(treatment.id));
  if ([...required].some((id) => !usable.some((t) => t.id === id))) return 0;
  // Per exclusive group (or per ungrouped treatment): how many may be picked from it, and whether one is forced.
  const parts = new Map<string, { members: number; forced: number }>();
  usable.forEach((treatment, index) => {
    const key = treatment.exclusiveGroup === undefined ? `#${index}` : `group:${treatment.exclusiveGroup}`;
    const part = parts.get(key) ?? { members: 0, forced: 0 };
    part.members += 1;
    if (required.has(treatment.id)) part.forced += 1;
    parts.set(key, part);
  });
  const degree = limits.maxTreatments;
  let coefficients = [1, ...new Array<number>(degree).fill(0)];
  for (const { members, forced } of parts.values()) {
    if (forced > 1) return 0; // two must-fund treatments of one exclusive group can never be combined
    const next = new Array<number>(degree + 1).fill(0);
    for (let d = 0; d <= degree; d += 1) {
      const c = coefficients[d]!;
      if (c === 0) continue;
      if (forced === 0) next[d] += c; // nothing from this part
      if (d + 1 <= degree) next[d + 1] += forced === 1 ? c : c * members; // the forced one, or any one member
    }
    coefficients = next;
  }
  return coefficients.slice(1).reduce((total, c) => total + c, 0);
}
