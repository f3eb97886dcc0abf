import { alternativeInBuildYear } from "./alternativeInBuildYear.js";
import { buildYears } from "./buildYears.js";
import type { CellCmf } from "./combineCmfs.js";
import type { CommittedProject, ProgrammeYears } from "./programmeTypes.js";
import type { SiteBaseline } from "./siteBaselines.js";
import type { Alternative, Economics, Site, Treatment } from "./types.js";

/**
 * A site's options in a programme: every treatment set in every year the site may be built in
 * (year by year, in set order), leaving out the years its phasing or the horizon rules out. A
 * committed site has one option, its committed project in its year.
 */
export function alternativesOverBuildYears(
  site: Site,
  sets: readonly (readonly Treatment[])[],
  baseline: SiteBaseline,
  economics: Economics,
  programme: ProgrammeYears,
  cellCmf: CellCmf,
  committed?: { project: CommittedProject; treatments: readonly Treatment[] },
): Alternative[] {
  const build = (set: readonly Treatment[], year: number, allowSpendBeforeStart: boolean) =>
    alternativeInBuildYear(site, set, baseline.expectedPerYear, economics, programme, year, cellCmf, baseline.crashGrowthPerYear ?? 1, allowSpendBeforeStart);
  if (committed !== undefined) {
    const alternative = build(committed.treatments, committed.project.year, true);
    return alternative === undefined ? [] : [alternative];
  }
  return buildYears(site, programme).flatMap((year) => sets.flatMap((set) => build(set, year, false) ?? []));
}
