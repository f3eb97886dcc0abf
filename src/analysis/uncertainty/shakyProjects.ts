import type { PlanResult } from "../planProgramme.js";
import type { DrawOutcome } from "./evaluateDraw.js";

/** A funded project selected in fewer than this share of the draws' best lists is shaky. */
export const SHAKY_PROBABILITY = 0.5;
/** At most this many replacements are named for one shaky project. */
export const MAX_REPLACEMENTS = 3;

/** How the replacements of a shaky project are chosen; stated in every uncertainty output. */
export const REPLACEMENT_RULE = `a funded project is shaky when fewer than ${SHAKY_PROBABILITY * 100}% of the draws' best lists select it; what would replace it is the site-alternatives outside the list whose selection share rises most when the draws leave it out (share of the draws without it minus share of the draws with it; when no draw selects it, the share of the draws without it), rises above zero only, largest first, taken until their capital cost covers the shaky project's (at most ${MAX_REPLACEMENTS})`;

/** A site-alternative outside the list that the draws pick more often when they drop a shaky project. */
export interface Replacement {
  readonly site: string;
  readonly alternativeIndex: number;
  readonly treatments: readonly string[];
  readonly cost: number;
  /** Share of the draws that leave the shaky project out whose best list selects this alternative. */
  readonly shareOfDrawsWithout: number;
  /** Share of the draws that select the shaky project whose best list also selects it (null when none does). */
  readonly shareOfDrawsWith: number | null;
}

/** A funded project that fewer than half of the draws' best lists select, and what they pick instead. */
export interface ShakyProject {
  readonly site: string;
  readonly alternativeIndex: number;
  readonly treatments: readonly string[];
  readonly cost: number;
  /** Share of solved draws whose best list selects it. */
  readonly probability: number;
  /** Solved draws whose best list leaves it out. */
  readonly drawsWithout: number;
  readonly replacements: readonly Replacement[];
}

const solved = (outcome: DrawOutcome) => outcome.status === "optimal" || outcome.status === "time-limit";

/**
 * The plan's shaky projects (see REPLACEMENT_RULE), largest capital cost first (then by site id),
 * from the draw outcomes in draw order. Empty when no draw was solved.
 */
export function shakyProjects(plan: PlanResult, outcomes: readonly DrawOutcome[]): ShakyProject[] {
  const draws = outcomes.filter(solved);
  if (draws.length === 0) return [];
  const sites = plan.prepared.sites;
  const planChoice = plan.solution.choice;
  const tally = departureTally(plan, draws);
  const shaky: ShakyProject[] = [];
  planChoice.forEach((index, group) => {
    if (index === null) return;
    const kept = draws.flatMap((outcome, d) => (outcome.choice[group] === index ? [d] : []));
    const probability = kept.length / draws.length;
    if (probability >= SHAKY_PROBABILITY) return;
    const alternative = sites[group]!.alternatives[index]!;
    shaky.push({
      site: sites[group]!.site.id,
      alternativeIndex: index,
      treatments: alternative.treatments,
      cost: alternative.cost,
      probability,
      drawsWithout: draws.length - kept.length,
      replacements: replacementsFor(plan, tally, kept, draws.length, alternative.cost),
    });
  });
  return shaky.sort((a, b) => b.cost - a.cost || (a.site < b.site ? -1 : a.site > b.site ? 1 : 0));
}

/**
 * Where the draws' best lists depart from the plan: per draw, the flat indices (site offset +
 * alternative) of the alternatives it selects that the plan does not, and how many draws select
 * each. Best lists differ from the plan at a few sites, so this is small beside draws × sites.
 */
interface DepartureTally {
  readonly offsets: readonly number[];
  readonly departures: readonly Int32Array[];
  readonly totals: Int32Array;
  /** The site and alternative of every flat index some draw departs to, in site then alternative order. */
  readonly departedTo: readonly { readonly g: number; readonly i: number; readonly at: number }[];
}

function departureTally(plan: PlanResult, draws: readonly DrawOutcome[]): DepartureTally {
  const planChoice = plan.solution.choice;
  const offsets = [0];
  for (const entry of plan.prepared.sites) offsets.push(offsets[offsets.length - 1]! + entry.alternatives.length);
  const totals = new Int32Array(offsets[offsets.length - 1]!);
  const departures = draws.map((outcome) => {
    const flat: number[] = [];
    outcome.choice.forEach((chosen, g) => {
      if (chosen !== null && chosen !== planChoice[g]) flat.push(offsets[g]! + chosen);
    });
    for (const at of flat) totals[at]! += 1;
    return Int32Array.from(flat);
  });
  const departedTo = plan.prepared.sites.flatMap((entry, g) => entry.alternatives.flatMap((_, i) => (totals[offsets[g]! + i]! > 0 ? [{ g, i, at: offsets[g]! + i }] : [])));
  return { offsets, departures, totals, departedTo };
}

// `kept`: the draws (indices into the solved draws) whose best list keeps the shaky project.
function replacementsFor(plan: PlanResult, tally: DepartureTally, kept: readonly number[], drawCount: number, cost: number): Replacement[] {
  const sites = plan.prepared.sites;
  const withIt = new Int32Array(tally.totals.length);
  for (const d of kept) for (const at of tally.departures[d]!) withIt[at]! += 1;
  const drawsWith = kept.length;
  const drawsWithout = drawCount - drawsWith;
  const ranked: { readonly replacement: Replacement; readonly rise: number }[] = [];
  // An alternative no draw departs to has no rise: only those some draw does are ranked.
  for (const { g, i, at } of tally.departedTo) {
    const shareOfDrawsWithout = (tally.totals[at]! - withIt[at]!) / drawsWithout;
    const shareOfDrawsWith = drawsWith > 0 ? withIt[at]! / drawsWith : null;
    const rise = shareOfDrawsWithout - (shareOfDrawsWith ?? 0);
    if (!(rise > 0)) continue;
    const alternative = sites[g]!.alternatives[i]!;
    ranked.push({ replacement: { site: sites[g]!.site.id, alternativeIndex: i, treatments: alternative.treatments, cost: alternative.cost, shareOfDrawsWithout, shareOfDrawsWith }, rise });
  }
  // Ties: the cheaper alternative first, then site order, so the list is the same on every machine.
  const order = (a: Replacement, b: Replacement) => a.cost - b.cost || (a.site < b.site ? -1 : a.site > b.site ? 1 : 0) || a.alternativeIndex - b.alternativeIndex;
  ranked.sort((a, b) => b.rise - a.rise || order(a.replacement, b.replacement));
  const chosen: Replacement[] = [];
  let covered = 0;
  for (const { replacement } of ranked) {
    if (chosen.length === MAX_REPLACEMENTS || (chosen.length > 0 && covered >= cost)) break;
    chosen.push(replacement);
    covered += replacement.cost;
  }
  return chosen;
}
