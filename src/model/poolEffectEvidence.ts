import type { EffectEvidence, LocalCmf, SourcedCmf } from "./effectEvidenceTypes.js";
import { inverseVarianceCombination } from "./inverseVarianceCombination.js";
import type { CrashCells } from "./matchEffectCells.js";
import { hasStandardError } from "./sampleTreatmentCmfs.js";
import type { Effect } from "./types.js";

/** Local evidence on one block of crash cells, and the catalogue's effect on exactly those cells if it has one. */
export interface EvidenceToPool extends CrashCells {
  /** The published effect covering exactly these cells; absent when no effect of the treatment touches them. */
  readonly published?: Effect;
  /** At least one local estimate. */
  readonly local: readonly LocalCmf[];
}

/**
 * The effect the model uses once local before-after evidence is added, with its evidence kept:
 * - a published effect with a standard error pools with the local estimates by inverse-variance
 *   weighting of ln CMF (inverseVarianceCombination: fixed-effect, so it assumes independent
 *   estimates of one common effect, each roughly normal on the log scale);
 * - a published effect without one cannot be weighted, so its CMF is kept as published;
 * - with no published effect the local estimates alone give the CMF (pooled if several).
 * The source says which, with every input. RangeError when `local` is empty.
 * @example published 0.87 (SE 0.05) and local 0.79 (SE 0.08) → CMF ≈ 0.8498, SE ≈ 0.0425
 */
export function poolEffectEvidence(input: EvidenceToPool): Effect {
  const { published, local } = input;
  if (local.length === 0) throw new RangeError("no local evidence to pool");
  const cells = { crashTypes: input.crashTypes, severities: input.severities };
  const locals = local.map((estimate) => `local ${sourcedCmfText(estimate)}`).join(" and ");
  if (published === undefined) {
    const pooled = local.length === 1 ? local[0]! : inverseVarianceCombination(local);
    const evidence: EffectEvidence = { local, rule: "local-only" };
    const how = local.length === 1 ? locals : `pooled by inverse-variance weighting of ln CMF: ${locals}`;
    return { ...cells, cmf: pooled.cmf, standardError: pooled.standardError, source: `${how}; no published effect covers these crashes`, evidence };
  }
  const stated: SourcedCmf = { cmf: published.cmf, ...(published.standardError !== undefined && { standardError: published.standardError }), source: published.source };
  if (!hasStandardError(published)) {
    const evidence: EffectEvidence = { published: stated, local, rule: "published-only (no standard error)" };
    return { ...published, ...cells, source: `published ${sourcedCmfText(stated)} kept; ${locals} not pooled: the published CMF has no standard error to weight it by`, evidence };
  }
  const pooled = inverseVarianceCombination([{ cmf: published.cmf, standardError: published.standardError! }, ...local]);
  const evidence: EffectEvidence = { published: stated, local, rule: "inverse-variance" };
  return { ...cells, cmf: pooled.cmf, standardError: pooled.standardError, source: `pooled by inverse-variance weighting of ln CMF: published ${sourcedCmfText(stated)} and ${locals}`, evidence };
}

/** "0.79 (SE 0.08, <source>)": the values as stated, the source on one line. */
function sourcedCmfText(estimate: SourcedCmf): string {
  const source = estimate.source.replace(/\s+/g, " ").trim();
  const error = estimate.standardError === undefined || !(estimate.standardError > 0) ? "no standard error" : `SE ${estimate.standardError}`;
  return `${estimate.cmf} (${error}, ${source})`;
}
