import { buildCrashMatrix } from "../src/model/crashMatrix.js";
import type { CapitalPhase, CommittedProject, ProgrammeYears } from "../src/model/programmeTypes.js";
import { createPcg32 } from "../src/model/random/pcg32.js";
import type { RenewalRule, Scenario, Site, Treatment } from "../src/model/types.js";
import type { PolicyRule } from "../src/model/policyRule.js";
import { crossCheckScenario } from "./crossCheckScenario.js";

const DISTRICTS = ["North", "South", "East"] as const;
const TAGS = ["school-zone", "priority-community"] as const;
const RENEWALS: readonly RenewalRule[] = ["none", "renew", "residual-value"];
const FIRST_YEAR = 2027;
/** From this many sites on, a case is large: renewal `renew`, most sites in one fixed year, no K+A share floor. */
const LARGE_SITES = 100;

/**
 * Site counts by case, in turn (seed ÷ 2 picks one, so cases with and without rules see every
 * size); the 300-site cases always run 5 years, the largest programme the cross-check promises.
 */
export const PROGRAMME_CROSS_CHECK_SIZES: readonly number[] = [10, 24, 60, 14, 120, 36, 300, 18, 80, 12, 200, 30];

/**
 * A seeded multi-year programme for cross-checking averta against an independent model. The
 * catalogue (4–9 treatments, some in exclusive groups), economics, objective and per-site limit
 * come from crossCheckScenario(seed); on top: phasing on about a third of the treatments (one or
 * two years before the build year), renewal of any kind (`renew` from LARGE_SITES sites on),
 * sometimes traffic growth, and PROGRAMME_CROSS_CHECK_SIZES sites with fresh crash counts and
 * their own costs (±40 %). Build windows: about one site in four below 30 sites; from 30 sites half
 * the sites, from LARGE_SITES 85 %, are fixed to one year, since free years over hundreds of sites
 * often leave both solvers short of a proof at gap 0 within a minute.
 * The programme: 2–5 years from 2027, uneven yearly budgets (now and then a year of 0), either
 * carry-over rule, escalation 0–4 % (0 in one case in four), and in half the cases 1–3 committed
 * projects, most within their year's budget. Odd seeds have no rules; even seeds 1–5 of every kind
 * (per-year and whole-programme spend caps and floors, shares, counts, site rules, and below
 * LARGE_SITES sites one K+A share floor at most). Same seed, same scenario.
 */
export function programmeCrossCheckScenario(seed: number): Scenario {
  const template = crossCheckScenario(seed);
  const random = createPcg32(BigInt(seed), 2031n);
  const uniform = (low: number, high: number): number => low + (high - low) * random.nextUnitFloat();
  const integer = (low: number, high: number): number => Math.floor(uniform(low, high + 1));
  const chance = (p: number): boolean => random.nextUnitFloat() < p;
  const pick = <T>(items: readonly T[]): T => items[integer(0, items.length - 1)]!;
  const cents = (value: number): number => Math.round(value * 100) / 100;

  const siteCount = PROGRAMME_CROSS_CHECK_SIZES[Math.floor(seed / 2) % PROGRAMME_CROSS_CHECK_SIZES.length]!;
  const years = siteCount >= 300 ? 5 : integer(2, 5);
  const lastYear = FIRST_YEAR + years - 1;
  const large = siteCount >= LARGE_SITES;
  const treatments: Treatment[] = template.catalogue.treatments.map((treatment) => {
    if (!chance(0.35)) return treatment;
    const early = cents(uniform(0.05, 0.4));
    const phasing: CapitalPhase[] = chance(0.7)
      ? [{ yearsBeforeBuild: 1, share: early }, { yearsBeforeBuild: 0, share: 1 - early }]
      : [{ yearsBeforeBuild: 2, share: early / 2 }, { yearsBeforeBuild: 1, share: early / 2 }, { yearsBeforeBuild: 0, share: 1 - early }];
    return { ...treatment, phasing };
  });
  const byId = new Map(treatments.map((t) => [t.id, t]));

  const sites: Site[] = Array.from({ length: siteCount }, (_, index) => {
    const candidates = shuffled(treatments.map((t) => t.id), random.nextUnitFloat.bind(random)).slice(0, integer(1, Math.min(5, treatments.length)));
    // Fixed years keep large cases provable (free-year 300-site programmes: no proof at gap 0 in 60 s).
    const fixedYear = chance(large ? 0.85 : siteCount >= 30 ? 0.5 : 0);
    const windowed = fixedYear || chance(0.25);
    const earliest = fixedYear ? integer(FIRST_YEAR, lastYear) : windowed && chance(0.6) ? integer(FIRST_YEAR, lastYear) : undefined;
    const latest = fixedYear ? earliest : windowed && (earliest === undefined || chance(0.5)) ? integer(earliest ?? FIRST_YEAR, lastYear) : undefined;
    return {
      id: `p${String(index).padStart(3, "0")}`,
      name: `Programme site ${index}`,
      kind: "intersection",
      district: pick(DISTRICTS),
      tags: TAGS.filter(() => chance(0.3)),
      crashes: buildCrashMatrix((_type, severity) => {
        const mean = severity === "K" ? 0.15 : severity === "A" ? 0.6 : severity === "O" ? 3 : 1.5;
        return chance(0.5) ? integer(0, Math.ceil(mean * 3)) : 0;
      }),
      candidates,
      // Site-specific costs (as surveyed sites have), so no two sites share every cost.
      costOverrides: Object.fromEntries(candidates.map((id) => [id, cents(byId.get(id)!.cost.amount * uniform(0.6, 1.4))])),
      ...(earliest !== undefined && { earliestYear: earliest }),
      ...(latest !== undefined && { latestYear: latest }),
    };
  });

  const fullCost = sites.reduce((total, site) => total + Math.max(...Object.values(site.costOverrides)), 0);
  const share = uniform(0.04, 0.5);
  const budgets = Array.from({ length: years }, () => (chance(0.08) ? 0 : cents(((fullCost * share) / years) * uniform(0.4, 1.6))));

  const committed: CommittedProject[] = [];
  if (chance(0.5)) {
    for (const index of shuffled(sites.map((_, i) => i), random.nextUnitFloat.bind(random)).slice(0, integer(1, 3))) {
      const site = sites[index]!;
      // A committed site keeps no build window: the commitment fixes its year.
      const { earliestYear: _e, latestYear: _l, ...open } = site;
      sites[index] = open;
      const project = { site: site.id, treatments: [site.candidates[0]!], year: integer(FIRST_YEAR, lastYear) };
      committed.push(project);
      // Most committed projects were approved within their year's budget; one in four may not fit.
      const y = project.year - FIRST_YEAR;
      if (chance(0.75)) budgets[y] = Math.max(budgets[y]!, cents(1.5 * site.costOverrides[project.treatments[0]!]! * Math.pow(1.04, y)));
    }
  }
  const programme: ProgrammeYears = {
    firstYear: FIRST_YEAR,
    years,
    budgets,
    carryOver: chance(0.5) ? "none" : "unspent",
    costEscalationRate: chance(0.25) ? 0 : uniform(0, 0.04),
    committed,
  };
  const withRules = seed % 2 === 0;
  const bound = new Set(committed.map((project) => project.site));
  const rules = withRules ? programmeRules(sites.filter((site) => !bound.has(site.id)), programme, uniform) : [];
  return {
    ...template,
    name: `programme cross-check ${seed}`,
    budget: budgets.reduce((total, value) => total + value, 0),
    economics: { ...template.economics, renewal: large ? "renew" : pick(RENEWALS), ...(chance(0.3) && { trafficGrowthRate: uniform(0, 0.02) }) },
    catalogue: { ...template.catalogue, treatments },
    sites,
    rules,
    programme,
  };
}

