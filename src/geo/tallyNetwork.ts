import { buildCrashMatrix } from "../model/crashMatrix.js";
import { CRASH_TYPES, SEVERITIES, type CrashType, type Severity, type Site } from "../model/types.js";
import { assignCrashes, type AssignOptions } from "./assignCrashes.js";
import { REJECT_REASONS, type CrashRecord, type RejectedRow, type RejectReason, type UnknownCode } from "./CrashRecord.js";
import { inferCrashWindow, type WindowInference } from "./inferCrashWindow.js";
import type { NetworkSite } from "./NetworkSite.js";
import { polylineLengthKm } from "./polylineLengthKm.js";
import { polylineMidpoint } from "./polylineMidpoint.js";

/** Calendar years of crash data, both ends included. */
export interface CrashWindow {
  readonly firstYear: number;
  readonly lastYear: number;
}

/** What happened to every crash row, for the data-quality report. */
export interface CrashDataQuality {
  readonly window: CrashWindow;
  /** How the window was taken from the data, when none was given. */
  readonly windowInference?: WindowInference;
  /** Untranslated severity and type codes (rows rejected for them), most rows first. */
  readonly unknownCodes?: readonly UnknownCode[];
  readonly rowsRead: number;
  readonly assigned: number;
  readonly unassigned: number;
  /** Rejected rows in line order; `rejectedByReason` counts them. */
  readonly rejected: readonly RejectedRow[];
  readonly rejectedByReason: Readonly<Record<RejectReason, number>>;
  /** Unassigned crashes lying outside the sites' extent (grown by the larger reach). */
  readonly outsideExtent: number;
  /** Lines of the unassigned crashes, in order. */
  readonly unassignedLines: readonly number[];
  /** Per district (a crash's own site's, or its nearest site's when unassigned). */
  readonly districts: readonly { readonly district: string; readonly crashes: number; readonly unassigned: number }[];
  /** Per site, the window years in which it has at least one crash. */
  readonly yearsBySite: readonly { readonly site: string; readonly years: readonly number[] }[];
}

/** Scenario sites with their tallied crashes, and the data-quality account. */
export interface TallyResult {
  readonly sites: readonly Site[];
  readonly quality: CrashDataQuality;
}

/** Crash rows as a reader hands them over: records, rejected rows, and the codes it could not translate. */
export interface TallyRows {
  readonly rowsRead: number;
  readonly records: readonly CrashRecord[];
  readonly rejected: readonly RejectedRow[];
  readonly unknownCodes?: readonly UnknownCode[];
}

/**
 * Counts crashes by site, severity and type: keeps the rows within `window` (when it is
 * undefined, the window inferCrashWindow takes from the data: the latest run of full years, see
 * there), rejects repeated crash ids after the first, assigns the rest to sites (assignCrashes)
 * and tallies them. Every row ends up assigned, unassigned or rejected, so assigned + unassigned
 * + rejected = rows read.
 */
export function tallyNetwork(sites: readonly NetworkSite[], rows: TallyRows, window: CrashWindow | undefined, options: Partial<AssignOptions> = {}): TallyResult {
  const windowInference = window === undefined ? inferCrashWindow(rows.records) : undefined;
  const span: CrashWindow = window ?? windowInference?.window ?? { firstYear: 0, lastYear: 0 };
  const rejected: RejectedRow[] = [...rows.rejected];
  const kept: CrashRecord[] = [];
  const firstLineOfId = new Map<string, number>();
  for (const record of rows.records) {
    if (record.year < span.firstYear || record.year > span.lastYear) {
      rejected.push({ line: record.line, reason: "outside-window", message: `crash ${record.id} is from ${record.year}, outside ${span.firstYear}-${span.lastYear}` });
      continue;
    }
    const first = firstLineOfId.get(record.id);
    if (first !== undefined) {
      rejected.push({ line: record.line, reason: "duplicate-id", message: `crash id ${record.id} was already read on line ${first}` });
      continue;
    }
    firstLineOfId.set(record.id, record.line);
    kept.push(record);
  }
  rejected.sort((a, b) => a.line - b.line);

  const assignment = assignCrashes(sites, kept.map((record) => record.location), options);
  // Counts per site in one flat array: site × crash type × severity.
  const cellsPerSite = CRASH_TYPES.length * SEVERITIES.length;
  const cellOf = (type: CrashType, severity: Severity) => CRASH_TYPES.indexOf(type) * SEVERITIES.length + SEVERITIES.indexOf(severity);
  const counts = new Int32Array(sites.length * cellsPerSite);
  const yearSets = sites.map(() => new Set<number>());
  const districtCounts = new Map<string, { crashes: number; unassigned: number }>();
  const unassignedLines: number[] = [];
  let assigned = 0;
  let outsideExtent = 0;
  kept.forEach((record, index) => {
    const site = assignment.site[index]!;
    const districtSite = site >= 0 ? site : assignment.nearestSite[index]!;
    const district = sites[districtSite]!.district;
    const entry = districtCounts.get(district) ?? { crashes: 0, unassigned: 0 };
    entry.crashes++;
    districtCounts.set(district, entry);
    if (site < 0) {
      entry.unassigned++;
      unassignedLines.push(record.line);
      if (assignment.outsideExtent[index]) outsideExtent++;
      return;
    }
    assigned++;
    counts[site * cellsPerSite + cellOf(record.type, record.severity)]!++;
    yearSets[site]!.add(record.year);
  });

  const rejectedByReason = Object.fromEntries(REJECT_REASONS.map((reason) => [reason, 0])) as Record<RejectReason, number>;
  for (const row of rejected) rejectedByReason[row.reason]++;
  return {
    sites: sites.map((site, index) => toScenarioSite(site, (type, severity) => counts[index * cellsPerSite + cellOf(type, severity)]!)),
    quality: {
      window: span,
      ...(windowInference !== undefined && { windowInference }),
      ...(rows.unknownCodes !== undefined && rows.unknownCodes.length > 0 && { unknownCodes: rows.unknownCodes }),
      rowsRead: rows.rowsRead,
      assigned,
      unassigned: kept.length - assigned,
      rejected,
      rejectedByReason,
      outsideExtent,
      unassignedLines,
      districts: [...districtCounts].map(([district, entry]) => ({ district, ...entry })).sort((a, b) => (a.district < b.district ? -1 : a.district > b.district ? 1 : 0)),
      yearsBySite: sites.map((site, index) => ({ site: site.id, years: [...yearSets[index]!].sort((a, b) => a - b) })),
    },
  };
}

/** A network site as a scenario site: location at the point or the line's midpoint, geodesic length. */
function toScenarioSite(site: NetworkSite, count: (type: CrashType, severity: Severity) => number): Site {
  const isPoint = site.kind === "intersection";
  return {
    id: site.id,
    name: site.name,
    kind: site.kind,
    district: site.district,
    tags: site.tags,
    ...(site.area !== undefined && { area: site.area }),
    location: isPoint ? site.paths[0]![0]! : polylineMidpoint(site.paths),
    ...(!isPoint && { lengthKm: polylineLengthKm(site.paths) }),
    ...(site.aadt !== undefined && { aadt: site.aadt }),
    ...(site.performanceFunction !== undefined && { performanceFunction: site.performanceFunction }),
    crashes: buildCrashMatrix(count),
    candidates: site.candidates,
    costOverrides: {},
  };
}
