import type { CmfEvidence } from "../model/beforeAfterTypes.js";
import type { CrashGroup } from "../model/crashGroup.js";
import type { Catalogue, Effect } from "../model/types.js";
import { preferredEstimate } from "./preferredEstimate.js";
import type { Evaluation, ProjectGroupEvaluation } from "./evaluateBuiltProjects.js";

/** One local CMF ready for a catalogue's `localEvidence:`, or why an estimate was left out. */
export type LocalEvidenceEntry =
  | { readonly kind: "entry"; readonly treatment: string; readonly crashGroup: CrashGroup; readonly evidence: CmfEvidence; readonly method: string; readonly source: string }
  | { readonly kind: "skipped"; readonly group: string; readonly crashGroup: string; readonly why: string };

const key = (types: readonly string[], severities: readonly string[]) => `${[...types].sort().join(",")}|${[...severities].sort().join(",")}`;

function touches(effect: Effect, group: CrashGroup): boolean {
  return effect.crashTypes.some((type) => group.crashTypes.includes(type)) && effect.severities.some((severity) => group.severities.includes(severity));
}

/**
 * Which estimates can go into the catalogue as local evidence: only groups whose projects all
 * have the same single treatment, only Empirical Bayes or comparison-group estimates (never the
 * naive one), and only crash groups that cover exactly the cells of one of the treatment's
 * effects (so they pool with it) or cells none of its effects touches (a new effect). A crash
 * group overlapping an effect in part would make two CMFs claim one crash, so it is left out,
 * with the reason.
 */
export function localEvidenceEntries(evaluation: Evaluation, catalogue: Catalogue): LocalEvidenceEntry[] {
  const treatments = new Map(catalogue.treatments.map((treatment) => [treatment.id, treatment]));
  return evaluation.groups.flatMap((group) => {
    const skip = (crashGroup: string, why: string): LocalEvidenceEntry => ({ kind: "skipped", group: group.name, crashGroup, why });
    if (!group.sameTreatments || group.treatments.length !== 1) return [skip("all", "the group's projects do not share one single treatment, so its effect belongs to no one treatment")];
    const treatment = treatments.get(group.treatments[0]!)!;
    return group.crashGroups.map((entry): LocalEvidenceEntry => {
      const estimate = preferredEstimate(entry);
      if (estimate === null) return skip(entry.crashGroup.id, "no Empirical Bayes or comparison-group estimate");
      if (!(estimate.standardError > 0)) return skip(entry.crashGroup.id, "the estimate has no standard error");
      const cells = key(entry.crashGroup.crashTypes, entry.crashGroup.severities);
      const matches = treatment.effects.some((effect) => key(effect.crashTypes, effect.severities) === cells);
      if (!matches && treatment.effects.some((effect) => touches(effect, entry.crashGroup))) return skip(entry.crashGroup.id, `its cells overlap, but do not equal, an effect of ${treatment.id} in the catalogue`);
      return { kind: "entry", treatment: treatment.id, crashGroup: entry.crashGroup, evidence: { cmf: estimate.theta, standardError: estimate.standardError }, method: estimate.method, source: sourceText(evaluation.title, group, estimate.method, estimate.sites) };
    });
  });
}

function sourceText(title: string, group: ProjectGroupEvaluation, method: string, sites: number): string {
  const name = method === "empirical-bayes" ? "Empirical Bayes before-after" : "comparison-group before-after";
  return `averta evaluate: ${name}, ${sites} site(s), ${group.beforeSiteYears.toFixed(1)} site-years before and ${group.afterSiteYears.toFixed(1)} after, ${title}`;
}
