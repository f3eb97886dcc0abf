import type { LocalCmf } from "../model/effectEvidenceTypes.js";
import { CRASH_TYPES, SEVERITIES, type CrashType, type Severity } from "../model/types.js";

/** A `localEvidence:` entry as the catalogue schema admits it. */
export interface RawLocalEvidence {
  treatment: string;
  crashTypes: (CrashType | "all")[];
  severities?: Severity[];
  cmf: number;
  standardError: number;
  source: string;
}

/** One local CMF of a catalogue file, with its crash cells spelled out as an effect's are. */
export interface CatalogueLocalEvidence extends LocalCmf {
  /** The treatment it is evidence for, defined in any catalogue of the scenario. */
  readonly treatment: string;
  readonly crashTypes: readonly CrashType[];
  readonly severities: readonly Severity[];
}

/**
 * Converts a catalogue's `localEvidence:` entries, in order (their index is their position in
 * the file, for locating problems): `all` becomes every crash type, no severities every severity,
 * exactly as an effect's cells are read, so the two can be compared cell for cell.
 */
export function toLocalEvidence(raw: readonly RawLocalEvidence[] | undefined): CatalogueLocalEvidence[] {
  return (raw ?? []).map((entry) => ({
    treatment: entry.treatment,
    crashTypes: entry.crashTypes.includes("all") ? CRASH_TYPES : (entry.crashTypes as CrashType[]),
    severities: entry.severities ?? SEVERITIES,
    cmf: entry.cmf,
    standardError: entry.standardError,
    source: entry.source,
  }));
}
