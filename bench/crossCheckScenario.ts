import { buildCrashMatrix } from "../src/model/crashMatrix.js";
import { createPcg32, type RandomSource } from "../src/model/random/pcg32.js";
import { CRASH_TYPES, type CrashType, type Scenario, type Site, type Treatment } from "../src/model/types.js";
import type { PolicyRule } from "../src/model/policyRule.js";

const DISTRICTS = ["North", "South", "East"] as const;
const TAGS = ["school-zone", "priority-community"] as const;
const EXCLUSIVE_GROUPS = ["crossing-control", "signal-control"] as const;

/**
 * A seeded random scenario for cross-checking the optimiser against an independent model:
 * 4-24 intersections in three districts, 4-9 treatments (some in exclusive groups) with costs in
 * cents, CMFs and rule shares drawn as arbitrary fractions (so rule boundaries are not exact in
 * floating point), and 1-5 policy rules of every kind; about two scenarios in three carry a K+A
 * share floor. Same seed, same scenario.
 */
export function crossCheckScenario(seed: number): Scenario {
  const random = createPcg32(BigInt(seed), 2027n);
  const uniform = (low: number, high: number): number => low + (high - low) * random.nextUnitFloat();
  const integer = (low: number, high: number): number => Math.floor(uniform(low, high + 1));
  const chance = (p: number): boolean => random.nextUnitFloat() < p;
  const pick = <T>(items: readonly T[]): T => items[integer(0, items.length - 1)]!;

  const treatments: Treatment[] = Array.from({ length: integer(4, 9) }, (_, index) => ({
    id: `t${index}`,
    name: `Treatment ${index}`,
    appliesTo: ["intersection"],
    cost: { basis: "per-site", amount: Math.round(uniform(5_000, 400_000) * 100) / 100 },
    upkeepPerYear: chance(0.5) ? Math.round(uniform(0, 3_000)) : 0,
    serviceLifeYears: integer(5, 25),
    ...(chance(0.4) && { exclusiveGroup: pick(EXCLUSIVE_GROUPS) }),
    effects: randomEffects(random, integer(1, 2)),
  }));

  const sites: Site[] = Array.from({ length: integer(4, 24) }, (_, index) => {
    const candidates = shuffled(random, treatments.map((t) => t.id)).slice(0, integer(1, Math.min(5, treatments.length)));
    return {
      id: `s${String(index).padStart(2, "0")}`,
      name: `Site ${index}`,
      kind: "intersection",
      district: pick(DISTRICTS),
      tags: TAGS.filter(() => chance(0.3)),
      crashes: buildCrashMatrix((_type, severity) => {
        const mean = severity === "K" ? 0.15 : severity === "A" ? 0.6 : severity === "O" ? 3 : 1.5;
        return chance(0.5) ? integer(0, Math.ceil(mean * 3)) : 0;
      }),
      candidates,
      costOverrides: {},
    };
  });

  const maxTreatmentsPerSite = integer(1, 3);
  const fullCost = sites.reduce((total, site) => total + Math.max(...site.candidates.map((id) => treatments.find((t) => t.id === id)!.cost.amount)), 0);
  const budget = Math.round(fullCost * uniform(0.02, 0.7) * 100) / 100;
  const rules = randomRules(random, sites, budget);
  return {
    name: `cross-check ${seed}`,
    currency: "USD",
    budget,
    crashWindow: { firstYear: 2021, lastYear: 2025 },
    economics: {
      discountRate: uniform(0, 0.08),
      horizonYears: integer(10, 30),
      crashCosts: { perCrash: { K: 11_295_400, A: 655_000, B: 198_500, C: 125_600, O: 11_900 }, source: "FHWA-SA-17-071, 2016 USD (from memory)" },
    },
    objective: chance(0.5) ? "ksi" : "benefit",
    baseline: "observed",
    maxTreatmentsPerSite,
    catalogue: { treatments, performanceFunctions: [] },
    sites,
    rules,
  };
}

