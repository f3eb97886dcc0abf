import highsModule from "highs";
import { alternativeInBuildYear } from "../src/model/alternativeInBuildYear.js";
import { siteBaselines } from "../src/model/siteBaselines.js";
import { treatmentCapitalCost } from "../src/model/treatmentCapitalCost.js";
import { treatmentCmf } from "../src/model/treatmentCmf.js";
import type { Scenario, Site, Treatment } from "../src/model/types.js";
import type { PolicyRule } from "../src/model/policyRule.js";
import { programmeViolations, type ProgrammeReferenceOption } from "./programmeViolations.js";

// The package is CommonJS typed as an ES default export: at run time the default import is the loader.
const highsLoader = ((highsModule as unknown as { default?: unknown }).default ?? highsModule) as unknown as typeof highsModule.default;

/**
 * An independent optimiser for multi-year programmes, for cross-checks only. It shares no code
 * with averta's alternatives, year rows, rules or solver (src/model/buildAlternatives.ts,
 * buildYears.ts, alternativesOverBuildYears.ts, src/analysis/buildProgramme.ts,
 * programmeYearRows.ts, src/solver/): it enumerates every treatment set by bit mask and every
 * build year from the definitions (the programme's years within the site's window; none whose
 * phasing would spend before the first year; none without a year of benefit, as benefits start the
 * year after the build year), computes each option's spend by year itself (capital × (1 + e)^d ×
 * share, in year d − yearsBeforeBuild, nothing charged before the first year), and takes only K+A
 * and benefit PV of one option from alternativeInBuildYear (as referenceOptimum takes them from
 * evaluateAlternative). The model is LP text: a binary per option, at most one per site (exactly
 * one at must-fund and committed sites), a row per year (carry-over none: the year's spend within
 * its budget; unspent: the spend up to each year within the budgets up to it) and the rules from
 * their definitions; HiGHS's one-shot `solve` (not the model API averta uses) solves it at
 * mip_rel_gap 0 and mip_abs_gap 0, feasibility tolerances 1e-9. Its answer is checked by its own
 * test (programmeViolations); one that fails is cut off by a no-good row and the model solved again.
 */

/** The reference's answer. `time-limit`: a checked list without proof; `objective` is that list's. */
export interface ProgrammeReferenceResult {
  readonly status: "optimal" | "infeasible" | "time-limit" | "unsolved";
  readonly objective: number;
  /** The option chosen at each site (null: none), in scenario order. */
  readonly picks: readonly (ProgrammeReferenceOption | null)[];
  /** Every allowed option, by site. */
  readonly options: readonly (readonly ProgrammeReferenceOption[])[];
  /** How many HiGHS answers failed the feasibility test and were cut off. */
  readonly cutOff: number;
  /** Options whose spend by year differs from alternativeInBuildYear's, or that it refuses. */
  readonly figureMismatches: readonly string[];
  /** Options the phasing rule left out (so the generator is seen to exercise it). */
  readonly phasingExcluded: number;
  readonly seconds: number;
}

const TOLERANCE = 1e-9;
const MAX_CUTS = 50;
const ALL_IN_BUILD_YEAR = [{ yearsBeforeBuild: 0, share: 1 }] as const;

/** Capital spent in each programme year (first year first) by `treatments` built in year offset d. */
export function referenceSpendByYear(scenario: Scenario, siteIndex: number, treatments: readonly Treatment[], d: number): number[] {
  const programme = scenario.programme!;
  const site = scenario.sites[siteIndex]!;
  const spend = new Array<number>(programme.years).fill(0);
  for (const treatment of treatments) {
    const capital = treatmentCapitalCost(treatment, site) * Math.pow(1 + programme.costEscalationRate, d);
    for (const phase of treatment.phasing ?? ALL_IN_BUILD_YEAR) {
      if (d - phase.yearsBeforeBuild >= 0) spend[d - phase.yearsBeforeBuild]! += capital * phase.share;
    }
  }
  return spend;
}

