import type { CellCmf } from "./combineCmfs.js";
import { CRASH_TYPES, SEVERITIES, type CrashMatrix, type Treatment } from "./types.js";

/** The non-empty crash cells of a site and each treatment's CMF in them, as avoidedOverSpans reads them. */
export interface AlternativeCells {
  readonly count: number;
  readonly expected: Float64Array;
  /** Severity index of cell c, KABCO order. */
  readonly severity: Int32Array;
  /** cmfs[c * n + i]: the CMF of treatment i in cell c. */
  readonly cmfs: Float64Array;
}

/** The cells with expected crashes (most of a site's crash matrix is empty), each treatment's CMF looked up once. */
export function alternativeCells(treatments: readonly Treatment[], expectedPerYear: CrashMatrix, cellCmf: CellCmf): AlternativeCells {
  const expected: number[] = [];
  const severity: number[] = [];
  const cmfs: number[] = [];
  for (const type of CRASH_TYPES) {
    SEVERITIES.forEach((cellSeverity, s) => {
      const value = expectedPerYear[type][cellSeverity];
      if (value === 0) return;
      expected.push(value);
      severity.push(s);
      for (const treatment of treatments) cmfs.push(cellCmf(treatment, type, cellSeverity));
    });
  }
  return { count: expected.length, expected: Float64Array.from(expected), severity: Int32Array.from(severity), cmfs: Float64Array.from(cmfs) };
}
