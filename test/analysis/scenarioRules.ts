import { evaluateAlternative } from "../../src/model/evaluateAlternative.js";
import { buildCrashMatrix } from "../../src/model/crashMatrix.js";
import type { Scenario, Site, Treatment } from "../../src/model/types.js";

/**
 * An independent reading of a scenario's rules, for tests: it shares no code with
 * buildAlternatives, enumerateTreatmentSets or buildProgramme, only the economics of one alternative.
 */

/** One site's chosen treatments (ids), as a plan lists them. */
export interface Pick {
  readonly site: string;
  readonly treatments: readonly string[];
}

const RELATIVE_TOLERANCE = 1e-9;
const atMost = (left: number, right: number) => left <= right + RELATIVE_TOLERANCE * Math.max(1, Math.abs(left), Math.abs(right));

function inScope(rule: { district?: string; tag?: string }, site: Site): boolean {
  if (rule.district !== undefined) return site.district === rule.district;
  if (rule.tag !== undefined) return site.tags.includes(rule.tag);
  return true;
}

/** Capital cost of a set of treatments at a site (per-site costs only, as the generator makes them). */
export function pickCost(scenario: Scenario, pick: Pick): number {
  return pick.treatments.reduce((total, id) => total + scenario.catalogue.treatments.find((t) => t.id === id)!.cost.amount, 0);
}

/** KSI avoided by a pick, from the site's observed crashes per year over the window. */
export function pickKsi(scenario: Scenario, pick: Pick): number {
  const cache = ksiCache.get(scenario) ?? new Map<string, number>();
  ksiCache.set(scenario, cache);
  const key = `${pick.site}|${pick.treatments.join(",")}`;
  const known = cache.get(key);
  if (known !== undefined) return known;
  const site = scenario.sites.find((s) => s.id === pick.site)!;
  const years = scenario.crashWindow.lastYear - scenario.crashWindow.firstYear + 1;
  const expected = buildCrashMatrix((type, severity) => site.crashes[type][severity] / years);
  const treatments = pick.treatments.map((id) => scenario.catalogue.treatments.find((t) => t.id === id)!);
  const ksi = evaluateAlternative(site, treatments, expected, scenario.economics).ksiAvoided;
  cache.set(key, ksi);
  return ksi;
}
// Brute force evaluates the same picks many times; the cache keeps each property run short.
const ksiCache = new WeakMap<Scenario, Map<string, number>>();

/** Every problem with a list of picks under the scenario's budget, site limits and rules (empty when feasible). */
export function ruleViolations(scenario: Scenario, picks: readonly Pick[], budget = scenario.budget): string[] {
  const problems: string[] = [];
  const bySite = new Map<string, Pick>();
  for (const pick of picks) {
    if (bySite.has(pick.site)) problems.push(`site ${pick.site} chosen twice`);
    bySite.set(pick.site, pick);
    const site = scenario.sites.find((s) => s.id === pick.site)!;
    if (pick.treatments.length === 0 || pick.treatments.length > scenario.maxTreatmentsPerSite) problems.push(`${pick.site}: ${pick.treatments.length} treatments`);
    if (pick.treatments.some((id) => !site.candidates.includes(id))) problems.push(`${pick.site}: not a candidate`);
    const groups = pick.treatments.map((id) => scenario.catalogue.treatments.find((t) => t.id === id)!.exclusiveGroup).filter((g) => g !== undefined);
    if (new Set(groups).size < groups.length) problems.push(`${pick.site}: exclusive group shared`);
  }
  const cost = picks.reduce((total, pick) => total + pickCost(scenario, pick), 0);
  if (!atMost(cost, budget)) problems.push(`cost ${cost} over budget ${budget}`);
  const ksi = new Map(picks.map((pick) => [pick.site, pickKsi(scenario, pick)]));
  const totalKsi = [...ksi.values()].reduce((a, b) => a + b, 0);
  const scoped = (rule: { district?: string; tag?: string }) => picks.filter((pick) => inScope(rule, scenario.sites.find((s) => s.id === pick.site)!));
  for (const rule of scenario.rules) {
    switch (rule.kind) {
      case "must-fund": {
        const pick = bySite.get(rule.site);
        if (!pick || !rule.treatments.every((id) => pick.treatments.includes(id))) problems.push(`must-fund ${rule.site} not met`);
        break;
      }
      case "never-fund": {
        const pick = bySite.get(rule.site);
        if (pick && (rule.treatments.length === 0 || rule.treatments.some((id) => pick.treatments.includes(id)))) problems.push(`never-fund ${rule.site} broken`);
        break;
      }
      case "spend-cap":
      case "spend-floor": {
        const spend = scoped(rule).reduce((total, pick) => total + pickCost(scenario, pick), 0);
        const limit = rule.share !== undefined ? rule.share * cost : rule.amount!;
        const ok = rule.kind === "spend-cap" ? atMost(spend, limit) : atMost(limit, spend);
        if (!ok) problems.push(`${rule.kind} broken: ${spend} vs ${limit}`);
        break;
      }
      case "ksi-share-floor": {
        const scopedKsi = scoped(rule).reduce((total, pick) => total + ksi.get(pick.site)!, 0);
        if (!atMost(rule.share * totalKsi, scopedKsi)) problems.push(`ksi-share-floor broken`);
        break;
      }
      case "max-projects":
        if (scoped(rule).length > rule.count) problems.push(`max-projects broken`);
        break;
    }
  }
  return problems;
}

/** Every allowed treatment set at a site: candidate subsets within the per-site limit, one per exclusive group. */
export function treatmentSets(scenario: Scenario, site: Site): string[][] {
  const candidates: Treatment[] = site.candidates.map((id) => scenario.catalogue.treatments.find((t) => t.id === id)!);
  const sets: string[][] = [];
  for (let mask = 1; mask < 1 << candidates.length; mask++) {
    const chosen = candidates.filter((_, bit) => (mask >> bit) & 1);
    if (chosen.length > scenario.maxTreatmentsPerSite) continue;
    const groups = chosen.map((t) => t.exclusiveGroup).filter((g) => g !== undefined);
    if (new Set(groups).size < groups.length) continue;
    sets.push(chosen.map((t) => t.id));
  }
  return sets;
}

/** The best total KSI avoided over every combination of picks (none or one set per site), or null if none is feasible. */
export function bruteForceKsi(scenario: Scenario, budget = scenario.budget): number | null {
  const options = scenario.sites.map((site) => [null, ...treatmentSets(scenario, site)]);
  let best: number | null = null;
  const picks: Pick[] = [];
  const walk = (index: number) => {
    if (index === options.length) {
      if (ruleViolations(scenario, picks, budget).length === 0) {
        const total = picks.reduce((sum, pick) => sum + pickKsi(scenario, pick), 0);
        if (best === null || total > best) best = total;
      }
      return;
    }
    for (const set of options[index]!) {
      if (set !== null) picks.push({ site: scenario.sites[index]!.id, treatments: set });
      walk(index + 1);
      if (set !== null) picks.pop();
    }
  };
  walk(0);
  return best;
}
