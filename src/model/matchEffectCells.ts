import type { CrashType, Severity } from "./types.js";

/** A block of crash cells: every listed crash type at every listed severity. */
export interface CrashCells {
  readonly crashTypes: readonly CrashType[];
  readonly severities: readonly Severity[];
}

/** How a block of cells meets a treatment's effects: exactly one effect's cells, part of one's, or none. */
export type CellsMatch = { readonly kind: "same"; readonly index: number } | { readonly kind: "partial"; readonly index: number } | { readonly kind: "none" };

/**
 * Which of `effects` covers exactly the crash cells `cells` covers (same crash types, same
 * severities, in any order), else the first that shares some cell with it, else none. An exact
 * match wins over an overlap, so evidence on a treatment's specific effect pools with that
 * effect even when a catch-all effect of the treatment also spans those cells.
 * @example effects [pedestrian × KABCO, all × KABCO], cells pedestrian × KABCO → { kind: "same", index: 0 }
 */
export function matchEffectCells(effects: readonly CrashCells[], cells: CrashCells): CellsMatch {
  const same = effects.findIndex((effect) => sameSet(effect.crashTypes, cells.crashTypes) && sameSet(effect.severities, cells.severities));
  if (same >= 0) return { kind: "same", index: same };
  // Both are products of a type set and a severity set: they share a cell when both sets meet.
  const partial = effects.findIndex((effect) => effect.crashTypes.some((type) => cells.crashTypes.includes(type)) && effect.severities.some((severity) => cells.severities.includes(severity)));
  return partial >= 0 ? { kind: "partial", index: partial } : { kind: "none" };
}

function sameSet<T>(a: readonly T[], b: readonly T[]): boolean {
  const left = new Set(a);
  const right = new Set(b);
  return left.size === right.size && [...left].every((item) => right.has(item));
}