/** Every option per site: allowed treatment set × allowed build year, or a committed site's one project. */
export function programmeReferenceOptions(scenario: Scenario): { options: ProgrammeReferenceOption[][]; figureMismatches: string[]; phasingExcluded: number } {
  const programme = scenario.programme!;
  const baselines = new Map(siteBaselines(scenario).map((b) => [b.site, b]));
  const catalogue = new Map(scenario.catalogue.treatments.map((t) => [t.id, t]));
  const figureMismatches: string[] = [];
  let phasingExcluded = 0;
  const option = (s: number, ids: readonly string[], year: number, committed: boolean): ProgrammeReferenceOption | undefined => {
    const site = scenario.sites[s]!;
    const baseline = baselines.get(site.id)!;
    const treatments = ids.map((id) => catalogue.get(id)!);
    const d = year - programme.firstYear;
    const figures = alternativeInBuildYear(site, treatments, baseline.expectedPerYear, scenario.economics, programme, year, treatmentCmf, baseline.crashGrowthPerYear ?? 1, committed);
    const spendByYear = referenceSpendByYear(scenario, s, treatments, d);
    const label = `${site.id} ${ids.join("+")} in ${year}`;
    if (figures === undefined) {
      figureMismatches.push(`${label}: alternativeInBuildYear refuses an allowed option`);
      return undefined;
    }
    const same = spendByYear.every((v, y) => Math.abs(v - (figures.spendByYear?.[y] ?? 0)) <= 1e-12 * Math.max(1, Math.abs(v)));
    if (!same) figureMismatches.push(`${label}: spend ${spendByYear.join(",")} against ${figures.spendByYear?.join(",")}`);
    const cost = spendByYear.reduce((t, v) => t + v, 0);
    return { site: site.id, treatments: ids, buildYear: year, spendByYear, cost, ksiAvoided: figures.ksiAvoided, benefitPV: figures.benefitPV, committed };
  };
  const options = scenario.sites.map((site, s) => {
    const project = programme.committed.find((p) => p.site === site.id);
    if (project !== undefined) return [option(s, project.treatments, project.year, true)].filter((o): o is ProgrammeReferenceOption => o !== undefined);
    if (scenario.rules.some((r) => r.kind === "never-fund" && r.site === site.id && r.treatments.length === 0)) return [];
    const forbidden = new Set(scenario.rules.flatMap((r) => (r.kind === "never-fund" && r.site === site.id ? r.treatments : [])));
    const needed = scenario.rules.flatMap((r) => (r.kind === "must-fund" && r.site === site.id ? r.treatments : []));
    const first = Math.max(programme.firstYear, site.earliestYear ?? programme.firstYear);
    const last = Math.min(programme.firstYear + programme.years - 1, site.latestYear ?? programme.firstYear + programme.years - 1);
    const list: ProgrammeReferenceOption[] = [];
    for (let year = first; year <= last; year += 1) {
      const d = year - programme.firstYear;
      if (d >= scenario.economics.horizonYears) continue; // built in the horizon's last year or later: no year of benefit
      for (let mask = 1; mask < 1 << site.candidates.length; mask += 1) {
        const ids = site.candidates.filter((_, bit) => (mask >> bit) & 1);
        if (ids.length > scenario.maxTreatmentsPerSite) continue;
        if (ids.some((id) => forbidden.has(id)) || !needed.every((id) => ids.includes(id))) continue;
        const treatments = ids.map((id) => catalogue.get(id)!);
        const groups = treatments.flatMap((t) => (t.exclusiveGroup === undefined ? [] : [t.exclusiveGroup]));
        if (new Set(groups).size < groups.length) continue;
        if (treatments.some((t) => (t.phasing ?? []).some((phase) => phase.yearsBeforeBuild > d))) {
          phasingExcluded += 1;
          continue;
        }
        const built = option(s, ids, year, false);
        if (built !== undefined) list.push(built);
      }
    }
    return list;
  });
  return { options, figureMismatches, phasingExcluded };
}

