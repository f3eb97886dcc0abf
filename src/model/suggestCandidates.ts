import { treatmentCmf } from "./treatmentCmf.js";
import { CRASH_TYPES, KSI_SEVERITIES, SEVERITIES, type CrashType, type Site, type Treatment } from "./types.js";

/** One suggested candidate treatment, with the site's crashes its effects act on. */
export interface CandidateSuggestion {
  readonly treatment: string;
  /** K+A crashes over the crash window in the cells where the treatment's CMF is below 1. */
  readonly ksiCovered: number;
  /** All crashes over the crash window in those cells. */
  readonly crashesCovered: number;
  /** K+A crashes of the window the treatment alone would have avoided: Σ crashes × (1 − CMF) over its K+A cells. */
  readonly ksiAvoided: number;
  /** All crashes of the window it alone would have avoided. */
  readonly crashesAvoided: number;
  /** The crash types of those cells that hold crashes, most crashes first. */
  readonly crashTypes: readonly CrashType[];
}

/** How many treatments are suggested per site unless asked otherwise. */
export const DEFAULT_MAX_SUGGESTIONS = 3;

/**
 * Suggests candidate treatments for one site from a catalogue: those that apply to the site's
 * kind and area (and, when costed per km, only at a site with a length) and whose CMF is below 1 in
 * crash type × severity cells where the site has crashes. They are ranked by the K+A crashes
 * in the cells they act on, then by all crashes there; treatments that act on the same crashes
 * (broad, all-crash effects often do) are then ordered by the K+A crashes, then all crashes,
 * they alone would have avoided over the window (Σ crashes × (1 − CMF)), then by id; the first
 * `max` are kept. A screening heuristic for an engineer to review, not a design: it ignores cost
 * and site conditions (the optimiser weighs cost among the candidates the engineer keeps), and
 * it may suggest treatments of one exclusive group, which are then alternatives to each other.
 * Cost: O(treatments × cells × effects).
 */
export function suggestCandidates(site: Site, treatments: readonly Treatment[], max: number = DEFAULT_MAX_SUGGESTIONS): CandidateSuggestion[] {
  if (!(Number.isInteger(max) && max >= 0)) throw new RangeError(`max must be a whole number, got ${max}`);
  const suggestions: CandidateSuggestion[] = [];
  for (const treatment of treatments) {
    if (!treatment.appliesTo.includes(site.kind)) continue;
    if (site.area !== undefined && treatment.appliesToAreas !== undefined && !treatment.appliesToAreas.includes(site.area)) continue;
    if (treatment.cost.basis === "per-km" && site.lengthKm === undefined) continue;
    let ksiCovered = 0;
    let crashesCovered = 0;
    let ksiAvoided = 0;
    let crashesAvoided = 0;
    const byType: [CrashType, number][] = [];
    for (const type of CRASH_TYPES) {
      let inType = 0;
      for (const severity of SEVERITIES) {
        const crashes = site.crashes[type][severity];
        const cmf = treatmentCmf(treatment, type, severity);
        if (crashes === 0 || !(cmf < 1)) continue;
        inType += crashes;
        crashesAvoided += crashes * (1 - cmf);
        if (KSI_SEVERITIES.includes(severity)) {
          ksiCovered += crashes;
          ksiAvoided += crashes * (1 - cmf);
        }
      }
      crashesCovered += inType;
      if (inType > 0) byType.push([type, inType]);
    }
    if (crashesCovered === 0) continue;
    // A stable sort keeps the catalogue's order of crash types among equal counts.
    const crashTypes = byType.sort((a, b) => b[1] - a[1]).map(([type]) => type);
    suggestions.push({ treatment: treatment.id, ksiCovered, crashesCovered, ksiAvoided, crashesAvoided, crashTypes });
  }
  suggestions.sort(
    (a, b) =>
      b.ksiCovered - a.ksiCovered ||
      b.crashesCovered - a.crashesCovered ||
      b.ksiAvoided - a.ksiAvoided ||
      b.crashesAvoided - a.crashesAvoided ||
      (a.treatment < b.treatment ? -1 : a.treatment > b.treatment ? 1 : 0),
  );
  return suggestions.slice(0, max);
}
