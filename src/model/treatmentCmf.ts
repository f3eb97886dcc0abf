import type { CrashType, Severity, Treatment } from "./types.js";

/**
 * The CMF a treatment applies to one crash cell: its first effect that covers the cell
 * (catalogues list specific effects before catch-all ones), or 1 when none does.
 */
export function treatmentCmf(treatment: Treatment, type: CrashType, severity: Severity): number {
  for (const effect of treatment.effects) {
    if (effect.crashTypes.includes(type) && effect.severities.includes(severity)) return effect.cmf;
  }
  return 1;
}
