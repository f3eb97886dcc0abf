import { completeCrashMatrix } from "../../src/model/crashMatrix.js";
import type { CapitalPhase, CommittedProject } from "../../src/model/programmeTypes.js";
import { createPcg32 } from "../../src/model/random/pcg32.js";
import type { Scenario, Site, Treatment } from "../../src/model/types.js";
import type { PolicyRule } from "../../src/model/policyRule.js";

const DISTRICTS = ["North", "South"] as const;
const PHASINGS: readonly (readonly CapitalPhase[])[] = [
  [{ yearsBeforeBuild: 1, share: 0.2 }, { yearsBeforeBuild: 0, share: 0.8 }],
  [{ yearsBeforeBuild: 1, share: 0.5 }, { yearsBeforeBuild: 0, share: 0.5 }],
  [{ yearsBeforeBuild: 2, share: 0.25 }, { yearsBeforeBuild: 1, share: 0.25 }, { yearsBeforeBuild: 0, share: 0.5 }],
];
/** Most (site, option) assignments the brute force will walk in one scenario; sites are dropped above it. */
export const MAX_ASSIGNMENTS = 40_000;

/**
 * A seeded tiny multi-year programme for brute force: 1–3 build years, 2–6 sites with 1–3
 * candidates, whole-thousand costs, phasing, cost escalation, a committed project, site build
 * windows, both carry-over rules and up to three policy rules (district caps by amount or share,
 * per-year caps and floors, must-fund, never-fund, project counts, rarely a K+A share floor).
 * Everything the loader would refuse (a tag no site has, a share for one year, a rule on a
 * committed site) is avoided. Same seed, same scenario.
 */
