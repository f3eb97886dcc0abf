import type { Scenario, Site } from "../src/model/types.js";

/** One option of a programme: a treatment set at a site in a build year, with its spend and what it avoids. */
export interface ProgrammeReferenceOption {
  readonly site: string;
  /** Treatment ids in the site's candidate order (a committed project's in its own order). */
  readonly treatments: readonly string[];
  readonly buildYear: number;
  /** Capital charged to each programme year, first year first. */
  readonly spendByYear: readonly number[];
  /** Capital charged within the programme: the sum of spendByYear. */
  readonly cost: number;
  readonly ksiAvoided: number;
  readonly benefitPV: number;
  /** The site's committed project. */
  readonly committed: boolean;
}

const TOLERANCE = 1e-9;

function inScope(rule: { district?: string; tag?: string }, site: Site): boolean {
  if (rule.district !== undefined) return rule.district === site.district;
  if (rule.tag !== undefined) return site.tags.includes(rule.tag);
  return true;
}

/**
 * Every broken condition of a programme (one option or null per site, in scenario order), written
 * from the definitions apart from the reference's model and from averta: each committed project
 * where it was committed; every other pick a valid treatment set (candidates, per-site limit,
 * exclusive groups, must-fund and never-fund) built in a year of the programme inside the site's
 * window, with no phasing before the first year and a year of benefit left; each year's budget
 * (carry-over none) or the budgets up to each year (unspent); and every rule, each within 1e-9
 * of the magnitude of its terms, as averta promises.
 */
export function programmeViolations(scenario: Scenario, picks: readonly (ProgrammeReferenceOption | null)[]): string[] {
  const programme = scenario.programme!;
  const lastYear = programme.firstYear + programme.years - 1;
  const catalogue = new Map(scenario.catalogue.treatments.map((t) => [t.id, t]));
  const problems: string[] = [];
  const holds = (lhs: number, sense: "<=" | ">=", rhs: number, magnitude: number): boolean => {
    const slack = TOLERANCE * Math.max(1, magnitude + Math.abs(rhs));
    return sense === "<=" ? lhs <= rhs + slack : lhs >= rhs - slack;
  };
  scenario.sites.forEach((site, s) => {
    const pick = picks[s] ?? null;
    const project = programme.committed.find((p) => p.site === site.id);
    const mustFund = scenario.rules.find((r) => r.kind === "must-fund" && r.site === site.id);
    if (project !== undefined) {
      const same = pick !== null && pick.buildYear === project.year && pick.treatments.length === project.treatments.length && project.treatments.every((id) => pick.treatments.includes(id));
      if (!same) problems.push(`${site.id}: committed project not kept`);
      return;
    }
    if (pick === null) {
      if (mustFund !== undefined) problems.push(`${site.id}: must-fund site not funded`);
      return;
    }
    const ids = pick.treatments;
    if (pick.site !== site.id) problems.push(`${site.id}: option of another site (${pick.site})`);
    if (ids.length === 0 || new Set(ids).size !== ids.length || ids.some((id) => !site.candidates.includes(id) || !catalogue.has(id))) problems.push(`${site.id}: ${ids.join("+")} is not a set of its candidates`);
    if (ids.length > scenario.maxTreatmentsPerSite) problems.push(`${site.id}: ${ids.length} treatments, more than ${scenario.maxTreatmentsPerSite}`);
    const groups = ids.flatMap((id) => catalogue.get(id)?.exclusiveGroup ?? []);
    if (new Set(groups).size < groups.length) problems.push(`${site.id}: two treatments of one exclusive group`);
    if (mustFund?.kind === "must-fund" && !mustFund.treatments.every((id) => ids.includes(id))) problems.push(`${site.id}: must-fund treatments missing`);
    for (const rule of scenario.rules) {
      if (rule.kind === "never-fund" && rule.site === site.id && (rule.treatments.length === 0 || rule.treatments.some((id) => ids.includes(id)))) problems.push(`${site.id}: never-fund broken`);
    }
    const first = Math.max(programme.firstYear, site.earliestYear ?? programme.firstYear);
    const last = Math.min(lastYear, site.latestYear ?? lastYear);
    if (!Number.isInteger(pick.buildYear) || pick.buildYear < first || pick.buildYear > last) problems.push(`${site.id}: built in ${pick.buildYear}, outside ${first}–${last}`);
    const d = pick.buildYear - programme.firstYear;
    const lead = Math.max(0, ...ids.flatMap((id) => (catalogue.get(id)?.phasing ?? []).map((phase) => phase.yearsBeforeBuild)));
    if (lead > d) problems.push(`${site.id}: phasing spends ${lead} year(s) before ${pick.buildYear}, before the programme`);
    if (d >= scenario.economics.horizonYears) problems.push(`${site.id}: built in ${pick.buildYear}, no year of benefit left`);
  });

  const funded = picks.flatMap((o, s) => (o === null ? [] : [{ option: o, site: scenario.sites[s]! }]));
  const spendIn = (y: number, filter: (site: Site) => boolean = () => true): number => funded.filter((f) => filter(f.site)).reduce((t, f) => t + f.option.spendByYear[y]!, 0);
  let spentSoFar = 0;
  let budgetSoFar = 0;
  programme.budgets.forEach((budget, y) => {
    const spent = spendIn(y);
    spentSoFar += spent;
    budgetSoFar += budget;
    const year = programme.firstYear + y;
    if (programme.carryOver === "none" && !holds(spent, "<=", budget, spent)) problems.push(`${year}: spend ${spent} over its budget ${budget}`);
    if (programme.carryOver === "unspent" && !holds(spentSoFar, "<=", budgetSoFar, spentSoFar)) problems.push(`${programme.firstYear}–${year}: spend ${spentSoFar} over the budgets ${budgetSoFar}`);
  });

  const total = funded.reduce((t, f) => t + f.option.cost, 0);
  const totalKsi = funded.reduce((t, f) => t + f.option.ksiAvoided, 0);
  for (const rule of scenario.rules) {
    switch (rule.kind) {
      case "must-fund":
      case "never-fund":
        break; // checked per site above
      case "spend-cap":
      case "spend-floor": {
        const sense = rule.kind === "spend-cap" ? "<=" : ">=";
        const scoped = funded.filter((f) => inScope(rule, f.site));
        const spend = rule.year === undefined ? scoped.reduce((t, f) => t + f.option.cost, 0) : spendIn(rule.year - programme.firstYear, (site) => inScope(rule, site));
        const limit = rule.share !== undefined ? rule.share * total : rule.amount!;
        if (!holds(spend, sense, limit, spend + total)) problems.push(`${rule.kind}${rule.year === undefined ? "" : ` in ${rule.year}`}: ${spend} ${sense} ${limit} fails`);
        break;
      }
      case "ksi-share-floor": {
        const scoped = funded.filter((f) => inScope(rule, f.site)).reduce((t, f) => t + f.option.ksiAvoided, 0);
        const magnitude = funded.reduce((t, f) => t + Math.abs(f.option.ksiAvoided), 0);
        if (!holds(scoped, ">=", rule.share * totalKsi, magnitude)) problems.push(`ksi-share-floor: ${scoped} >= ${rule.share * totalKsi} fails`);
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
