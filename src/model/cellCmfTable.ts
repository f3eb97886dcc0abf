import type { CellCmf } from "./combineCmfs.js";
import { treatmentCmf } from "./treatmentCmf.js";
import { CRASH_TYPES, SEVERITIES, type CrashType, type Severity, type Treatment } from "./types.js";

const CELL_INDEX = Object.fromEntries(
  CRASH_TYPES.map((type, t) => [type, Object.fromEntries(SEVERITIES.map((severity, s) => [severity, t * SEVERITIES.length + s]))]),
) as Record<CrashType, Record<Severity, number>>;

/**
 * treatmentCmf for these treatments, precomputed for every crash cell: the same values, looked
 * up in an array instead of searched through the effects. Treatments not in the list fall back to
 * treatmentCmf. Cost O(treatments × 40) to build.
 */
export function cellCmfTable(treatments: readonly Treatment[]): CellCmf {
  const table = new Map<Treatment, Float64Array>();
  for (const treatment of treatments) {
    const cells = new Float64Array(CRASH_TYPES.length * SEVERITIES.length);
    for (const type of CRASH_TYPES) for (const severity of SEVERITIES) cells[CELL_INDEX[type][severity]] = treatmentCmf(treatment, type, severity);
    table.set(treatment, cells);
  }
  return (treatment, type, severity) => {
    const cells = table.get(treatment);
    return cells === undefined ? treatmentCmf(treatment, type, severity) : cells[CELL_INDEX[type][severity]]!;
  };
}
