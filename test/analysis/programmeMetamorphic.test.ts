import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { planProgramme, type PlanResult } from "../../src/analysis/planProgramme.js";
import { preparePlan } from "../../src/analysis/preparePlan.js";
import { loadScenario } from "../../src/io/loadScenario.js";
import type { Scenario } from "../../src/model/types.js";
import { ruleViolations } from "./scenarioRules.js";
import { programmeViolations, randomProgramme, trimmedScenario, withProgramme, writeScenarioFiles } from "./seededProgramme.js";

// Metamorphic relations of the multi-year programme: each compares two solves of related
// scenarios, so no expected figure is stored. Every list is also checked feasible by the
// independent readings in seededProgramme.ts (programmes) and scenarioRules.ts (one-year lists).
const SEEDS = Array.from({ length: 60 }, (_, index) => 9100 + index);
const folder = mkdtempSync(join(tmpdir(), "averta-programme-metamorphic-"));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

const solve = (scenario: Scenario) => planProgramme(preparePlan(scenario));
const projects = (plan: PlanResult) => plan.funded.map((p) => ({ site: p.entry.site.id, treatments: [...p.alternative.treatments], buildYear: p.alternative.buildYear }));
const figures = (plan: PlanResult) => plan.funded.map(({ alternative: a }) => [a.cost, a.lifecycleCostPV, a.ksiAvoided, a.benefitPV]);
const DECIDED = ["optimal", "infeasible"];

const baseCache = new Map<number, Promise<PlanResult>>();
/** The seed's random programme, solved once for every relation that starts from it. */
function basePlan(seed: number): Promise<PlanResult> {
  if (!baseCache.has(seed)) baseCache.set(seed, solve(randomProgramme(seed)));
  return baseCache.get(seed)!;
}

interface Tally {
  compared: number;
  strict: number;
}

/**
 * `loose` allows every list `tight` allows, so its proven optimum is no lower. "optimal" is within
 * 1e-9 relative of the bound (README, the optimisation), so two optima compare within twice that.
 */
function expectNoLower(tight: PlanResult, loose: PlanResult, tally: Tally, label: string): void {
  expect(DECIDED, `${label}: tight status`).toContain(tight.solution.status);
  expect(DECIDED, `${label}: loose status`).toContain(loose.solution.status);
  for (const plan of [tight, loose]) if (plan.solution.status === "optimal") expect(programmeViolations(plan), label).toEqual([]);
  if (tight.solution.status !== "optimal") return;
  expect(loose.solution.status, label).toBe("optimal");
  const tolerance = 2e-9 * Math.max(1, Math.abs(tight.solution.objective));
  expect(loose.solution.objective, label).toBeGreaterThanOrEqual(tight.solution.objective - tolerance);
  tally.compared += 1;
  if (loose.solution.objective > tight.solution.objective + tolerance) tally.strict += 1;
}

