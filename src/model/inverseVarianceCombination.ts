import type { CmfEvidence } from "./beforeAfterTypes.js";

/**
 * Pools several estimates of one CMF into one by fixed-effect (inverse-variance) meta-analysis on
 * the log scale (e.g. Borenstein, Hedges, Higgins and Rothstein, "Introduction to Meta-Analysis",
 * 2009, ch. 11; the usual way CMF studies are pooled, common practice):
 *
 *   Var(ln CMF_j) ≈ (SE_j / CMF_j)²  (delta method),  w_j = 1 / Var(ln CMF_j),
 *   ln C = Σ w_j ln CMF_j / Σ w_j,  SE(ln C) = 1 / sqrt(Σ w_j),
 *   cmf = exp(ln C),  standardError = cmf · SE(ln C)  (delta method back).
 *
 * Assumes the estimates are independent (no site or crash counted in two of them) and measure one
 * common true effect (no real variation between places or designs; where there is, a
 * random-effects model would widen the interval), and that each is roughly normal on the log
 * scale. The pooled relative SE is never larger than the smallest input's.
 * RangeError on an empty list, a CMF ≤ 0 or an SE ≤ 0 (or either not finite).
 * @example [{cmf: 0.8, SE: 0.08}, {cmf: 0.6, SE: 0.12}] → weights 100 and 25, C = exp((100 ln 0.8 + 25 ln 0.6)/125) ≈ 0.7553, SE ≈ 0.0676.
 */
export function inverseVarianceCombination(evidence: readonly CmfEvidence[]): CmfEvidence {
  if (evidence.length === 0) throw new RangeError("no CMF estimates to combine");
  let weightSum = 0;
  let weightedLogSum = 0;
  for (const { cmf, standardError } of evidence) {
    if (!(cmf > 0) || !Number.isFinite(cmf)) throw new RangeError(`a CMF must be a finite number > 0, got ${cmf}`);
    if (!(standardError > 0) || !Number.isFinite(standardError)) throw new RangeError(`a standard error must be a finite number > 0, got ${standardError}`);
    const weight = (cmf / standardError) ** 2;
    weightSum += weight;
    weightedLogSum += weight * Math.log(cmf);
  }
  const cmf = Math.exp(weightedLogSum / weightSum);
  return { cmf, standardError: cmf / Math.sqrt(weightSum) };
}
