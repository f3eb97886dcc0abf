import { CRASH_TYPES, SEVERITIES, type CrashMatrix, type CrashType, type Severity } from "./types.js";

type PartialMatrix = Partial<Record<CrashType, Partial<Record<Severity, number>>>>;

/** A crash matrix whose cells are `cell(type, severity)`. */
export function buildCrashMatrix(cell: (type: CrashType, severity: Severity) => number): CrashMatrix {
  const matrix = {} as Record<CrashType, Record<Severity, number>>;
  for (const type of CRASH_TYPES) {
    const row = {} as Record<Severity, number>;
    for (const severity of SEVERITIES) row[severity] = cell(type, severity);
    matrix[type] = row;
  }
  return matrix;
}

/** Fills the cells a file left out with zero. */
export function completeCrashMatrix(partial: PartialMatrix | undefined): CrashMatrix {
  return buildCrashMatrix((type, severity) => partial?.[type]?.[severity] ?? 0);
}

/** Total of the cells with the given severities (all severities by default). */
export function sumCrashMatrix(matrix: CrashMatrix, severities: readonly Severity[] = SEVERITIES): number {
  let total = 0;
  for (const type of CRASH_TYPES) for (const severity of severities) total += matrix[type][severity];
  return total;
}

/** Totals by severity across crash types. */
export function totalsBySeverity(matrix: CrashMatrix): Record<Severity, number> {
  const totals = { K: 0, A: 0, B: 0, C: 0, O: 0 };
  for (const type of CRASH_TYPES) for (const severity of SEVERITIES) totals[severity] += matrix[type][severity];
  return totals;
}
