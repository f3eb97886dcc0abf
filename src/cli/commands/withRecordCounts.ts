import { DEFAULT_CRASH_MAPPING } from "../../io/CrashMapping.js";
import { InputError, type InputProblem } from "../../io/InputError.js";
import { readCrashCsv } from "../../io/readCrashCsv.js";
import { readCrashMapping } from "../../io/readCrashMapping.js";
import { readSitesGeojson } from "../../io/readSitesGeojson.js";
import { periodCrashCounts, type SitePeriod } from "../../geo/periodCrashCounts.js";
import type { BuiltProjects, StudyPeriod } from "../../model/builtProjectTypes.js";

/**
 * The study with every period's crash counts: as written in the file, or, when it names crash
 * records, counted from the crash CSV and sites GeoJSON by `tally`'s assignment rules, each crash
 * in the periods of its site that contain its day. A site not on the map, or a period reaching
 * outside the days the records cover, is an input error naming the projects file.
 */
export function withRecordCounts(study: BuiltProjects, file: string): BuiltProjects {
  const records = study.crashRecords;
  if (records === undefined) return study;
  const mapping = records.mapping === undefined ? DEFAULT_CRASH_MAPPING : readCrashMapping(records.mapping);
  const network = readSitesGeojson(records.sites);
  const rows = readCrashCsv(records.crashes, mapping);
  const days = rows.records.map((record) => record.date).sort();
  const first = days[0];
  const last = days[days.length - 1];
  const onMap = new Set(network.map((site) => site.id));
  const problems: InputProblem[] = [];
  const sites = [...study.sites.map((site, index) => ({ site, path: `sites[${index}]` })), ...study.comparisonSites.map((site, index) => ({ site, path: `comparisonSites[${index}]` }))];
  for (const { site, path } of sites) {
    if (!onMap.has(site.id)) problems.push({ code: "unknown-site", file, path: `${path}.id`, message: `site '${site.id}' is not on the map ${records.sites}`, hint: "use the id of a feature of the sites GeoJSON" });
    for (const part of ["before", "after"] as const) {
      const period = site[part];
      if (first === undefined || period.from < first || period.to > last!) {
        problems.push({ code: "outside-crash-data", file, path: `${path}.${part}`, message: `the ${part} period ${period.from} to ${period.to} reaches outside the crash records (${first === undefined ? "none usable" : `${first} to ${last}`}) in ${records.crashes}`, hint: "shorten the period to the days the crash file covers, or add the missing crash records" });
      }
    }
  }
  if (problems.length > 0) throw new InputError(problems);
  const periods: SitePeriod[] = sites.flatMap(({ site }) => [{ site: site.id, from: site.before.from, to: site.before.to }, { site: site.id, from: site.after.from, to: site.after.to }]);
  const counts = periodCrashCounts(network, rows.records, periods);
  let next = 0;
  const filled = <T extends { readonly before: StudyPeriod; readonly after: StudyPeriod }>(site: T): T => ({ ...site, before: { ...site.before, crashes: counts[next++]! }, after: { ...site.after, crashes: counts[next++]! } });
  return { ...study, sites: study.sites.map(filled), comparisonSites: study.comparisonSites.map(filled) };
}
