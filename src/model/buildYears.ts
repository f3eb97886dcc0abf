import type { ProgrammeYears } from "./programmeTypes.js";
import type { Site } from "./types.js";

/** The years a site may be built in: the programme's years within the site's earliest and latest. */
export function buildYears(site: Site, programme: ProgrammeYears): number[] {
  const first = Math.max(programme.firstYear, site.earliestYear ?? programme.firstYear);
  const last = Math.min(programme.firstYear + programme.years - 1, site.latestYear ?? Number.POSITIVE_INFINITY);
  const years: number[] = [];
  for (let year = first; year <= last; year += 1) years.push(year);
  return years;
}
