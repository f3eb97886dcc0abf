import { alternativeInBuildYear } from "../../src/model/alternativeInBuildYear.js";
import { observedCrashesPerYear } from "../../src/model/observedCrashesPerYear.js";
import { treatmentCmf } from "../../src/model/treatmentCmf.js";
import type { Scenario, Site } from "../../src/model/types.js";

/**
 * An independent reading of a multi-year programme, for tests. It shares no code with
 * buildAlternatives, buildYears, enumerateTreatmentSets, buildProgramme, programmeYearRows or the
 * solver: only the figures of one alternative in one build year (alternativeInBuildYear, checked
 * by hand in test/model/alternativeInBuildYear.test.ts). Observed baselines only.
 */

/** One site's option: a treatment set built in one year, with the figures the rules read. */
export interface ProgrammeChoice {
  readonly site: Site;
  readonly treatments: readonly string[];
  readonly buildYear: number;
  /** Capital spent in each programme year, first year first. */
  readonly spendByYear: readonly number[];
  readonly ksiAvoided: number;
  readonly benefitPV: number;
}

/** `years`: the year budgets by the carry-over rule; `total`: only the sum of the budgets (to see when the years bind). */
export type BudgetReading = "years" | "total";

const TOLERANCE = 1e-9;
const atMost = (left: number, right: number) => left <= right + TOLERANCE * Math.max(1, Math.abs(left), Math.abs(right));
const inScope = (rule: { district?: string; tag?: string }, site: Site) =>
  rule.district !== undefined ? site.district === rule.district : rule.tag !== undefined ? site.tags.includes(rule.tag) : true;
const sum = (values: readonly number[]) => values.reduce((a, b) => a + b, 0);

/** Identifies an option by its treatments (in any order) and build year. */
export const choiceKey = (treatments: readonly string[], buildYear: number) => `${[...treatments].sort().join("+")}@${buildYear}`;

/** A site must be funded: it is committed, or a must-fund rule names it. */
export function isRequired(scenario: Scenario, site: Site): boolean {
  return scenario.programme!.committed.some((p) => p.site === site.id) || scenario.rules.some((r) => r.kind === "must-fund" && r.site === site.id);
}

/**
 * Every option of every site, from the definitions: a committed site has its project only; any
 * other site every non-empty subset of its candidates (bit masks) with at most the per-site
 * number, no two sharing an exclusive group, holding every treatment its must-fund rule names and
 * none a never-fund rule names (none at all if one names no treatment), in every programme year
 * inside the site's earliest/latest years where the alternative exists (phasing, horizon).
 */
export function programmeOptions(scenario: Scenario): ProgrammeChoice[][] {
  const programme = scenario.programme!;
  const windowYears = scenario.crashWindow.lastYear - scenario.crashWindow.firstYear + 1;
  const growth = 1 + (scenario.economics.trafficGrowthRate ?? 0);
  const byId = new Map(scenario.catalogue.treatments.map((t) => [t.id, t]));
  return scenario.sites.map((site) => {
    const expected = observedCrashesPerYear(site.crashes, windowYears);
    const option = (ids: readonly string[], year: number, committed: boolean): ProgrammeChoice[] => {
      const figures = alternativeInBuildYear(site, ids.map((id) => byId.get(id)!), expected, scenario.economics, programme, year, treatmentCmf, growth, committed);
      if (figures === undefined) return [];
      return [{ site, treatments: ids, buildYear: year, spendByYear: figures.spendByYear!, ksiAvoided: figures.ksiAvoided, benefitPV: figures.benefitPV }];
    };
    const project = programme.committed.find((p) => p.site === site.id);
    if (project !== undefined) return option(project.treatments, project.year, true);
    const rules = scenario.rules.filter((r) => (r.kind === "must-fund" || r.kind === "never-fund") && r.site === site.id);
    const required = rules.flatMap((r) => (r.kind === "must-fund" ? r.treatments : []));
    const forbidden = rules.flatMap((r) => (r.kind === "never-fund" ? r.treatments : []));
    if (rules.some((r) => r.kind === "never-fund" && r.treatments.length === 0)) return [];
    const sets: string[][] = [];
    for (let mask = 1; mask < 1 << site.candidates.length; mask += 1) {
      const ids = site.candidates.filter((_, bit) => (mask >> bit) & 1);
      const groups = ids.map((id) => byId.get(id)!.exclusiveGroup).filter((g) => g !== undefined);
      if (ids.length > scenario.maxTreatmentsPerSite || new Set(groups).size < groups.length) continue;
      if (!required.every((id) => ids.includes(id)) || ids.some((id) => forbidden.includes(id))) continue;
      sets.push(ids);
    }
    const options: ProgrammeChoice[] = [];
    for (let y = 0; y < programme.years; y += 1) {
      const year = programme.firstYear + y;
      if (year < (site.earliestYear ?? -Infinity) || year > (site.latestYear ?? Infinity)) continue;
      for (const ids of sets) options.push(...option(ids, year, false));
    }
    return options;
  });
}

/** What the objective counts for one option. */
export const choiceValue = (scenario: Scenario, choice: ProgrammeChoice) => (scenario.objective === "ksi" ? choice.ksiAvoided : choice.benefitPV);

/**
 * Every broken condition of a programme (one pick or null per site, in site order), each read
 * from its definition: required sites funded, must-fund and never-fund treatments, committed
 * projects kept, build years in the site's window; carry-over `none`: spend in each year within
 * its budget; `unspent`: spend up to each year within the budgets up to it; every policy rule
 * (a rule with `year` reads that year's spend, one without reads the capital over the programme).
 */