export function randomProgrammeScenario(seed: number): Scenario {
  const random = createPcg32(BigInt(seed), 2031n);
  const unit = () => random.nextUnitFloat();
  const integer = (low: number, high: number) => low + Math.floor(unit() * (high - low + 1));
  const chance = (p: number) => unit() < p;
  const pick = <T>(items: readonly T[]): T => items[integer(0, items.length - 1)]!;

  const years = chance(0.15) ? 1 : chance(0.4) ? 2 : 3;
  const firstYear = 2027;
  const treatments: Treatment[] = Array.from({ length: integer(2, 4) }, (_, index) => ({
    id: `t${index}`,
    name: `Treatment ${index}`,
    appliesTo: ["intersection"],
    cost: { basis: "per-site", amount: integer(10, 200) * 1000 },
    upkeepPerYear: chance(0.3) ? integer(1, 6) * 500 : 0,
    serviceLifeYears: integer(3, 25),
    ...(chance(0.25) && { exclusiveGroup: "g" }),
    ...(chance(0.35) && { phasing: pick(PHASINGS) }),
    effects: [{ crashTypes: chance(0.5) ? ["pedestrian"] : ["pedestrian", "angle"], severities: ["K", "A", "B", "C", "O"], cmf: integer(40, 95) / 100, source: "random test value" }],
  }));
  const lastYear = firstYear + years - 1;
  let sites: Site[] = Array.from({ length: integer(2, 6) }, (_, index) => {
    const count = chance(0.15) ? 3 : chance(0.5) ? 2 : 1;
    const order = treatments.map((t) => t.id);
    for (let i = order.length - 1; i > 0; i -= 1) {
      const j = integer(0, i);
      [order[i], order[j]] = [order[j]!, order[i]!];
    }
    const candidates = order.slice(0, Math.min(count, order.length));
    const earliest = chance(0.15) ? integer(firstYear, lastYear) : undefined;
    const latest = chance(0.15) ? integer(earliest ?? firstYear, lastYear) : undefined;
    return {
      id: `s${index}`,
      name: `Site ${index}`,
      kind: "intersection",
      district: pick(DISTRICTS),
      tags: chance(0.4) ? ["school"] : [],
      crashes: completeCrashMatrix({ pedestrian: { K: integer(0, 2), A: integer(0, 4), B: integer(0, 5) }, angle: { A: integer(0, 4), B: integer(0, 6) } }),
      candidates: treatments.filter((t) => candidates.includes(t.id)).map((t) => t.id),
      costOverrides: {},
      ...(earliest !== undefined && { earliestYear: earliest }),
      ...(latest !== undefined && { latestYear: latest }),
    };
  });
  // Keep the brute force short: an upper bound on its assignments (2^c − 1 sets per site, every year).
  const assignments = (list: readonly Site[]) => list.reduce((product, site) => product * (1 + (2 ** site.candidates.length - 1) * years), 1);
  while (sites.length > 2 && assignments(sites) > MAX_ASSIGNMENTS) sites = sites.slice(0, -1);

  const costOf = (id: string) => treatments.find((t) => t.id === id)!.cost.amount;
  const fullCost = sites.reduce((total, site) => total + Math.max(...site.candidates.map(costOf)), 0);
  const budgets = Array.from({ length: years }, () => (chance(0.1) ? 0 : Math.round((fullCost * (0.15 + 0.5 * unit())) / years / 1000) * 1000));
  const committed: CommittedProject[] = [];
  if (chance(0.3)) {
    const site = pick(sites);
    const project = { site: site.id, treatments: [pick(site.candidates)], year: integer(firstYear, lastYear) };
    committed.push(project);
    // An approved project is usually in its year's budget; now and then it is not (infeasible).
    if (chance(0.9)) budgets[project.year - firstYear]! += costOf(project.treatments[0]!);
  }
  const totalBudget = budgets.reduce((a, b) => a + b, 0);
  const free = sites.filter((site) => !committed.some((project) => project.site === site.id));
  const tagged = sites.some((site) => site.tags.includes("school"));
  const scope = (): { district?: string; tag?: string } => (tagged && chance(0.3) ? { tag: "school" } : { district: pick(DISTRICTS) });
  const rules: PolicyRule[] = [];
  const mustFund = new Set<string>();
  const neverFundAll = new Set<string>();
  const ruleCount = chance(0.25) ? 0 : integer(1, 3);
  for (let k = 0; k < ruleCount; k += 1) {
    const roll = unit();
    const site = free.length > 0 ? pick(free) : undefined;
    const year = integer(firstYear, lastYear);
    if (roll < 0.12 && site !== undefined) {
      if (mustFund.has(site.id) || neverFundAll.has(site.id)) continue;
      mustFund.add(site.id);
      rules.push({ kind: "must-fund", site: site.id, treatments: chance(0.5) ? [pick(site.candidates)] : [] });
    } else if (roll < 0.22 && site !== undefined) {
      const withTreatment = chance(0.6) || mustFund.has(site.id);
      if (!withTreatment) neverFundAll.add(site.id);
      rules.push({ kind: "never-fund", site: site.id, treatments: withTreatment ? [pick(site.candidates)] : [] });
    } else if (roll < 0.4) {
      rules.push({ kind: "spend-cap", ...scope(), ...(chance(0.5) ? { share: pick([0.25, 0.5, 0.75]) } : { amount: Math.round(totalBudget * (0.2 + 0.6 * unit()) / 1000) * 1000 }) });
    } else if (roll < 0.58) {
      const yearBudget = budgets[year - firstYear]!;
      rules.push({ kind: "spend-cap", ...(chance(0.5) ? scope() : {}), year, amount: Math.round(yearBudget * (0.2 + 0.8 * unit()) / 1000) * 1000 });
    } else if (roll < 0.72) {
      const yearBudget = budgets[year - firstYear]!;
      rules.push({ kind: "spend-floor", ...(chance(0.5) ? scope() : {}), year, amount: Math.round(yearBudget * unit() * 0.3 / 1000) * 1000 });
    } else if (roll < 0.8) {
      rules.push({ kind: "spend-floor", ...scope(), amount: Math.round(totalBudget * unit() * 0.2 / 1000) * 1000 });
    } else if (roll < 0.94) {
      rules.push({ kind: "max-projects", ...(chance(0.3) ? {} : scope()), count: integer(0, 3) });
    } else {
      rules.push({ kind: "ksi-share-floor", ...scope(), share: pick([0.25, 0.5]) });
    }
  }

  const horizonYears = chance(0.2) ? integer(Math.max(years, 2), 5) : integer(8, 20);
  return {
    name: `programme brute force ${seed}`,
    currency: "USD",
    budget: totalBudget,
    crashWindow: { firstYear: 2021, lastYear: 2025 },
    economics: {
      discountRate: pick([0, 0.03, 0.04, 0.07]),
      horizonYears,
      crashCosts: { perCrash: { K: 11_295_400, A: 655_000, B: 198_500, C: 125_600, O: 11_900 }, source: "FHWA-SA-17-071 (from memory)" },
      trafficGrowthRate: chance(0.3) ? 0.02 : 0,
      renewal: pick(["none", "renew", "residual-value"] as const),
    },
    objective: chance(0.5) ? "ksi" : "benefit",
    baseline: "observed",
    maxTreatmentsPerSite: integer(1, 2),
    catalogue: { treatments, performanceFunctions: [] },
    sites,
    rules,
    programme: { firstYear, years, budgets, carryOver: chance(0.5) ? "none" : "unspent", costEscalationRate: chance(0.4) ? pick([0.03, 0.05]) : 0, committed },
  };
}
