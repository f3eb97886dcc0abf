import { writeFileSync } from "node:fs";
import { join } from "node:path";
import { crossCheckScenario } from "../../bench/crossCheckScenario.js";
import type { PlanResult } from "../../src/analysis/planProgramme.js";
import type { CapitalPhase, CommittedProject, ProgrammeYears } from "../../src/model/programmeTypes.js";
import { createPcg32 } from "../../src/model/random/pcg32.js";
import type { Scenario, Site } from "../../src/model/types.js";
import type { PolicyRule } from "../../src/model/policyRule.js";

/**
 * Seeded programmes for metamorphic tests, and an independent reading of a programme's year
 * budgets, build windows, committed projects, phasing, escalation and rules (it shares no code
 * with alternativeInBuildYear, programmeYearRows or buildProgramme).
 */

const FIRST_YEAR = 2027;

/** crossCheckScenario(seed) cut to its first `maxSites` sites, keeping only the rules that still name a site, district or tag it has. */
export function trimmedScenario(seed: number, maxSites: number): Scenario {
  const full = crossCheckScenario(seed);
  const sites = full.sites.slice(0, maxSites);
  const rules = full.rules.filter((rule) => {
    if (rule.kind === "must-fund" || rule.kind === "never-fund") return sites.some((site) => site.id === rule.site);
    if (rule.district !== undefined) return sites.some((site) => site.district === rule.district);
    if (rule.tag !== undefined) return sites.some((site) => site.tags.includes(rule.tag!));
    return true;
  });
  // A never-fund rule on a treatment a must-fund rule requires makes the scenario one the loader refuses.
  const required = new Set(rules.flatMap((rule) => (rule.kind === "must-fund" ? rule.treatments.map((id) => `${rule.site}|${id}`) : [])));
  return { ...full, sites, rules: rules.filter((rule) => rule.kind !== "never-fund" || !rule.treatments.some((id) => required.has(`${rule.site}|${id}`))) };
}

/** The scenario with a programme block; its budget is the sum of the years', as the loader makes it. */
export function withProgramme(scenario: Scenario, programme: ProgrammeYears): Scenario {
  return { ...scenario, budget: programme.budgets.reduce((total, value) => total + value, 0), programme };
}

/**
 * A seeded programme of 2-4 years on 3-8 sites (at most 6 in four years): yearly budgets around
 * the one-year budget, either carry-over rule, escalation 0-6 %, phasing on about a third of the
 * treatments (shares in quarters, exact in floating point), build windows at some sites, sometimes
 * one committed project, renewal `renew` or `none`.
 */
export function randomProgramme(seed: number): Scenario {
  const random = createPcg32(BigInt(seed), 4242n);
  const integer = (low: number, high: number) => low + Math.floor(random.nextUnitFloat() * (high - low + 1));
  const chance = (p: number) => random.nextUnitFloat() < p;
  const years = integer(2, 4);
  const base = trimmedScenario(seed, integer(3, years === 4 ? 6 : 8));
  const lastYear = FIRST_YEAR + years - 1;
  const phasings: CapitalPhase[][] = [
    [{ yearsBeforeBuild: 1, share: 0.25 }, { yearsBeforeBuild: 0, share: 0.75 }],
    [{ yearsBeforeBuild: 0, share: 0.5 }, { yearsBeforeBuild: 1, share: 0.5 }],
    [{ yearsBeforeBuild: 2, share: 0.25 }, { yearsBeforeBuild: 1, share: 0.25 }, { yearsBeforeBuild: 0, share: 0.5 }],
  ];
  const treatments = base.catalogue.treatments.map((t) => (chance(0.35) ? { ...t, phasing: phasings[integer(0, 2)]! } : t));
  const ruled = new Set(base.rules.flatMap((rule) => (rule.kind === "must-fund" || rule.kind === "never-fund" ? [rule.site] : [])));
  const free = base.sites.filter((site) => !ruled.has(site.id));
  const committed: CommittedProject[] = free.length > 0 && chance(0.3) ? [{ site: free[0]!.id, treatments: [free[0]!.candidates[0]!], year: integer(FIRST_YEAR, lastYear) }] : [];
  const sites = base.sites.map((site): Site => {
    const project = committed.find((c) => c.site === site.id);
    const earliest = chance(0.3) ? integer(FIRST_YEAR, project?.year ?? lastYear) : undefined;
    const latest = chance(0.2) ? integer(Math.max(earliest ?? FIRST_YEAR, project?.year ?? FIRST_YEAR), lastYear) : undefined;
    return { ...site, ...(earliest !== undefined && { earliestYear: earliest }), ...(latest !== undefined && { latestYear: latest }) };
  });
  const budgets = Array.from({ length: years }, () => Math.round((base.budget / years) * (0.5 + random.nextUnitFloat())));
  const rates = [0, 0.03, 0.06];
  return withProgramme(
    { ...base, sites, catalogue: { ...base.catalogue, treatments }, economics: { ...base.economics, renewal: chance(0.5) ? "renew" : "none" } },
    { firstYear: FIRST_YEAR, years, budgets, carryOver: chance(0.5) ? "unspent" : "none", costEscalationRate: rates[integer(0, 2)]!, committed },
  );
}

