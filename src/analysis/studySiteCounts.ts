import type { TreatedSiteCounts } from "../model/beforeAfterTypes.js";
import type { StudyPeriod, StudySite } from "../model/builtProjectTypes.js";
import { crashesInGroup, type CrashGroup } from "../model/crashGroup.js";
import { predictedCrashesPerYear } from "../model/predictedCrashesPerYear.js";
import { siteOverdispersion } from "../model/siteOverdispersion.js";
import type { SafetyPerformanceFunction } from "../model/types.js";

/** Why a treated site cannot enter the Empirical Bayes estimate, or undefined when it can. */
export function withoutEmpiricalBayes(site: StudySite, spf: SafetyPerformanceFunction | undefined): string | undefined {
  if (site.performanceFunction === undefined) return "no SPF named";
  if (spf === undefined) return `SPF ${site.performanceFunction} is not in the catalogues`;
  if (!(site.before.aadt !== undefined && site.before.aadt > 0 && site.after.aadt !== undefined && site.after.aadt > 0)) return "no AADT for both periods";
  if (site.kind !== "intersection" && spf.lengthExponent !== 0 && !(site.lengthKm !== undefined && site.lengthKm > 0)) return "no length for its SPF";
  return undefined;
}

function observed(period: StudyPeriod, group: CrashGroup): number {
  if (period.crashes === undefined) throw new TypeError(`the period ${period.from}–${period.to} has no crash counts; fill them from the crash records first`);
  return crashesInGroup(period.crashes, group);
}

/**
 * One treated site's crashes of a crash group before and after, and, when it has an SPF and AADT
 * for both periods, the SPF's prediction of the group over each period: crashes a year at that
 * period's AADT × years × the SPF's share of the group's cells. The site's k is the SPF's (per km
 * when so stated); the same k serves each crash group, an approximation, since SPFs rarely state
 * k by crash type (common practice).
 */
export function studySiteCounts(site: StudySite, spf: SafetyPerformanceFunction | undefined, group: CrashGroup): TreatedSiteCounts {
  const counts = {
    site: site.id,
    beforeYears: site.before.years,
    afterYears: site.after.years,
    beforeObserved: observed(site.before, group),
    afterObserved: observed(site.after, group),
  };
  if (spf === undefined || withoutEmpiricalBayes(site, spf) !== undefined) return counts;
  const share = crashesInGroup(spf.shares, group);
  if (!(share > 0)) return counts; // the SPF predicts none of these crashes, so it cannot weigh them
  const predicted = (period: StudyPeriod) => predictedCrashesPerYear(spf, site.kind, period.aadt!, site.lengthKm) * period.years * share;
  return { ...counts, spf: { beforePredicted: predicted(site.before), afterPredicted: predicted(site.after), overdispersion: siteOverdispersion(spf, site.kind, site.lengthKm) } };
}