describe("a one-year programme is today's one-year list", () => {
  it(`the same objective, projects, figures and totals as budget: B, through the loader (${SEEDS.length} seeded scenarios)`, async () => {
    let optimal = 0;
    for (const seed of SEEDS) {
      const scenario = trimmedScenario(seed, 12);
      const budget = scenario.budget;
      // Any first year; budgets as a list of one or as one amount; carry-over absent, none or unspent.
      const block = {
        firstYear: 2026 + (seed % 15),
        years: 1,
        budgets: seed % 2 === 0 ? [budget] : budget,
        ...(seed % 3 === 1 && { carryOver: "none" }),
        ...(seed % 3 === 2 && { carryOver: "unspent" }),
      };
      const plainLoaded = loadScenario(writeScenarioFiles(scenario, folder, `plain-${seed}`)).scenario;
      const oneLoaded = loadScenario(writeScenarioFiles(scenario, folder, `one-year-${seed}`, block)).scenario;
      expect(oneLoaded.budget).toBe(budget);
      const [plain, oneYear] = [await solve(plainLoaded), await solve(oneLoaded)];
      expect(DECIDED).toContain(plain.solution.status);
      expect(oneYear.solution.status, `seed ${seed}`).toBe(plain.solution.status);
      expect(oneYear.solution.objective, `seed ${seed}`).toBe(plain.solution.objective);
      expect(projects(oneYear).map(({ site, treatments }) => ({ site, treatments })), `seed ${seed}`).toEqual(projects(plain).map(({ site, treatments }) => ({ site, treatments })));
      expect(figures(oneYear), `seed ${seed}`).toEqual(figures(plain));
      expect(oneYear.totals, `seed ${seed}`).toEqual(plain.totals);
      if (plain.solution.status !== "optimal") continue;
      optimal += 1;
      expect(ruleViolations(plainLoaded, projects(plain)), `seed ${seed}`).toEqual([]);
      expect(programmeViolations(oneYear), `seed ${seed}`).toEqual([]);
      expect(projects(oneYear).every((p) => p.buildYear === block.firstYear)).toBe(true);
      expect(oneYear.years!.map((year) => [year.year, year.budget])).toEqual([[block.firstYear, budget]]);
      expect(oneYear.years![0]!.spend).toBeCloseTo(plain.totals.cost, 6);
    }
    expect(optimal).toBeGreaterThanOrEqual(40);
  });

  it("the same on the Vellmar demo (51 sites, must-fund and never-fund rules, EB baselines) at three budgets", async () => {
    // A one-year list ignores phasing, while a programme's first year cannot build a phased
    // treatment (README, programme conventions); so the relation holds with phasing removed.
    const catalogue = readFileSync("catalogs/demo-catalogue.yaml", "utf8").replace(/^ {4}(#.*\n {4})?phasing:\n( {6}- .*\n)+/gm, "");
    expect(catalogue).not.toMatch(/^ *phasing:/m);
    writeFileSync(join(folder, "demo-catalogue.yaml"), catalogue);
    const demo = readFileSync("scenarios/demo.yaml", "utf8").replace("../catalogs/demo-catalogue.yaml", "demo-catalogue.yaml");
    for (const budget of ["3M", "6.5M", "9.7M"]) {
      const write = (name: string, text: string) => (writeFileSync(join(folder, name), text), join(folder, name));
      const plainText = demo.replace(/^budget: 9\.7M$/m, `budget: ${budget}`);
      const oneText = demo.replace(/^budget: 9\.7M$/m, `programme: { firstYear: 2027, years: 1, budgets: [${budget}] }`);
      expect(oneText).not.toBe(demo);
      const plain = await solve(loadScenario(write(`demo-plain-${budget}.yaml`, plainText)).scenario);
      const oneYear = await solve(loadScenario(write(`demo-one-${budget}.yaml`, oneText)).scenario);
      expect(plain.solution.status).toBe("optimal");
      expect(oneYear.solution.status).toBe("optimal");
      expect(oneYear.solution.objective).toBe(plain.solution.objective);
      expect(projects(oneYear).map(({ site, treatments }) => ({ site, treatments }))).toEqual(projects(plain).map(({ site, treatments }) => ({ site, treatments })));
      expect(oneYear.totals).toEqual(plain.totals);
      expect(programmeViolations(oneYear)).toEqual([]);
    }
  });
});

describe("relaxing a programme never lowers its optimum (seeded programmes of 2-4 years)", () => {
  it("the seeded programmes cover every feature the relations are about", () => {
    const programmes = SEEDS.map(randomProgramme);
    const count = (test: (scenario: Scenario) => boolean) => programmes.filter(test).length;
    for (const years of [2, 3, 4]) expect(count((s) => s.programme!.years === years)).toBeGreaterThan(5);
    expect(count((s) => s.programme!.carryOver === "unspent")).toBeGreaterThan(15);
    expect(count((s) => s.programme!.carryOver === "none")).toBeGreaterThan(15);
    expect(count((s) => s.programme!.costEscalationRate > 0)).toBeGreaterThan(15);
    expect(count((s) => s.programme!.committed.length > 0)).toBeGreaterThan(5);
    expect(count((s) => s.catalogue.treatments.some((t) => t.phasing !== undefined))).toBeGreaterThan(15);
    expect(count((s) => s.sites.some((site) => site.earliestYear !== undefined || site.latestYear !== undefined))).toBeGreaterThan(15);
    expect(count((s) => s.rules.length > 0)).toBeGreaterThan(15);
  });

  it(`raising any one year's budget never lowers the objective (${SEEDS.length} cases)`, async () => {
    const tally: Tally = { compared: 0, strict: 0 };
    for (const seed of SEEDS) {
      const scenario = randomProgramme(seed);
      const programme = scenario.programme!;
      const year = seed % programme.years;
      const raise = Math.round(scenario.budget * [0.1, 0.3, 1][seed % 3]!);
      const budgets = programme.budgets.map((value, y) => (y === year ? value + raise : value));
      const raised = await solve(withProgramme(scenario, { ...programme, budgets }));
      expectNoLower(await basePlan(seed), raised, tally, `seed ${seed}, year ${programme.firstYear + year} +${raise}`);
    }
    expect(tally.compared).toBeGreaterThanOrEqual(40);
    // The relation is not vacuous: in some cases the extra money buys more.
    expect(tally.strict).toBeGreaterThan(0);
  });

  it(`carry-over unspent never does worse than none on the same budgets (${SEEDS.length} cases)`, async () => {
    const tally: Tally = { compared: 0, strict: 0 };
    for (const seed of SEEDS) {
      const scenario = randomProgramme(seed);
      const programme = scenario.programme!;
      const other = await solve(withProgramme(scenario, { ...programme, carryOver: programme.carryOver === "none" ? "unspent" : "none" }));
      const base = await basePlan(seed);
      const [none, unspent] = programme.carryOver === "none" ? [base, other] : [other, base];
      expectNoLower(none, unspent, tally, `seed ${seed}`);
    }
    expect(tally.compared).toBeGreaterThanOrEqual(40);
    expect(tally.strict).toBeGreaterThan(0);
  });

  it(`moving every site's earliest year later never raises the objective (${SEEDS.length} cases)`, async () => {
    const tally: Tally = { compared: 0, strict: 0 };
    let movedSites = 0;
    for (const seed of SEEDS) {
      const scenario = randomProgramme(seed);
      const programme = scenario.programme!;
      const lastYear = programme.firstYear + programme.years - 1;
      const committed = new Set(programme.committed.map((project) => project.site));
      // One or two years later, within the site's window; a committed project keeps its year and its window.
      const sites = scenario.sites.map((site) => {
        if (committed.has(site.id)) return site;
        const earliest = Math.min(site.latestYear ?? lastYear, (site.earliestYear ?? programme.firstYear) + 1 + (seed % 2));
        if (earliest > (site.earliestYear ?? programme.firstYear)) movedSites += 1;
        return { ...site, earliestYear: earliest };
      });
      const later = await solve({ ...scenario, sites });
      expectNoLower(later, await basePlan(seed), tally, `seed ${seed}`);
    }
    expect(movedSites).toBeGreaterThan(SEEDS.length);
    expect(tally.compared).toBeGreaterThanOrEqual(40);
    expect(tally.strict).toBeGreaterThan(0);
  });
});

describe("costEscalationRate: 0 is no escalation", () => {
  it(`loads to the same scenario as no costEscalationRate and plans exactly the same programme (${SEEDS.length} cases)`, async () => {
    let optimal = 0;
    for (const seed of SEEDS) {
      const scenario = randomProgramme(seed);
      const { firstYear, years, budgets, carryOver, committed } = scenario.programme!;
      const block = { firstYear, years, budgets, carryOver, ...(committed.length > 0 && { committed }) };
      const zero = loadScenario(writeScenarioFiles(scenario, folder, `zero-${seed}`, { ...block, costEscalationRate: 0 })).scenario;
      const absent = loadScenario(writeScenarioFiles(scenario, folder, `absent-${seed}`, block)).scenario;
      expect(zero.programme!.costEscalationRate).toBe(0);
      expect(zero).toEqual(absent);
      const [a, b] = [await solve(zero), await solve(absent)];
      expect(DECIDED).toContain(a.solution.status);
      expect(b.solution.status).toBe(a.solution.status);
      expect(b.solution.objective).toBe(a.solution.objective);
      expect(projects(b)).toEqual(projects(a));
      expect(figures(b)).toEqual(figures(a));
      expect(b.years).toEqual(a.years);
      expect(b.totals).toEqual(a.totals);
      if (a.solution.status !== "optimal") continue;
      optimal += 1;
      // The independent reading prices every build year at the unescalated catalogue cost.
      expect(programmeViolations(a), `seed ${seed}`).toEqual([]);
    }
    expect(optimal).toBeGreaterThanOrEqual(40);
  });
});