const RELATIVE_TOLERANCE = 1e-9;
const atMost = (left: number, right: number) => left <= right + RELATIVE_TOLERANCE * Math.max(1, Math.abs(left), Math.abs(right));
const near = (a: number, b: number) => Math.abs(a - b) <= RELATIVE_TOLERANCE * Math.max(1, Math.abs(a), Math.abs(b));

/** Capital of a set of treatments built in `buildYear`, by calendar year: the site's cost × (1 + e)^d, split by phasing (all in the build year when none). */
function expectedSpend(scenario: Scenario, site: Site, treatmentIds: readonly string[], buildYear: number): Map<number, number> {
  const programme = scenario.programme!;
  const spend = new Map<number, number>();
  for (const id of treatmentIds) {
    const treatment = scenario.catalogue.treatments.find((t) => t.id === id)!;
    const cost = site.costOverrides[id] ?? treatment.cost.amount * (treatment.cost.basis === "per-km" ? site.lengthKm! : 1);
    const capital = cost * (1 + programme.costEscalationRate) ** (buildYear - programme.firstYear);
    for (const phase of treatment.phasing ?? [{ yearsBeforeBuild: 0, share: 1 }]) {
      const year = buildYear - phase.yearsBeforeBuild;
      spend.set(year, (spend.get(year) ?? 0) + capital * phase.share);
    }
  }
  return spend;
}

/** Everything wrong with a programme plan under its scenario (empty when it is feasible). */
export function programmeViolations(plan: PlanResult): string[] {
  const scenario = plan.prepared.scenario;
  const programme = scenario.programme!;
  const lastYear = programme.firstYear + programme.years - 1;
  const problems: string[] = [];
  const spendByYear = new Array<number>(programme.years).fill(0);
  const cost = new Map<string, number>();
  for (const { entry, alternative } of plan.funded) {
    const site = entry.site;
    const year = alternative.buildYear!;
    if (cost.has(site.id)) problems.push(`${site.id} funded twice`);
    const project = programme.committed.find((c) => c.site === site.id);
    if (project !== undefined && (project.year !== year || project.treatments.join() !== alternative.treatments.join())) problems.push(`${site.id}: committed project moved or changed`);
    if (project === undefined && (year < Math.max(programme.firstYear, site.earliestYear ?? 0) || year > Math.min(lastYear, site.latestYear ?? lastYear))) problems.push(`${site.id}: built in ${year}, outside its window`);
    if (project === undefined && alternative.treatments.some((id) => !site.candidates.includes(id))) problems.push(`${site.id}: not a candidate`);
    let siteCost = 0;
    for (const [spendYear, amount] of expectedSpend(scenario, site, alternative.treatments, year)) {
      if (spendYear < programme.firstYear && project === undefined) problems.push(`${site.id}: spends in ${spendYear}, before the programme`);
      if (spendYear < programme.firstYear) continue; // a committed project's earlier spend is sunk
      const y = spendYear - programme.firstYear;
      if (!near(alternative.spendByYear![y]!, amount)) problems.push(`${site.id}: spend in ${spendYear} ${alternative.spendByYear![y]} vs ${amount}`);
      spendByYear[y]! += amount;
      siteCost += amount;
    }
    cost.set(site.id, siteCost);
  }
  for (const project of programme.committed) if (!cost.has(project.site)) problems.push(`committed ${project.site} not funded`);
  let budgetSoFar = 0;
  let spendSoFar = 0;
  programme.budgets.forEach((budget, y) => {
    budgetSoFar += budget;
    spendSoFar += spendByYear[y]!;
    const [spend, limit] = programme.carryOver === "unspent" ? [spendSoFar, budgetSoFar] : [spendByYear[y]!, budget];
    if (!atMost(spend, limit)) problems.push(`${programme.firstYear + y}: spend ${spend} over ${limit}`);
  });
  problems.push(...ruleProblems(plan, cost));
  return problems;
}

