import { formatFieldPath } from "./fieldPath.js";
import type { InputProblem } from "./InputError.js";
import { isoDayText, parseIsoDay, sameDayYearsLater } from "./parseIsoDay.js";
import type { RawBuiltProjects, RawPeriod } from "./RawBuiltProjects.js";
import type { PathSegment, YamlSource } from "./readYamlFile.js";

/**
 * Checks every before and after period of the treated and comparison sites: real calendar days,
 * `to` not before `from`, an after period of at least a year (fewer after-days say next to nothing
 * of a treatment's effect, and a season's crashes would pass for it), and crash counts given
 * exactly when the file names no crash records.
 */
export function checkStudyPeriods(raw: RawBuiltProjects, source: YamlSource): InputProblem[] {
  const problems: InputProblem[] = [];
  const problem = (code: string, path: PathSegment[], message: string, hint: string, key = false) =>
    problems.push({ code, file: source.file, ...source.positionOf(path, key), path: formatFieldPath(path), message, hint });
  const withRecords = raw.crashRecords !== undefined;
  const sites = [
    ...raw.sites.map((site, index) => ({ site, at: ["sites", index] as PathSegment[] })),
    ...(raw.comparisonSites ?? []).map((site, index) => ({ site, at: ["comparisonSites", index] as PathSegment[] })),
  ];
  for (const { site, at } of sites) {
    for (const part of ["before", "after"] as const) {
      const period: RawPeriod = site[part];
      const path = [...at, part];
      const days = periodDays(period, path, problem);
      if (days !== undefined && part === "after") {
        const yearOn = sameDayYearsLater(days.from, 1) - 1;
        if (days.to < yearOn) {
          const length = days.to - days.from + 1;
          problem(
            "after-too-short",
            path,
            `the after period ${period.from} to ${period.to} covers ${length} day(s), ${yearOn - days.to} short of a year; it must cover at least a year`,
            `extend 'to' to ${isoDayText(yearOn)} or later, once a full year of crashes after the works is on record`,
          );
        }
      }
      if (withRecords && period.crashes !== undefined) {
        problem("crashes-with-records", [...path, "crashes"], `site '${site.id}' gives ${part} crashes, and crashRecords says to count them from the crash records`, "remove these crashes, or remove crashRecords and give every period's crashes", true);
      }
      if (!withRecords && period.crashes === undefined) {
        problem("missing-crashes", path, `site '${site.id}' gives no ${part} crashes`, "add crashes: { angle: { B: 2 }, ... } (crashes: {} for none), or name the crash records under crashRecords");
      }
    }
  }
  return problems;
}

/** The period's first and last day numbers, when both are real days in order; else reports why. */
function periodDays(
  period: RawPeriod,
  path: PathSegment[],
  problem: (code: string, path: PathSegment[], message: string, hint: string) => void,
): { from: number; to: number } | undefined {
  const from = parseIsoDay(period.from);
  const to = parseIsoDay(period.to);
  if (from === undefined) problem("invalid-date", [...path, "from"], `'${period.from}' is not a day of the calendar`, INVALID_DATE_HINT);
  if (to === undefined) problem("invalid-date", [...path, "to"], `'${period.to}' is not a day of the calendar`, INVALID_DATE_HINT);
  if (from === undefined || to === undefined) return undefined;
  if (to < from) {
    problem("period-reversed", [...path, "to"], `the period ends (${period.to}) before it starts (${period.from})`, "swap from and to, or correct the year");
    return undefined;
  }
  return { from, to };
}

/** What a date must be, for every invalid-date problem. */
export const INVALID_DATE_HINT = "write a real day as YYYY-MM-DD, from 1900 to 2100 (e.g. 2020-02-29 exists, 2021-02-29 does not)";
