import { effectEvidenceLines } from "../model/effectEvidenceLines.js";
import type { PlanResult } from "./planProgramme.js";
import { singleFatalCrashShare, type SingleFatalCrashShare } from "./singleFatalCrashShare.js";

/** What a reviewer should know about how a list's figures were reached, in data and in plain words. */
export interface PlanMethodNotes {
  /** Sites by the baseline method actually used, over all sites. */
  readonly baselineCounts: { readonly empiricalBayes: number; readonly observed: number };
  /** Funded sites whose baseline is their own observed counts (regression to the mean not corrected). */
  readonly observedBaselineProjects: readonly string[];
  readonly singleFatal: SingleFatalCrashShare;
  /** Funded sites whose treatments act together on the same crash type × severity cells. */
  readonly sharedCellProjects: readonly string[];
  /** The same, as sentences for tables and reports. */
  readonly notes: readonly string[];
}

/** Collects the method notes for a solved list (see PlanMethodNotes). */
export function planMethodNotes(result: PlanResult): PlanMethodNotes {
  const { prepared } = result;
  const methodBySite = new Map(prepared.baselines.map((baseline) => [baseline.site, baseline.method]));
  const empiricalBayes = prepared.baselines.filter((baseline) => baseline.method === "empirical-bayes").length;
  const baselineCounts = { empiricalBayes, observed: prepared.baselines.length - empiricalBayes };
  const observedBaselineProjects = result.funded.filter(({ entry }) => methodBySite.get(entry.site.id) === "observed").map(({ entry }) => entry.site.id);
  const sharedCellProjects = result.funded.filter(({ alternative }) => alternative.sharedCells > 0).map(({ entry }) => entry.site.id);
  const singleFatal = singleFatalCrashShare(result);
  const percent = (share: number) => `${(100 * share).toFixed(1)}%`;

  const notes = [`Baselines: Empirical Bayes at ${empiricalBayes} site(s), observed counts at ${baselineCounts.observed}.`];
  if (observedBaselineProjects.length > 0) {
    notes.push(
      `${observedBaselineProjects.length} funded project(s) rest on observed counts (${observedBaselineProjects.join(", ")}): sites picked for high recent counts usually have fewer crashes next, so their K+A crashes avoided are probably overstated (regression to the mean).`,
    );
  }
  notes.push(
    `${percent(singleFatal.share)} of the benefit PV comes from single fatal crashes (${singleFatal.sites.length} funded site(s) with exactly one recorded fatal crash)` +
      (singleFatal.high ? `: above ${percent(singleFatal.threshold)}, so chance deaths are steering the list; consider a combined K+A unit cost (economics.ksiCosting).` : "."),
  );
  if (sharedCellProjects.length > 0) {
    notes.push(
      `${sharedCellProjects.length} funded project(s) combine treatments that act on the same crash cells (${sharedCellProjects.join(", ")}); their combined CMF follows the scenario's combination rule, an assumption rather than a measured effect.`,
    );
  }
  // One line per effect of a funded treatment whose CMF rests on local evidence, with both inputs.
  for (const treatment of prepared.scenario.catalogue.treatments) {
    const sites = result.funded.filter(({ alternative }) => alternative.treatments.includes(treatment.id)).map(({ entry }) => entry.site.id);
    if (sites.length > 0) for (const line of effectEvidenceLines([treatment])) notes.push(`Local evidence (funded at ${sites.join(", ")}): ${line}.`);
  }
  return { baselineCounts, observedBaselineProjects, singleFatal, sharedCellProjects, notes };
}
