import type { EffectEstimate } from "../model/beforeAfterTypes.js";
import type { BuiltProject, BuiltProjects, StudySite } from "../model/builtProjectTypes.js";
import { comparisonGroupBeforeAfter } from "../model/comparisonGroupBeforeAfter.js";
import { ALL_CRASHES, crashesInGroup, crashTypeGroup, KSI_CRASHES, type CrashGroup } from "../model/crashGroup.js";
import { empiricalBayesBeforeAfter } from "../model/empiricalBayesBeforeAfter.js";
import { naiveBeforeAfter } from "../model/naiveBeforeAfter.js";
import { CRASH_TYPES, type Catalogue } from "../model/types.js";
import { studySiteCounts, withoutEmpiricalBayes } from "./studySiteCounts.js";

/** Crashes of a type the treated sites must have seen before for that type to get an estimate of its own (common practice: a rough floor). */
export const MIN_BEFORE_CRASHES_BY_TYPE = 20;
/** Crashes after below which an estimate is flagged unstable (common practice). */
export const FEW_AFTER_CRASHES = 10;
/** After-period years below which an estimate is flagged (Hauer 1997 and HSM Part B ch. 9 advise several years; common practice: at least 2). */
export const FEW_AFTER_YEARS = 2;

/** The effect of one group of built projects on one crash group, by each method that applies. */
export interface CrashGroupEvaluation {
  readonly crashGroup: CrashGroup;
  readonly beforeObserved: number;
  readonly afterObserved: number;
  readonly empiricalBayes: EffectEstimate | null;
  readonly comparisonGroup: EffectEstimate | null;
  readonly naive: EffectEstimate | null;
  readonly warnings: readonly string[];
}

/** One group of projects (a user-named group, or all projects with the same treatments). */
export interface ProjectGroupEvaluation {
  readonly name: string;
  /** The treatments every project of the group has; one treatment means its estimates can go into the catalogue. */
  readonly treatments: readonly string[];
  /** Whether every project of the group has exactly those treatments (else the effect is of a mix). */
  readonly sameTreatments: boolean;
  readonly sites: readonly string[];
  readonly beforeSiteYears: number;
  readonly afterSiteYears: number;
  /** Sites that cannot enter the Empirical Bayes estimate, with why. */
  readonly withoutEmpiricalBayes: readonly { readonly site: string; readonly why: string }[];
  readonly comparisonSites: number;
  readonly crashGroups: readonly CrashGroupEvaluation[];
}

export interface Evaluation {
  readonly title: string;
  readonly groups: readonly ProjectGroupEvaluation[];
}

/**
 * The before-after study of built projects: projects grouped (by `group`, else by their treatment
 * set), and for each group the effect on all crashes, on K+A crashes and on each crash type the
 * treated sites saw at least MIN_BEFORE_CRASHES_BY_TYPE of before, by Empirical Bayes (sites with
 * an SPF and AADT), by comparison group (when comparison sites are given) and naively. Every
 * period must carry its crash counts.
 */
export function evaluateBuiltProjects(study: BuiltProjects, catalogue: Catalogue): Evaluation {
  const sites = new Map(study.sites.map((site) => [site.id, site]));
  const spfs = new Map(catalogue.performanceFunctions.map((spf) => [spf.id, spf]));
  const groups = new Map<string, BuiltProject[]>();
  for (const project of study.projects) {
    const name = project.group ?? [...project.treatments].sort().join(" + ");
    groups.set(name, [...(groups.get(name) ?? []), project]);
  }
  return {
    title: study.evaluation,
    groups: [...groups].map(([name, projects]) => {
      const treated = projects.map((project) => sites.get(project.site)!);
      const comparison = study.comparisonSites.filter((site) => site.group === undefined || site.group === name);
      const spfOf = (site: StudySite) => (site.performanceFunction === undefined ? undefined : spfs.get(site.performanceFunction));
      const crashGroups = [ALL_CRASHES, KSI_CRASHES, ...CRASH_TYPES.map(crashTypeGroup).filter((group) => sum(treated.map((site) => crashesInGroup(site.before.crashes!, group))) >= MIN_BEFORE_CRASHES_BY_TYPE)];
      const afterSiteYears = sum(treated.map((site) => site.after.years));
      return {
        name,
        treatments: projects[0]!.treatments.filter((id) => projects.every((project) => project.treatments.includes(id))),
        sameTreatments: projects.every((project) => project.treatments.length === projects[0]!.treatments.length && project.treatments.every((id) => projects[0]!.treatments.includes(id))),
        sites: treated.map((site) => site.id),
        beforeSiteYears: sum(treated.map((site) => site.before.years)),
        afterSiteYears,
        withoutEmpiricalBayes: treated.flatMap((site) => {
          const why = withoutEmpiricalBayes(site, spfOf(site));
          return why === undefined ? [] : [{ site: site.id, why }];
        }),
        comparisonSites: comparison.length,
        crashGroups: crashGroups.map((group) => {
          const counts = treated.map((site) => studySiteCounts(site, spfOf(site), group));
          const withSpf = counts.filter((entry) => entry.spf !== undefined);
          const comparisonCounts = comparison.map((site) => ({ site: site.id, beforeYears: site.before.years, afterYears: site.after.years, beforeObserved: crashesInGroup(site.before.crashes!, group), afterObserved: crashesInGroup(site.after.crashes!, group) }));
          const afterObserved = sum(counts.map((entry) => entry.afterObserved));
          const warnings = [
            ...(afterObserved < FEW_AFTER_CRASHES ? [`only ${afterObserved} crash(es) after: too few for a stable estimate`] : []),
            // Two calendar years without a 29 February are 730 days, 1.9986 years: a day's slack keeps them whole.
            ...(afterSiteYears / treated.length < FEW_AFTER_YEARS - 1 / 365.25 ? [`the after periods average ${(afterSiteYears / treated.length).toFixed(1)} years, under ${FEW_AFTER_YEARS}`] : []),
            ...(withSpf.length < counts.length ? [`${counts.length - withSpf.length} of ${counts.length} site(s) cannot use Empirical Bayes for ${group.label}`] : []),
          ];
          return {
            crashGroup: group,
            beforeObserved: sum(counts.map((entry) => entry.beforeObserved)),
            afterObserved,
            empiricalBayes: withSpf.length > 0 ? empiricalBayesBeforeAfter(withSpf) : null,
            comparisonGroup: comparisonCounts.length > 0 ? comparisonGroupBeforeAfter(counts, comparisonCounts) : null,
            naive: naiveBeforeAfter(counts),
            warnings,
          };
        }),
      };
    }),
  };
}

function sum(values: readonly number[]): number {
  return values.reduce((total, value) => total + value, 0);
}
