import { objectiveValue } from "./buildProgramme.js";
import { alternativeStreams, type AlternativeStreams } from "./alternativeStreams.js";
import type { PlanResult } from "./planProgramme.js";
import type { Alternative, Site } from "../model/types.js";

/** One alternative of one site as the workbook lists it: numbered, with its streams and standing. */
export interface WorkbookAlternative {
  /** 1-based number, in site order then the site's own order of alternatives. */
  readonly number: number;
  readonly site: Site;
  readonly alternative: Alternative;
  readonly streams: AlternativeStreams;
  readonly funded: boolean;
  /** Another alternative at the same site costs no more capital and is worth no less by the objective, and is better in one. */
  readonly dominated: boolean;
}

/** Every alternative of every site of a solved plan, with the terms its figures are rebuilt from. */
export function workbookAlternatives(plan: PlanResult): WorkbookAlternative[] {
  const { scenario, baselines, objective } = plan.prepared;
  const baselineBySite = new Map(baselines.map((baseline) => [baseline.site, baseline]));
  const chosen = new Map(plan.funded.map((project) => [project.entry.site.id, project.index]));
  const rows: WorkbookAlternative[] = [];
  for (const entry of plan.prepared.sites) {
    const dominated = dominatedFlags(entry.alternatives.map((alternative) => ({ cost: alternative.cost, value: objectiveValue(alternative, objective) })));
    entry.alternatives.forEach((alternative, index) => {
      rows.push({
        number: rows.length + 1,
        site: entry.site,
        alternative,
        streams: alternativeStreams(scenario, entry.site, baselineBySite.get(entry.site.id)!, alternative),
        funded: chosen.get(entry.site.id) === index,
        dominated: dominated[index]!,
      });
    });
  }
  return rows;
}

/**
 * Which options another one dominates: costs no more and is worth no less, strictly better in
 * one. Sorted by cost (worth descending on a tie), an option is dominated when an earlier one is
 * worth at least as much and differs from it; one pass after the sort.
 */
export function dominatedFlags(options: readonly { readonly cost: number; readonly value: number }[]): boolean[] {
  const order = options.map((_, index) => index).sort((a, b) => options[a]!.cost - options[b]!.cost || options[b]!.value - options[a]!.value);
  const flags = new Array<boolean>(options.length).fill(false);
  let best: { cost: number; value: number } | undefined;
  for (const index of order) {
    const option = options[index]!;
    if (best !== undefined && best.value >= option.value && (best.value > option.value || best.cost < option.cost)) flags[index] = true;
    if (best === undefined || option.value > best.value) best = option;
  }
  return flags;
}