/** 1–5 rules: per-year and whole-programme spend caps and floors, shares, K+A share floors, counts and site rules. */
function programmeRules(free: readonly Site[], programme: ProgrammeYears, uniform: (low: number, high: number) => number): PolicyRule[] {
  const chance = (p: number): boolean => uniform(0, 1) < p;
  const index = (length: number): number => Math.min(length - 1, Math.floor(uniform(0, length)));
  const total = programme.budgets.reduce((sum, value) => sum + value, 0);
  const scope = (allowAll: boolean): { district?: string; tag?: string } => {
    const roll = uniform(0, 1);
    if (roll < 0.5 || free.length === 0) return { district: DISTRICTS[index(DISTRICTS.length)]! };
    const tag = TAGS[index(TAGS.length)]!;
    if (roll < 0.85 || !allowAll) return free.some((s) => s.tags.includes(tag)) ? { tag } : { district: free[0]!.district };
    return {};
  };
  const rules: PolicyRule[] = [];
  const siteRuled = new Set<string>();
  const count = 1 + index(5);
  for (let k = 0; k < count; k += 1) {
    const roll = uniform(0, 1);
    const cap = chance(0.6);
    if (roll < 0.3) {
      // One year's spend: caps up to the year's budget, floors up to half of it.
      const y = index(programme.years);
      const amount = Math.round(programme.budgets[y]! * uniform(0.02, cap ? 1 : 0.5) * 100) / 100;
      rules.push({ kind: cap ? "spend-cap" : "spend-floor", ...scope(true), year: programme.firstYear + y, amount });
    } else if (roll < 0.5) {
      const where = scope(true);
      const useShare = Object.keys(where).length > 0 && chance(0.5);
      rules.push({
        kind: cap ? "spend-cap" : "spend-floor",
        ...where,
        ...(useShare ? { share: uniform(0.05, 0.8) } : { amount: Math.round(total * uniform(0.02, cap ? 1 : 0.5) * 100) / 100 }),
      });
    } else if (roll < 0.62) {
      // One K+A share floor at most, below LARGE_SITES sites: two together, or one over 300 sites,
      // often leave HiGHS at gap 0 (and averta) short of closing the last 1e-8 in time.
      if (free.length >= LARGE_SITES || rules.some((r) => r.kind === "ksi-share-floor")) continue;
      rules.push({ kind: "ksi-share-floor", ...scope(false), share: uniform(0.05, 0.5) });
    } else if (roll < 0.78) {
      rules.push({ kind: "max-projects", ...scope(true), count: Math.floor(uniform(0, 3 + free.length / 4)) });
    } else if (free.length > 0) {
      const site = free[index(free.length)]!;
      if (siteRuled.has(site.id)) continue;
      siteRuled.add(site.id);
      if (roll < 0.88) rules.push({ kind: "must-fund", site: site.id, treatments: chance(0.5) ? [site.candidates[0]!] : [] });
      else rules.push({ kind: "never-fund", site: site.id, treatments: chance(0.6) ? [site.candidates[site.candidates.length - 1]!] : [] });
    }
  }
  return rules;
}

function shuffled<T>(items: readonly T[], unit: () => number): T[] {
  const copy = [...items];
  for (let i = copy.length - 1; i > 0; i -= 1) {
    const j = Math.floor(unit() * (i + 1));
    [copy[i], copy[j]] = [copy[j]!, copy[i]!];
  }
  return copy;
}