function randomEffects(random: RandomSource, count: number): Treatment["effects"] {
  const types = shuffled(random, CRASH_TYPES);
  return Array.from({ length: count }, (_, index) => {
    const crashTypes: CrashType[] = types.slice(index * 3, index * 3 + 1 + Math.floor(random.nextUnitFloat() * 3));
    return {
      crashTypes,
      severities: random.nextUnitFloat() < 0.3 ? ["K", "A"] : ["K", "A", "B", "C", "O"],
      cmf: 0.35 + 0.63 * random.nextUnitFloat(),
      source: "random cross-check value",
    };
  });
}

function randomRules(random: RandomSource, sites: readonly Site[], budget: number): PolicyRule[] {
  const uniform = (low: number, high: number): number => low + (high - low) * random.nextUnitFloat();
  const chance = (p: number): boolean => random.nextUnitFloat() < p;
  const scope = (allowAll: boolean): { district?: string; tag?: string } => {
    const roll = random.nextUnitFloat();
    if (roll < 0.5) return { district: DISTRICTS[Math.floor(random.nextUnitFloat() * DISTRICTS.length)]! };
    const tag = TAGS[Math.floor(random.nextUnitFloat() * TAGS.length)]!;
    // A rule must name a tag some site has (the loader refuses others), else fall back to a district.
    if (roll < 0.85 || !allowAll) return sites.some((s) => s.tags.includes(tag)) ? { tag } : { district: sites[0]!.district };
    return {};
  };
  const rules: PolicyRule[] = [];
  const mustFund = new Set<string>();
  const neverFundAll = new Set<string>();
  if (chance(0.65)) rules.push({ kind: "ksi-share-floor", ...scope(false), share: uniform(0.05, 0.6) });
  const extra = Math.floor(uniform(0, 4.99));
  for (let k = 0; k < extra; k += 1) {
    const roll = random.nextUnitFloat();
    const site = sites[Math.floor(random.nextUnitFloat() * sites.length)]!;
    if (roll < 0.12) {
      if (mustFund.has(site.id) || neverFundAll.has(site.id)) continue;
      mustFund.add(site.id);
      const withTreatment = chance(0.5);
      rules.push({ kind: "must-fund", site: site.id, treatments: withTreatment ? [site.candidates[0]!] : [] });
    } else if (roll < 0.22) {
      const withTreatment = chance(0.6) || mustFund.has(site.id);
      if (!withTreatment) neverFundAll.add(site.id);
      rules.push({ kind: "never-fund", site: site.id, treatments: withTreatment ? [site.candidates[site.candidates.length - 1]!] : [] });
    } else if (roll < 0.62) {
      const kind = chance(0.6) ? "spend-cap" : "spend-floor";
      const where = scope(true);
      const useShare = Object.keys(where).length > 0 && chance(0.5);
      rules.push({
        kind,
        ...where,
        // Floors up to half the budget and caps up to all of it, so most scenarios stay feasible.
        ...(useShare ? { share: uniform(0.05, 0.8) } : { amount: Math.round(budget * uniform(0.02, kind === "spend-cap" ? 1 : 0.5) * 100) / 100 }),
      });
    } else if (roll < 0.82) {
      rules.push({ kind: "ksi-share-floor", ...scope(false), share: uniform(0.05, 0.7) });
    } else {
      rules.push({ kind: "max-projects", ...scope(true), count: Math.floor(uniform(0, 8)) });
    }
  }
  return rules;
}

function shuffled<T>(random: RandomSource, items: readonly T[]): T[] {
  const copy = [...items];
  for (let i = copy.length - 1; i > 0; i -= 1) {
    const j = Math.floor(random.nextUnitFloat() * (i + 1));
    [copy[i], copy[j]] = [copy[j]!, copy[i]!];
  }
  return copy;
}
