import { treatmentCmf } from "./treatmentCmf.js";
import type { CrashType, Severity, Treatment } from "./types.js";

/** How the CMFs of treatments applied together are combined; stated in every output. */
export const CMF_COMBINATION_RULE =
  "multiplicative: the CMFs of treatments applied together are multiplied, cell by cell (Highway Safety Manual, Part D default; it assumes independent effects and may overstate combined benefit)";

/** The CMF a treatment applies to one crash cell (treatmentCmf, or a faster lookup of the same values). */
export type CellCmf = (treatment: Treatment, type: CrashType, severity: Severity) => number;

/**
 * Combined CMF of several treatments on one crash cell by the multiplicative rule
 * (Highway Safety Manual 2010, Part D introduction: CMF_combined = CMF_1 × CMF_2 × …).
 */
export function combineCmfs(treatments: readonly Treatment[], type: CrashType, severity: Severity, cellCmf: CellCmf = treatmentCmf): number {
  let combined = 1;
  for (const treatment of treatments) combined *= cellCmf(treatment, type, severity);
  return combined;
}