/** The reference optimum of a programme scenario at its own budgets and objective. */
export async function programmeReference(scenario: Scenario, timeLimitSeconds = 60, relativeGap = 0): Promise<ProgrammeReferenceResult> {
  const started = performance.now();
  const highs = await highsLoader();
  const programme = scenario.programme!;
  const { options, figureMismatches, phasingExcluded } = programmeReferenceOptions(scenario);
  const committed = new Set(programme.committed.map((p) => p.site));
  const required = scenario.sites.map((site) => committed.has(site.id) || scenario.rules.some((r) => r.kind === "must-fund" && r.site === site.id));
  const value = (o: ProgrammeReferenceOption): number => (scenario.objective === "ksi" ? o.ksiAvoided : o.benefitPV);
  const none = scenario.sites.map(() => null);
  const done = (status: ProgrammeReferenceResult["status"], picks: readonly (ProgrammeReferenceOption | null)[], cutOff: number): ProgrammeReferenceResult => ({
    status,
    objective: picks.reduce((t, o) => t + (o === null ? 0 : value(o)), 0),
    picks,
    options,
    cutOff,
    figureMismatches,
    phasingExcluded,
    seconds: (performance.now() - started) / 1000,
  });
  if (required.some((must, s) => must && options[s]!.length === 0)) return done("infeasible", none, 0);
  const name = (s: number, a: number): string => `x_${s}_${a}`;
  const columns = options.flatMap((list, s) => list.map((_, a) => ({ s, a, name: name(s, a) })));
  if (columns.length === 0) return done(programmeViolations(scenario, none).length === 0 ? "optimal" : "infeasible", none, 0);

  const sum = (coefficient: (o: ProgrammeReferenceOption, s: number) => number): string => {
    const terms: string[] = [];
    for (const { s, a, name: column } of columns) {
      const c = coefficient(options[s]![a]!, s);
      if (c !== 0) terms.push(`${c < 0 ? "-" : "+"} ${Math.abs(c)} ${column}`);
    }
    return terms.length > 0 ? terms.join(" ") : `0 ${columns[0]!.name}`;
  };
  const rows: string[] = [];
  options.forEach((list, s) => {
    if (list.length > 0) rows.push(` site${s}: ${list.map((_, a) => `+ ${name(s, a)}`).join(" ")} ${required[s] ? "=" : "<="} 1`);
  });
  let budgetSoFar = 0;
  programme.budgets.forEach((budget, y) => {
    budgetSoFar += budget;
    if (programme.carryOver === "none") rows.push(` year${y}: ${sum((o) => o.spendByYear[y]!)} <= ${budget}`);
    else rows.push(` upto${y}: ${sum((o) => o.spendByYear.slice(0, y + 1).reduce((t, v) => t + v, 0))} <= ${budgetSoFar}`);
  });
  scenario.rules.forEach((rule, k) => {
    const terms = ruleTerms(rule, programme.firstYear);
    if (terms !== undefined) rows.push(` rule${k}: ${sum((o, s) => terms.coefficient(o, scenario.sites[s]!))} ${terms.sense} ${terms.rhs}`);
  });

  let cutOff = 0;
  for (;;) {
    const text = ["Maximize", ` value: ${sum((o) => value(o))}`, "Subject To", ...rows, "Binary", ...columns.map((c) => ` ${c.name}`), "End"].join("\n");
    const result = highs.solve(text, {
      mip_rel_gap: relativeGap,
      mip_abs_gap: 0,
      primal_feasibility_tolerance: TOLERANCE,
      mip_feasibility_tolerance: TOLERANCE,
      time_limit: timeLimitSeconds,
    });
    if (result.Status === "Infeasible") return done("infeasible", none, cutOff);
    const stopped = result.Status === "Time limit reached";
    if (result.Status !== "Optimal" && !stopped) return done("unsolved", none, cutOff);
    const picks = options.map((list, s) => {
      const chosen = list.findIndex((_, a) => (result.Columns[name(s, a)]?.Primal ?? 0) > 0.5);
      return chosen < 0 ? null : list[chosen]!;
    });
    const feasible = programmeViolations(scenario, picks).length === 0;
    if (stopped) return feasible ? done("time-limit", picks, cutOff) : done("unsolved", none, cutOff);
    if (feasible) return done("optimal", picks, cutOff);
    // A point HiGHS accepts within its own tolerance but that breaks a row: cut off exactly that point.
    cutOff += 1;
    if (cutOff > MAX_CUTS) return done("unsolved", none, cutOff);
    const chosen = new Set(picks.flatMap((o, s) => (o === null ? [] : [name(s, options[s]!.indexOf(o))])));
    rows.push(` cut${cutOff}: ${columns.map((c) => `${chosen.has(c.name) ? "+" : "-"} 1 ${c.name}`).join(" ")} <= ${chosen.size - 1}`);
  }
}

function inScope(rule: { district?: string; tag?: string }, site: Site): boolean {
  if (rule.district !== undefined) return rule.district === site.district;
  if (rule.tag !== undefined) return site.tags.includes(rule.tag);
  return true;
}

// A rule's row from its definition, as "Σ coefficient × x  sense  rhs"; undefined for site rules (applied in the options).
function ruleTerms(rule: PolicyRule, firstYear: number): { coefficient: (o: ProgrammeReferenceOption, site: Site) => number; sense: "<=" | ">="; rhs: number } | undefined {
  switch (rule.kind) {
    case "must-fund":
    case "never-fund":
      return undefined;
    case "spend-cap":
    case "spend-floor": {
      const sense = rule.kind === "spend-cap" ? "<=" : ">=";
      // share: spend in scope (sense) share × the programme's spend, moved to one side.
      if (rule.share !== undefined) return { coefficient: (o, site) => (inScope(rule, site) ? o.cost : 0) - rule.share! * o.cost, sense, rhs: 0 };
      const year = rule.year;
      const spend = (o: ProgrammeReferenceOption): number => (year === undefined ? o.cost : o.spendByYear[year - firstYear]!);
      return { coefficient: (o, site) => (inScope(rule, site) ? spend(o) : 0), sense, rhs: rule.amount! };
    }
    case "ksi-share-floor":
      return { coefficient: (o, site) => (inScope(rule, site) ? o.ksiAvoided : 0) - rule.share * o.ksiAvoided, sense: ">=", rhs: 0 };
    case "max-projects":
      return { coefficient: (_o, site) => (inScope(rule, site) ? 1 : 0), sense: "<=", rhs: rule.count };
  }
}