function ruleProblems(plan: PlanResult, cost: ReadonlyMap<string, number>): string[] {
  const problems: string[] = [];
  const funded = new Map(plan.funded.map((project) => [project.entry.site.id, project]));
  const inScope = (rule: { district?: string; tag?: string }, site: Site) =>
    rule.district !== undefined ? site.district === rule.district : rule.tag !== undefined ? site.tags.includes(rule.tag) : true;
  const scoped = (rule: { district?: string; tag?: string }) => plan.funded.filter((project) => inScope(rule, project.entry.site));
  const sum = (values: number[]) => values.reduce((a, b) => a + b, 0);
  const totalCost = sum([...cost.values()]);
  const totalKsi = sum(plan.funded.map((project) => project.alternative.ksiAvoided));
  for (const rule of plan.prepared.scenario.rules as readonly PolicyRule[]) {
    if (rule.kind === "must-fund" && !(funded.has(rule.site) && rule.treatments.every((id) => funded.get(rule.site)!.alternative.treatments.includes(id)))) problems.push(`must-fund ${rule.site}`);
    if (rule.kind === "never-fund" && funded.has(rule.site) && (rule.treatments.length === 0 || rule.treatments.some((id) => funded.get(rule.site)!.alternative.treatments.includes(id)))) problems.push(`never-fund ${rule.site}`);
    if (rule.kind === "spend-cap" || rule.kind === "spend-floor") {
      const spend = sum(scoped(rule).map((project) => cost.get(project.entry.site.id)!));
      const limit = rule.share !== undefined ? rule.share * totalCost : rule.amount!;
      if (!(rule.kind === "spend-cap" ? atMost(spend, limit) : atMost(limit, spend))) problems.push(`${rule.kind}: ${spend} vs ${limit}`);
    }
    if (rule.kind === "ksi-share-floor" && !atMost(rule.share * totalKsi, sum(scoped(rule).map((project) => project.alternative.ksiAvoided)))) problems.push("ksi-share-floor");
    if (rule.kind === "max-projects" && scoped(rule).length > rule.count) problems.push("max-projects");
  }
  return problems;
}

/** Writes the scenario and its catalogue as YAML (in its JSON form) into `folder`; `block` replaces `budget:` by a programme block. Returns the scenario's path. */
export function writeScenarioFiles(scenario: Scenario, folder: string, name: string, block?: Record<string, unknown>): string {
  const catalogue = {
    treatments: scenario.catalogue.treatments.map((t) => ({
      id: t.id,
      name: t.name,
      appliesTo: t.appliesTo,
      cost: t.cost.basis === "per-km" ? { perKm: t.cost.amount } : { perSite: t.cost.amount },
      upkeepPerYear: t.upkeepPerYear,
      serviceLifeYears: t.serviceLifeYears,
      ...(t.exclusiveGroup !== undefined && { exclusiveGroup: t.exclusiveGroup }),
      ...(t.phasing !== undefined && { phasing: t.phasing }),
      effects: t.effects.map((e) => ({ crashTypes: e.crashTypes, severities: e.severities, cmf: e.cmf, source: e.source })),
    })),
  };
  const scope = (rule: { district?: string; tag?: string }) => ({ ...(rule.district !== undefined && { district: rule.district }), ...(rule.tag !== undefined && { tag: rule.tag }) });
  const of = <K extends PolicyRule["kind"]>(kind: K) => scenario.rules.filter((rule): rule is Extract<PolicyRule, { kind: K }> => rule.kind === kind);
  type SpendRule = Extract<PolicyRule, { kind: "spend-cap" | "spend-floor" }>;
  const spend = (kind: SpendRule["kind"]) =>
    scenario.rules.filter((rule): rule is SpendRule => rule.kind === kind).map((rule) => ({ ...scope(rule), ...(rule.share !== undefined ? { share: rule.share } : { amount: rule.amount }) }));
  const rules = {
    mustFund: of("must-fund").map((rule) => ({ site: rule.site, ...(rule.treatments.length > 0 && { treatments: rule.treatments }) })),
    neverFund: of("never-fund").map((rule) => ({ site: rule.site, ...(rule.treatments.length > 0 && { treatments: rule.treatments }) })),
    spendCaps: spend("spend-cap"),
    spendFloors: spend("spend-floor"),
    ksiShareFloors: of("ksi-share-floor").map((rule) => ({ ...scope(rule), share: rule.share })),
    maxProjects: of("max-projects").map((rule) => ({ ...scope(rule), count: rule.count })),
  };
  const raw = {
    name: scenario.name,
    catalogues: [`${name}-catalogue.yaml`],
    currency: scenario.currency,
    ...(block === undefined ? { budget: scenario.budget } : { programme: block }),
    crashWindow: scenario.crashWindow,
    economics: {
      discountRate: scenario.economics.discountRate,
      horizonYears: scenario.economics.horizonYears,
      ...(scenario.economics.renewal !== undefined && { renewal: scenario.economics.renewal }),
      crashCosts: { ...scenario.economics.crashCosts.perCrash, source: scenario.economics.crashCosts.source },
    },
    objective: scenario.objective,
    baseline: scenario.baseline,
    maxTreatmentsPerSite: scenario.maxTreatmentsPerSite,
    rules: Object.fromEntries(Object.entries(rules).filter(([, list]) => list.length > 0)),
    sites: scenario.sites.map((site) => ({
      id: site.id,
      name: site.name,
      kind: site.kind,
      district: site.district,
      tags: site.tags,
      crashes: site.crashes,
      candidates: site.candidates,
      ...(site.earliestYear !== undefined && { earliestYear: site.earliestYear }),
      ...(site.latestYear !== undefined && { latestYear: site.latestYear }),
    })),
  };
  writeFileSync(join(folder, `${name}-catalogue.yaml`), JSON.stringify(catalogue, null, 1));
  const file = join(folder, `${name}.yaml`);
  writeFileSync(file, JSON.stringify(raw, null, 1));
  return file;
}
