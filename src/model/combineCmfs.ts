import { treatmentCmf } from "./treatmentCmf.js";
import type { CmfCombination, CmfCombinationRule, CrashType, Severity, Treatment } from "./types.js";

/** The CMF a treatment applies to one crash cell (treatmentCmf, or a faster lookup of the same values). */
export type CellCmf = (treatment: Treatment, type: CrashType, severity: Severity) => number;

/** The default rule: Highway Safety Manual (AASHTO 2010), Part D introduction. */
export const MULTIPLICATIVE: CmfCombination = { rule: "multiplicative" };

const RULE_TEXT: Readonly<Record<CmfCombinationRule, string>> = {
  multiplicative:
    "multiplicative: the CMFs of treatments applied together are multiplied, cell by cell (Highway Safety Manual 2010, Part D default; it assumes independent effects and may overstate the benefit of treatments aimed at the same crashes)",
  "dominant-effect":
    "dominant effect: in each crash cell only the strongest (lowest) CMF of the treatments applied together counts (a conservative rule for treatments aimed at the same crashes; it may understate truly independent effects)",
  "dominant-common-residuals":
    "dominant common residuals: in each crash cell the product of the acting treatments' CMFs is raised to the power of the strongest (lowest) one, CMF = (CMF1 × CMF2 × …)^min(CMF) (Turner 2011, NZ Transport Agency research, from memory; worked example in the Texas DOT Traffic Safety Program manual, section 5.4.5.5; a middle course between multiplying and taking the strongest; where the formula would exceed the strongest CMF, as it can when that CMF is low, the strongest CMF is used)",
};

/** The combination rule in words, with its floor, as every output states it. */
export function describeCmfCombination(combination: CmfCombination): string {
  const floor = combination.floor === undefined ? "" : `; no cell's combined CMF goes below ${combination.floor}`;
  return RULE_TEXT[combination.rule] + floor;
}

/**
 * Combined CMF of several treatments on one crash cell by the scenario's rule (see RULE_TEXT).
 * Only treatments whose CMF in the cell differs from 1 act on it; one acting treatment keeps its
 * own CMF under every rule. The floor, when set, bounds the result from below (never above 1).
 * @example CMFs 0.95, 0.65, 0.80: multiplicative 0.494, dominant effect 0.65, dominant common residuals 0.494^0.65 = 0.632.
 */
export function combineCmfs(
  treatments: readonly Treatment[],
  type: CrashType,
  severity: Severity,
  cellCmf: CellCmf = treatmentCmf,
  combination: CmfCombination = MULTIPLICATIVE,
): number {
  return combineCmfValues(treatments.map((treatment) => cellCmf(treatment, type, severity)), treatments.length, combination);
}

/** combineCmfs on `count` treatments' CMFs in one cell, given as numbers from `cmfs[offset]` on (in treatment order). */
export function combineCmfValues(cmfs: ArrayLike<number>, count: number, combination: CmfCombination = MULTIPLICATIVE, offset = 0): number {
  let product = 1;
  let lowest = Infinity;
  let acting = 0;
  for (let i = offset; i < offset + count; i += 1) {
    const cmf = cmfs[i]!;
    if (cmf === 1) continue;
    product *= cmf;
    if (cmf < lowest) lowest = cmf;
    acting += 1;
  }
  if (acting === 0) return 1;
  let combined = product;
  if (acting > 1 && combination.rule === "dominant-effect") combined = lowest;
  // For a strong lowest CMF the published formula can exceed that CMF (0.42 and 0.6 give 0.56):
  // a combination is never credited with less than its strongest member.
  if (acting > 1 && combination.rule === "dominant-common-residuals") combined = Math.min(lowest, Math.pow(product, lowest));
  return combination.floor !== undefined && combined < combination.floor ? Math.min(1, combination.floor) : combined;
}

/** How many of these treatments act (CMF ≠ 1) on one crash cell. */
export function actingTreatments(treatments: readonly Treatment[], type: CrashType, severity: Severity, cellCmf: CellCmf = treatmentCmf): number {
  let acting = 0;
  for (const treatment of treatments) if (cellCmf(treatment, type, severity) !== 1) acting += 1;
  return acting;
}
