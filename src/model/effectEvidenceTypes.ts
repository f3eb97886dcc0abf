/**
 * What an effect's CMF rests on when a catalogue carries local before-after evidence for it: the
 * published estimate, the local ones, and the rule that turned them into the CMF the model uses.
 * Kept on the effect so every output that shows assumptions can show both inputs and the result.
 */

/** One estimate of a CMF, with where it comes from; the standard error when one is known. */
export interface SourcedCmf {
  readonly cmf: number;
  readonly standardError?: number;
  readonly source: string;
}

/** A local CMF from a before-after evaluation: always with its standard error, or it could not be weighted. */
export interface LocalCmf extends SourcedCmf {
  readonly standardError: number;
}

/**
 * How an effect with local evidence got its CMF: pooled with the published one by
 * inverse-variance weighting of ln CMF, the published one kept because it has no standard error
 * to weight it by, or the local evidence alone because no published effect covers those crashes.
 */
export type EffectEvidenceRule = "inverse-variance" | "published-only (no standard error)" | "local-only";

export interface EffectEvidence {
  /** The catalogue's own effect on these crash cells; absent for "local-only". */
  readonly published?: SourcedCmf;
  /** The local estimates, in the order the catalogues list them (at least one). */
  readonly local: readonly LocalCmf[];
  readonly rule: EffectEvidenceRule;
}
