import { crashCellsText } from "./crashCellsText.js";
import type { Treatment } from "./types.js";

/**
 * One sentence per effect whose CMF rests on local evidence: the treatment, its crash cells, the
 * CMF (and SE) the model uses, and how it was reached from which inputs (the effect's source).
 * Every place that states assumptions prints these, so a pooled CMF is never shown without both
 * of its inputs. Empty when no catalogue of the scenario carries local evidence.
 * @example "leading-pedestrian-interval on pedestrian crashes, all severities: CMF 0.850 (SE 0.042), pooled by inverse-variance weighting of ln CMF: published 0.87 (SE 0.05, …) and local 0.79 (SE 0.08, …)"
 */
export function effectEvidenceLines(treatments: readonly Treatment[]): string[] {
  return treatments.flatMap((treatment) =>
    treatment.effects
      .filter((effect) => effect.evidence !== undefined)
      .map((effect) => `${treatment.id} on ${crashCellsText(effect)}: CMF ${effect.cmf.toFixed(3)}${effect.standardError !== undefined && effect.standardError > 0 ? ` (SE ${effect.standardError.toFixed(3)})` : " (no standard error)"}, ${effect.source}`),
  );
}
