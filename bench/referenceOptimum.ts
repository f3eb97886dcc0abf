import highsModule from "highs";
import { evaluateAlternative } from "../src/model/evaluateAlternative.js";
import { siteBaselines } from "../src/model/siteBaselines.js";
import type { Objective, Scenario, Site } from "../src/model/types.js";
import type { PolicyRule } from "../src/model/policyRule.js";

// The package is CommonJS typed as an ES default export: at run time the default import is the loader.
const highsLoader = ((highsModule as unknown as { default?: unknown }).default ?? highsModule) as unknown as typeof highsModule.default;

/**
 * An independent optimiser for cross-checks: it shares no code with averta's alternatives,
 * rules or solver (src/model/buildAlternatives.ts, src/analysis/buildProgramme.ts, src/solver/),
 * only the economics of one alternative (evaluateAlternative) and the baselines. It enumerates
 * every allowed treatment set by bit mask, writes the scenario's rules straight from their
 * definitions as an LP-format text model, and has HiGHS's one-shot `solve` (not the model API
 * averta uses) solve it with mip_rel_gap REFERENCE_RELATIVE_GAP and feasibility tolerances of 1e-9. Its answer is
 * checked by its own feasibility test (1e-9 relative, as averta promises); one that fails it is
 * cut off by a no-good row and the model solved again.
 */

/** One allowed treatment set at one site, with what it costs and avoids. */
export interface ReferenceOption {
  readonly site: string;
  /** Treatment ids in the site's candidate order. */
  readonly treatments: readonly string[];
  readonly cost: number;
  readonly ksiAvoided: number;
  readonly benefitPV: number;
}

/** The reference's answer: status, the objective of its list, and every option it weighed. */
export interface ReferenceResult {
  /** `time-limit`: HiGHS stopped with a feasible list (checked) but no proof; `objective` is that list's. */
  readonly status: "optimal" | "infeasible" | "time-limit" | "unsolved";
  readonly objective: number;
  /** Index into `options` per site (null: nothing funded there). */
  readonly picks: readonly (ReferenceOption | null)[];
  /** Every allowed option, by site (in scenario order). */
  readonly options: readonly (readonly ReferenceOption[])[];
  /** How many HiGHS answers failed the feasibility test and were cut off. */
  readonly cutOff: number;
}

const TOLERANCE = 1e-9;
const MAX_CUTS = 50;

/**
 * The reference's proof: HiGHS stops when its incumbent is within this of its bound. Not 0, because
 * with a K+A share floor and K+A as the objective HiGHS's bound stays at the LP value while the
 * integer optimum lies a few 1e-7 below it (a subset-sum), so at gap 0 it does not finish.
 */
export const REFERENCE_RELATIVE_GAP = 1e-6;

/** Every allowed treatment set per site (by bit mask), evaluated; must-fund and never-fund applied. */
export function referenceOptions(scenario: Scenario): ReferenceOption[][] {
  const baselines = new Map(siteBaselines(scenario).map((b) => [b.site, b]));
  const catalogue = new Map(scenario.catalogue.treatments.map((t) => [t.id, t]));
  return scenario.sites.map((site) => {
    const neverAll = scenario.rules.some((r) => r.kind === "never-fund" && r.site === site.id && r.treatments.length === 0);
    if (neverAll) return [];
    const forbidden = new Set(scenario.rules.flatMap((r) => (r.kind === "never-fund" && r.site === site.id ? r.treatments : [])));
    const needed = scenario.rules.flatMap((r) => (r.kind === "must-fund" && r.site === site.id ? r.treatments : []));
    const baseline = baselines.get(site.id)!;
    const options: ReferenceOption[] = [];
    for (let mask = 1; mask < 1 << site.candidates.length; mask += 1) {
      const ids = site.candidates.filter((_, bit) => (mask >> bit) & 1);
      if (ids.length > scenario.maxTreatmentsPerSite) continue;
      if (ids.some((id) => forbidden.has(id)) || !needed.every((id) => ids.includes(id))) continue;
      const treatments = ids.map((id) => catalogue.get(id)!);
      const groups = treatments.flatMap((t) => (t.exclusiveGroup === undefined ? [] : [t.exclusiveGroup]));
      if (new Set(groups).size < groups.length) continue;
      const alternative = evaluateAlternative(site, treatments, baseline.expectedPerYear, scenario.economics, undefined, baseline.crashGrowthPerYear);
      options.push({ site: site.id, treatments: ids, cost: alternative.cost, ksiAvoided: alternative.ksiAvoided, benefitPV: alternative.benefitPV });
    }
    return options;
  });
}

