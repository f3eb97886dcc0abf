import { buildYears } from "../model/buildYears.js";
import type { ProgrammeYears } from "../model/programmeTypes.js";
import type { Alternative } from "../model/types.js";
import type { FundedProject } from "./fundedProject.js";
import type { ProgrammeYearSummary } from "./summariseYears.js";

/** Why a funded project is in its build year and not earlier, and what a one-year delay of it alone would cost. */
export interface ProjectTiming {
  readonly site: string;
  readonly buildYear: number;
  readonly notEarlier: "committed" | "first-year" | "earliest-year" | "phasing" | "budget" | "no-gain";
  /** The reason in plain words. */
  readonly reason: string;
  /** K+A crashes avoided and benefit PV lost if this project alone were built a year later (null when it cannot be). */
  readonly delayCostKsi: number | null;
  readonly delayCostBenefitPV: number | null;
}

const sameTreatments = (x: Alternative, y: Alternative) => x.treatments.length === y.treatments.length && x.treatments.every((id, i) => id === y.treatments[i]);

/**
 * The timing case of each funded project of a programme. Not earlier: the project is committed,
 * already in the first year, held by the site's earliest year or by its phasing (its design year
 * would fall before the programme), or the earlier year's budget (cumulative under carry-over)
 * lacks the extra spend; failing all of those, building earlier gains nothing in the objective.
 * The delay cost compares the same treatments a year later, every other project unchanged.
 */
export function justifyTiming(funded: readonly FundedProject[], programme: ProgrammeYears, years: readonly ProgrammeYearSummary[], committedSites: ReadonlySet<string>): ProjectTiming[] {
  return funded.map(({ entry, alternative }) => {
    const year = alternative.buildYear!;
    const options = entry.alternatives.filter((other) => sameTreatments(other, alternative));
    const inYear = (y: number) => options.find((other) => other.buildYear === y);
    const later = inYear(year + 1);
    const delay = {
      delayCostKsi: later === undefined ? null : alternative.ksiAvoided - later.ksiAvoided,
      delayCostBenefitPV: later === undefined ? null : alternative.benefitPV - later.benefitPV,
    };
    const site = entry.site.id;
    const timing = (notEarlier: ProjectTiming["notEarlier"], reason: string): ProjectTiming => ({ site, buildYear: year, notEarlier, reason, ...delay });
    if (committedSites.has(site)) return timing("committed", `committed to ${year} by an earlier programme`);
    if (year === programme.firstYear) return timing("first-year", "built in the programme's first year");
    const earliest = buildYears(entry.site, programme)[0];
    if (earliest !== undefined && year <= earliest) return timing("earliest-year", `the site may be built from ${earliest} only`);
    const earlier = inYear(year - 1);
    // The year before is in the site's window, so only phasing can have ruled it out.
    if (earlier === undefined) {
      return timing("phasing", `its capital is phased over the years before the build year, and a ${year - 1} build would spend before the programme's first year`);
    }
    // The extra spend a year earlier needs, set against that year's headroom (cumulative under carry-over).
    const y = year - 1 - programme.firstYear;
    const extra = (earlier.spendByYear?.[y] ?? 0) - (alternative.spendByYear?.[y] ?? 0);
    const headroom = years[y]!.unspent;
    if (extra > headroom) {
      return timing("budget", `a ${year - 1} build needs ${Math.round(extra).toLocaleString("en-US")} more in ${year - 1}, which has ${Math.round(Math.max(0, headroom)).toLocaleString("en-US")} left`);
    }
    return timing("no-gain", `a ${year - 1} build would fit ${year - 1}'s budget but, with the rest of the programme, would not avoid more (the list is optimal as a whole)`);
  });
}
