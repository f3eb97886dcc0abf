import { buildCrashMatrix } from "../model/crashMatrix.js";
import { CRASH_TYPES, SEVERITIES, type CrashMatrix } from "../model/types.js";
import { assignCrashes, type AssignOptions } from "./assignCrashes.js";
import type { CrashRecord } from "./CrashRecord.js";
import type { NetworkSite } from "./NetworkSite.js";

/** A span of days at one site, inclusive, as ISO dates (YYYY-MM-DD compare as text). */
export interface SitePeriod {
  readonly site: string;
  readonly from: string;
  readonly to: string;
}

/**
 * Crashes by type and severity at each site in each period: the records are assigned to sites
 * by the same rules as `tally` (assignCrashes), and a crash counts in every period of its site
 * that contains its day. A repeated crash id counts once (its first row), as in `tally`.
 * Periods must name sites of the list.
 */
export function periodCrashCounts(sites: readonly NetworkSite[], records: readonly CrashRecord[], periods: readonly SitePeriod[], options: Partial<AssignOptions> = {}): CrashMatrix[] {
  const seen = new Set<string>();
  const unique: CrashRecord[] = [];
  for (const record of records) {
    if (seen.has(record.id)) continue;
    seen.add(record.id);
    unique.push(record);
  }
  const assignment = assignCrashes(sites, unique.map((record) => record.location), options);
  const indexOf = new Map(sites.map((site, index) => [site.id, index]));
  const cells = CRASH_TYPES.length * SEVERITIES.length;
  const counts = periods.map(() => new Int32Array(cells));
  const periodsOfSite = new Map<number, number[]>();
  periods.forEach((period, index) => {
    const site = indexOf.get(period.site);
    if (site === undefined) throw new RangeError(`period ${index} names site ${period.site}, which is not on the map`);
    periodsOfSite.set(site, [...(periodsOfSite.get(site) ?? []), index]);
  });
  unique.forEach((record, index) => {
    const site = assignment.site[index]!;
    if (site < 0) return;
    const cell = CRASH_TYPES.indexOf(record.type) * SEVERITIES.length + SEVERITIES.indexOf(record.severity);
    for (const period of periodsOfSite.get(site) ?? []) if (record.date >= periods[period]!.from && record.date <= periods[period]!.to) counts[period]![cell]!++;
  });
  return counts.map((count) => buildCrashMatrix((type, severity) => count[CRASH_TYPES.indexOf(type) * SEVERITIES.length + SEVERITIES.indexOf(severity)]!));
}