/** The reference optimum of a scenario at a budget and objective. */
export async function referenceOptimum(scenario: Scenario, budget: number, objective: Objective, timeLimitSeconds = 120, relativeGap = REFERENCE_RELATIVE_GAP): Promise<ReferenceResult> {
  const highs = await highsLoader();
  const options = referenceOptions(scenario);
  const required = scenario.sites.map((site) => scenario.rules.some((r) => r.kind === "must-fund" && r.site === site.id));
  const value = (o: ReferenceOption): number => (objective === "ksi" ? o.ksiAvoided : o.benefitPV);
  const none = scenario.sites.map(() => null);
  if (required.some((must, s) => must && options[s]!.length === 0)) return { status: "infeasible", objective: 0, picks: none, options, cutOff: 0 };

  const name = (s: number, a: number): string => `x_${s}_${a}`;
  const columns = options.flatMap((list, s) => list.map((_, a) => ({ s, a, name: name(s, a) })));
  if (columns.length === 0) {
    const picks = none;
    return referenceViolations(scenario, budget, picks).length === 0
      ? { status: "optimal", objective: 0, picks, options, cutOff: 0 }
      : { status: "infeasible", objective: 0, picks, options, cutOff: 0 };
  }
  const sum = (coefficient: (o: ReferenceOption, site: Site) => number): string => {
    const terms = columns
      .map(({ s, a, name: column }) => [coefficient(options[s]![a]!, scenario.sites[s]!), column] as const)
      .filter(([c]) => c !== 0)
      .map(([c, column]) => `${c < 0 ? "-" : "+"} ${Math.abs(c)} ${column}`);
    return terms.length > 0 ? terms.join(" ") : `0 ${columns[0]!.name}`;
  };
  const rows: string[] = [` budget: ${sum((o) => o.cost)} <= ${budget}`];
  options.forEach((list, s) => {
    if (list.length > 0) rows.push(` site${s}: ${list.map((_, a) => `+ ${name(s, a)}`).join(" ")} ${required[s] ? "=" : "<="} 1`);
  });
  scenario.rules.forEach((rule, k) => {
    const row = ruleRow(rule, sum);
    if (row !== undefined) rows.push(` rule${k}: ${row}`);
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
    if (result.Status === "Infeasible") return { status: "infeasible", objective: 0, picks: none, options, cutOff };
    const stopped = result.Status === "Time limit reached";
    if (result.Status !== "Optimal" && !stopped) return { status: "unsolved", objective: 0, picks: none, options, cutOff };
    const picks = options.map((list, s) => {
      const chosen = list.findIndex((_, a) => (result.Columns[name(s, a)]?.Primal ?? 0) > 0.5);
      return chosen < 0 ? null : list[chosen]!;
    });
    const feasible = referenceViolations(scenario, budget, picks).length === 0;
    if (stopped) {
      return feasible
        ? { status: "time-limit", objective: picks.reduce((total, o) => total + (o === null ? 0 : value(o)), 0), picks, options, cutOff }
        : { status: "unsolved", objective: 0, picks: none, options, cutOff };
    }
    if (feasible) {
      const objectiveValue = picks.reduce((total, o) => total + (o === null ? 0 : value(o)), 0);
      return { status: "optimal", objective: objectiveValue, picks, options, cutOff };
    }
    // A point HiGHS accepts within its own tolerance but that breaks a rule: cut off exactly that point.
    cutOff += 1;
    if (cutOff > MAX_CUTS) return { status: "unsolved", objective: 0, picks: none, options, cutOff };
    const chosen = new Set(picks.flatMap((o, s) => (o === null ? [] : [name(s, options[s]!.indexOf(o))])));
    const cut = columns.map((c) => `${chosen.has(c.name) ? "+" : "-"} 1 ${c.name}`).join(" ");
    rows.push(` cut${cutOff}: ${cut} <= ${chosen.size - 1}`);
  }
}

function inScope(rule: { district?: string; tag?: string }, site: Site): boolean {
  if (rule.district !== undefined) return rule.district === site.district;
  if (rule.tag !== undefined) return site.tags.includes(rule.tag);
  return true;
}

// A rule as "terms sense rhs", straight from its definition; undefined for site rules (applied in the options).
function ruleRow(rule: PolicyRule, sum: (coefficient: (o: ReferenceOption, site: Site) => number) => string): string | undefined {
  switch (rule.kind) {
    case "must-fund":
    case "never-fund":
      return undefined;
    case "spend-cap":
    case "spend-floor": {
      const sense = rule.kind === "spend-cap" ? "<=" : ">=";
      // share: spend in scope (sense) share × total spend, moved to one side.
      if (rule.share !== undefined) return `${sum((o, site) => (inScope(rule, site) ? o.cost : 0) - rule.share! * o.cost)} ${sense} 0`;
      return `${sum((o, site) => (inScope(rule, site) ? o.cost : 0))} ${sense} ${rule.amount!}`;
    }
    case "ksi-share-floor":
      return `${sum((o, site) => (inScope(rule, site) ? o.ksiAvoided : 0) - rule.share * o.ksiAvoided)} >= 0`;
    case "max-projects":
      return `${sum((_o, site) => (inScope(rule, site) ? 1 : 0))} <= ${rule.count}`;
  }
}

/**
 * Every broken condition of a list of picks (one option or null per site, in scenario order):
 * must-fund sites, the budget and every rule, each within 1e-9 of the magnitude of its terms.
 */
export function referenceViolations(scenario: Scenario, budget: number, picks: readonly (ReferenceOption | null)[]): string[] {
  const problems: string[] = [];
  const holds = (lhs: number, sense: "<=" | ">=", rhs: number, magnitude: number): boolean => {
    const slack = TOLERANCE * Math.max(1, magnitude + Math.abs(rhs));
    return sense === "<=" ? lhs <= rhs + slack : lhs >= rhs - slack;
  };
  const funded = picks.flatMap((o, s) => (o === null ? [] : [{ option: o, site: scenario.sites[s]! }]));
  const cost = funded.reduce((t, f) => t + f.option.cost, 0);
  if (!holds(cost, "<=", budget, cost)) problems.push(`cost ${cost} over budget ${budget}`);
  const totalKsi = funded.reduce((t, f) => t + f.option.ksiAvoided, 0);
  for (const rule of scenario.rules) {
    switch (rule.kind) {
      case "must-fund": {
        const s = scenario.sites.findIndex((site) => site.id === rule.site);
        const pick = picks[s];
        if (pick === null || pick === undefined || !rule.treatments.every((id) => pick.treatments.includes(id))) problems.push(`must-fund ${rule.site}`);
        break;
      }
      case "never-fund": {
        const s = scenario.sites.findIndex((site) => site.id === rule.site);
        const pick = picks[s];
        if (pick && (rule.treatments.length === 0 || rule.treatments.some((id) => pick.treatments.includes(id)))) problems.push(`never-fund ${rule.site}`);
        break;
      }
      case "spend-cap":
      case "spend-floor": {
        const sense = rule.kind === "spend-cap" ? "<=" : ">=";
        const spend = funded.filter((f) => inScope(rule, f.site)).reduce((t, f) => t + f.option.cost, 0);
        const limit = rule.share !== undefined ? rule.share * cost : rule.amount!;
        if (!holds(spend, sense, limit, spend + cost)) problems.push(`${rule.kind}: ${spend} ${sense} ${limit}`);
        break;
      }
      case "ksi-share-floor": {
        const scoped = funded.filter((f) => inScope(rule, f.site)).reduce((t, f) => t + f.option.ksiAvoided, 0);
        const magnitude = funded.reduce((t, f) => t + Math.abs(f.option.ksiAvoided), 0);
        if (!holds(scoped, ">=", rule.share * totalKsi, magnitude)) problems.push(`ksi-share-floor: ${scoped} >= ${rule.share * totalKsi}`);
        break;
      }
      case "max-projects": {
        const count = funded.filter((f) => inScope(rule, f.site)).length;
        if (count > rule.count) problems.push(`max-projects: ${count} > ${rule.count}`);
        break;
      }
    }
  }
  return problems;
}