export function programmeViolations(scenario: Scenario, picks: readonly (ProgrammeChoice | null)[], reading: BudgetReading = "years"): string[] {
  const programme = scenario.programme!;
  const problems: string[] = [];
  const chosen = picks.filter((p): p is ProgrammeChoice => p !== null);
  if (picks.length !== scenario.sites.length) problems.push(`${picks.length} picks for ${scenario.sites.length} sites`);
  picks.forEach((pick, index) => {
    const site = scenario.sites[index]!;
    if (pick === null) {
      if (isRequired(scenario, site)) problems.push(`${site.id} must be funded`);
      return;
    }
    if (pick.site !== site) problems.push(`pick ${index} is for ${pick.site.id}, not ${site.id}`);
    const project = programme.committed.find((p) => p.site === site.id);
    if (project !== undefined && choiceKey(project.treatments, project.year) !== choiceKey(pick.treatments, pick.buildYear)) problems.push(`${site.id}: committed project moved`);
    const first = Math.max(programme.firstYear, site.earliestYear ?? -Infinity);
    const last = Math.min(programme.firstYear + programme.years - 1, site.latestYear ?? Infinity);
    if (project === undefined && (pick.buildYear < first || pick.buildYear > last)) problems.push(`${site.id}: built outside ${first}–${last}`);
  });
  const spend = Array.from({ length: programme.years }, (_, y) => sum(chosen.map((p) => p.spendByYear[y]!)));
  const capital = (list: readonly ProgrammeChoice[]) => sum(list.map((p) => sum(p.spendByYear)));
  const total = capital(chosen);
  if (reading === "total") {
    if (!atMost(total, sum(programme.budgets))) problems.push(`capital ${total} over the total budget`);
  } else {
    let spentSoFar = 0;
    let budgetSoFar = 0;
    programme.budgets.forEach((budget, y) => {
      spentSoFar += spend[y]!;
      budgetSoFar += budget;
      const [left, right] = programme.carryOver === "none" ? [spend[y]!, budget] : [spentSoFar, budgetSoFar];
      if (!atMost(left, right)) problems.push(`year ${programme.firstYear + y}: ${left} over ${right} (${programme.carryOver})`);
    });
  }
  const scoped = (rule: { district?: string; tag?: string }) => chosen.filter((p) => inScope(rule, p.site));
  for (const rule of scenario.rules) {
    switch (rule.kind) {
      case "must-fund": {
        const pick = chosen.find((p) => p.site.id === rule.site);
        if (pick === undefined || !rule.treatments.every((id) => pick.treatments.includes(id))) problems.push(`must-fund ${rule.site}`);
        break;
      }
      case "never-fund": {
        const pick = chosen.find((p) => p.site.id === rule.site);
        if (pick !== undefined && (rule.treatments.length === 0 || rule.treatments.some((id) => pick.treatments.includes(id)))) problems.push(`never-fund ${rule.site}`);
        break;
      }
      case "spend-cap":
      case "spend-floor": {
        const list = scoped(rule);
        const amount = rule.year !== undefined ? sum(list.map((p) => p.spendByYear[rule.year! - programme.firstYear]!)) : capital(list);
        const limit = rule.share !== undefined ? rule.share * total : rule.amount!;
        if (!(rule.kind === "spend-cap" ? atMost(amount, limit) : atMost(limit, amount))) problems.push(`${rule.kind} ${JSON.stringify(rule)}: ${amount}`);
        break;
      }
      case "ksi-share-floor":
        if (!atMost(rule.share * sum(chosen.map((p) => p.ksiAvoided)), sum(scoped(rule).map((p) => p.ksiAvoided)))) problems.push("ksi-share-floor");
        break;
      case "max-projects":
        if (scoped(rule).length > rule.count) problems.push(`max-projects ${rule.count}`);
        break;
    }
  }
  return problems;
}

export interface ProgrammeBruteForce {
  /** Best objective over every feasible programme, or null when none is feasible. */
  readonly best: number | null;
  readonly bestPicks: readonly (ProgrammeChoice | null)[] | null;
  /** The same with only the total budget instead of the year budgets (above `best`: the years bind). */
  readonly bestUnderTotalBudget: number | null;
  /** Programmes enumerated. */
  readonly assignments: number;
}

/** Enumerates every assignment of (treatment set, build year) or nothing to every site. */
export function bruteForceProgramme(scenario: Scenario, options = programmeOptions(scenario)): ProgrammeBruteForce {
  const choices = scenario.sites.map((site, index) => [...(isRequired(scenario, site) ? [] : [null]), ...options[index]!]);
  const picks: (ProgrammeChoice | null)[] = [];
  let best: number | null = null;
  let bestPicks: (ProgrammeChoice | null)[] | null = null;
  let bestUnderTotalBudget: number | null = null;
  let assignments = 0;
  const walk = (index: number) => {
    if (index === choices.length) {
      assignments += 1;
      if (programmeViolations(scenario, picks, "total").length > 0) return;
      const value = sum(picks.map((p) => (p === null ? 0 : choiceValue(scenario, p))));
      if (bestUnderTotalBudget === null || value > bestUnderTotalBudget) bestUnderTotalBudget = value;
      if (programmeViolations(scenario, picks, "years").length > 0) return;
      if (best === null || value > best) {
        best = value;
        bestPicks = [...picks];
      }
      return;
    }
    for (const choice of choices[index]!) {
      picks.push(choice);
      walk(index + 1);
      picks.pop();
    }
  };
  walk(0);
  return { best, bestPicks, bestUnderTotalBudget, assignments };
}
