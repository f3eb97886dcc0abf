import type { CrashRecordFiles } from "../model/builtProjectTypes.js";
import type { CrashType, Severity, SiteKind } from "../model/types.js";
import type { WrittenProjectDates } from "./projectCompletion.js";

/**
 * A projects file as written, once schema/projects.schema.json has accepted it: the shape the
 * checks read before it is converted to the model's BuiltProjects.
 */
export interface RawBuiltProjects {
  readonly evaluation: string;
  readonly catalogues: readonly string[];
  readonly projects: readonly RawProject[];
  readonly sites: readonly RawStudySite[];
  readonly comparisonSites?: readonly RawComparisonSite[];
  readonly crashRecords?: CrashRecordFiles;
}

/** Crashes as a file writes them: the cells left out are zero. */
export type WrittenCrashes = Partial<Record<CrashType, Partial<Record<Severity, number>>>>;

export interface RawPeriod {
  readonly from: string;
  readonly to: string;
  readonly aadt?: number;
  readonly crashes?: WrittenCrashes;
}

export interface RawProject extends WrittenProjectDates {
  readonly site: string;
  readonly treatments: readonly string[];
  readonly group?: string;
}

export interface RawStudySite {
  readonly id: string;
  readonly name?: string;
  readonly kind: SiteKind;
  readonly lengthKm?: number;
  readonly performanceFunction?: string;
  readonly before: RawPeriod;
  readonly after: RawPeriod;
}

export interface RawComparisonSite {
  readonly id: string;
  readonly group?: string;
  readonly before: RawPeriod;
  readonly after: RawPeriod;
}
