/**
 * The built projects a before-after evaluation studies, as a projects file gives them: plain
 * data. Dates are ISO calendar days (YYYY-MM-DD); periods include both their first and last day.
 */
import type { CrashMatrix, SiteKind } from "./types.js";

/** Days in an average Gregorian year: a period's length in years is its days over this. */
export const DAYS_PER_YEAR = 365.25;

/** One observation period at a site: before the works, or after them. */
export interface StudyPeriod {
  /** First day of the period. */
  readonly from: string;
  /** Last day of the period (included). */
  readonly to: string;
  /** Days from `from` to `to`, both included, over DAYS_PER_YEAR: 2016-01-01 to 2019-12-31 is 4. */
  readonly years: number;
  /** Average annual daily traffic over the period, when known; an SPF needs it. */
  readonly aadt?: number;
  /** Crashes over the whole period; absent until counted from crash records when the file names them. */
  readonly crashes?: CrashMatrix;
}

/** A treated site with its crash record before and after the works. */
export interface StudySite {
  readonly id: string;
  readonly name?: string;
  readonly kind: SiteKind;
  /** Length of a segment or corridor; absent at an intersection. */
  readonly lengthKm?: number;
  /** Id of a catalogue SPF; with AADT in both periods the site can enter an Empirical Bayes estimate. */
  readonly performanceFunction?: string;
  readonly before: StudyPeriod;
  readonly after: StudyPeriod;
}

/** The works done at one treated site: every treatment built there, and when. */
export interface BuiltProject {
  /** Id of a StudySite. */
  readonly site: string;
  /** Catalogue treatment ids, at least one, each once. */
  readonly treatments: readonly string[];
  /** The day the works finished (for a file giving only the build year: that year's last day). */
  readonly completed: string;
  /** The day the works began, when known (for a file giving only the build year: that year's first day). */
  readonly constructionStart?: string;
  /** A name under which projects are evaluated together; absent: grouped by their treatments. */
  readonly group?: string;
}

/** An untreated site like the treated ones, whose change in crashes stands for what would have happened anyway. */
export interface ComparisonSite {
  readonly id: string;
  /** The project group it serves; absent: every group. */
  readonly group?: string;
  readonly before: StudyPeriod;
  readonly after: StudyPeriod;
}

/** Where the crash counts come from when the periods do not state them: the files `averta tally` reads. */
export interface CrashRecordFiles {
  /** The crash CSV. */
  readonly crashes: string;
  /** The sites GeoJSON. */
  readonly sites: string;
  /** The crash-code mapping file, if not the default one. */
  readonly mapping?: string;
}

/** A projects file, loaded: the study a before-after evaluation runs on. */
export interface BuiltProjects {
  /** The evaluation's title. */
  readonly evaluation: string;
  readonly projects: readonly BuiltProject[];
  /** Every treated site, each with exactly one project. */
  readonly sites: readonly StudySite[];
  /** Empty when the file gives none. */
  readonly comparisonSites: readonly ComparisonSite[];
  /** Present when counts come from crash records; then no period carries crashes until they are counted. */
  readonly crashRecords?: CrashRecordFiles;
}
