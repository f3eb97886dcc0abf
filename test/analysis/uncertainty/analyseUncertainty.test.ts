import { describe, expect, it } from "vitest";
import { preparePlan } from "../../../src/analysis/preparePlan.js";
import { analyseUncertainty } from "../../../src/analysis/uncertainty/analyseUncertainty.js";
import { drawFigures } from "../../../src/analysis/uncertainty/drawFigures.js";
import { buildDrawTables } from "../../../src/analysis/uncertainty/drawTables.js";
import { loadScenario } from "../../../src/io/loadScenario.js";
import { sumCrashMatrix } from "../../../src/model/crashMatrix.js";
import { drawRandomSource } from "../../../src/model/random/drawRandomSource.js";
import { empiricalBayesCrashesPerYear } from "../../../src/model/empiricalBayesCrashesPerYear.js";
import { empiricalBayesPosterior } from "../../../src/model/empiricalBayesPosterior.js";
import { windowYears } from "../../../src/model/siteBaselines.js";
import type { Scenario } from "../../../src/model/types.js";
import { constructedScenario } from "./constructedScenario.js";

const baseOptions = { seed: 2027, threads: 1, solveOptions: {} } as const;

// Every CMF held exact: no standard errors, and no assumed CV for effects without one.
function withoutStandardErrors(scenario: Scenario): Scenario {
  return {
    ...scenario,
    uncertainty: { assumedCmfCv: "off" },
    catalogue: {
      ...scenario.catalogue,
      treatments: scenario.catalogue.treatments.map((t) => ({ ...t, effects: t.effects.map((e) => ({ ...e, standardError: 0 })) })),
    },
  };
}

describe("analyseUncertainty", () => {
  it("with no standard errors and fixed baselines, every selection probability is 0 or 1 and matches the plan list", async () => {
    const { scenario } = loadScenario("scenarios/demo.yaml");
    const prepared = preparePlan(withoutStandardErrors(scenario));
    const result = await analyseUncertainty(prepared, { ...baseOptions, draws: 4, sampleBaselines: false, budget: scenario.budget });
    expect(result.effects.withStandardError + result.effects.withAssumedCv).toBe(0);
    expect(result.effects.heldExact).toBe(result.effects.total);
    const { selections } = result.summary;
    const planSet = new Set(result.plan.funded.map((p) => `${p.entry.site.id}#${p.index}`));
    expect(planSet.size).toBeGreaterThan(10);
    for (const selection of selections) {
      expect([0, 1]).toContain(selection.probability);
      expect(selection.probability === 1).toBe(planSet.has(`${selection.site}#${selection.alternativeIndex}`));
    }
    expect(selections.filter((s) => s.probability === 1).length).toBe(planSet.size);
    // The chosen list is the best list in every draw, so it loses nothing.
    expect(result.summary.regret.mean).toBeCloseTo(0, 9);
    expect(result.summary.planKsiAvoided.p5).toBeCloseTo(result.plan.totals.ksiAvoided, 9);
    expect(result.summary.planKsiAvoided.p95).toBeCloseTo(result.plan.totals.ksiAvoided, 9);
  });

  it("puts a project with a certain CMF in the core and one with a very uncertain CMF among the marginal", async () => {
    // Two can be funded. A (certain, CMF 0.7) and B (uncertain: mean 0.7, SE 0.35) tie at the point
    // estimate and beat C (certain, CMF 0.8). B is best whenever its drawn CMF < 0.8:
    // P = Phi((ln 0.8 − mu)/sigma) with sigma² = ln 1.25, mu = ln 0.7 − sigma²/2, about 0.70 (hand-computed).
    const scenario = constructedScenario(
      [
        { id: "A", fatalAndSerious: 20, cmf: 0.7, standardError: 0 },
        { id: "B", fatalAndSerious: 20, cmf: 0.7, standardError: 0.35 },
        { id: "C", fatalAndSerious: 20, cmf: 0.8, standardError: 0 },
      ],
      2,
    );
    const result = await analyseUncertainty(preparePlan({ ...scenario, uncertainty: { assumedCmfCv: "off" } }), { ...baseOptions, draws: 300, sampleBaselines: false, budget: scenario.budget });
    const bySite = new Map(result.summary.selections.map((s) => [s.site, s]));
    expect(bySite.get("A")!.class).toBe("core");
    expect(bySite.get("A")!.probability).toBe(1);
    expect(bySite.get("B")!.class).toBe("marginal");
    // 300 draws: standard error of the share is sqrt(0.7 × 0.3 / 300) = 0.026; allow 4 of them.
    expect(Math.abs(bySite.get("B")!.probability - 0.7)).toBeLessThan(4 * 0.026);
    expect(bySite.get("C")!.probability).toBeCloseTo(1 - bySite.get("B")!.probability, 12);
    expect(result.effects).toEqual({ assumedCmfCv: "off", total: 3, withStandardError: 1, withAssumedCv: 0, heldExact: 2 });
    expect(result.summary.regret.mean).toBeGreaterThan(0);
  });

  it("draws observed baselines from the Jeffreys posterior: the chosen list's mean K+A avoided is (n + 1/2)/T per severity, within sampling error", async () => {
    // Certain CMFs, so only the baselines vary. Each site saw n serious (A) crashes and no fatal (K)
    // ones in T = 5 years; under the Jeffreys prior the A rate is Gamma(n + 1/2, T) and the K rate
    // Gamma(1/2, T) (conjugate gamma–Poisson; Gelman et al., Bayesian Data Analysis, 3rd ed., from
    // memory), spread over the site's K+A crash-type mix (all angle), where its treatment acts.
    const scenario = constructedScenario(
      [
        { id: "A", fatalAndSerious: 16, cmf: 0.6, standardError: 0 },
        { id: "B", fatalAndSerious: 9, cmf: 0.8, standardError: 0 },
      ],
      2,
    );
    const draws = 400;
    const prepared = preparePlan({ ...scenario, uncertainty: { assumedCmfCv: "off" } });
    const result = await analyseUncertainty(prepared, { ...baseOptions, draws, sampleBaselines: true, budget: scenario.budget });
    const planKsi = result.plan.totals.ksiAvoided;
    // The plan keeps the observed rate n/T: 10 years × (0.4 × 16/5 + 0.2 × 9/5).
    expect(planKsi).toBeCloseTo(10 * (0.4 * 16 / 5 + 0.2 * 9 / 5), 9);
    // The draws: K+A rate mean (n + 1/2 + 1/2)/T, variance (n + 1)/T² (gamma: shape/rate, shape/rate²).
    const mean = 10 * (0.4 * (17 / 5) + 0.2 * (10 / 5));
    const sd = 10 * Math.sqrt(0.4 ** 2 * (17 / 25) + 0.2 ** 2 * (10 / 25));
    expect(Math.abs(result.summary.planKsiAvoided.mean - mean)).toBeLessThan((4 * sd) / Math.sqrt(draws));
    expect(result.summary.planKsiAvoided.mean).toBeGreaterThan(planKsi);
    expect(result.summary.planKsiAvoided.p95 - result.summary.planKsiAvoided.p5).toBeGreaterThan(2 * sd);
    expect(result.baselines).toEqual({ observed: 2, empiricalBayes: 0, fixed: 0 });
  });
});

describe("uncertainty draws with Empirical Bayes baselines", () => {
  it("draws each EB site from its gamma posterior: its K+A avoided averages the plan's within the standard error of relative variance 1/shape", async () => {
    // With CMFs exact, an alternative's K+A avoided is linear in the baseline, so drawn / planned is
    // λ / E[λ] with λ ~ Gamma(1/k + n, 1/(kμ) + T): mean 1 and variance 1/shape (Hauer 1997, ch. 7; HSM 2010 Part C, App. A).
    const { scenario } = loadScenario("scenarios/demo-eb.yaml");
    const prepared = preparePlan(withoutStandardErrors(scenario));
    const years = windowYears(scenario);
    const spfs = new Map(scenario.catalogue.performanceFunctions.map((spf) => [spf.id, spf]));
    const draws = 400;
    const tables = buildDrawTables(prepared, true);
    const sums = prepared.sites.map(() => 0);
    for (let draw = 0; draw < draws; draw += 1) {
      const drawn = drawFigures(tables, prepared.scenario.economics, drawRandomSource(99, draw));
      prepared.sites.forEach((entry, index) => {
        const planned = entry.alternatives[0];
        if (planned !== undefined && planned.ksiAvoided > 0) sums[index]! += drawn.ksiAvoided[tables.offsets[index]!]! / planned.ksiAvoided;
      });
    }
    let checked = 0;
    prepared.sites.forEach((entry, index) => {
      if (entry.alternatives[0] === undefined || !(entry.alternatives[0].ksiAvoided > 0)) return;
      expect(prepared.baselines[index]!.method).toBe("empirical-bayes");
      const estimate = empiricalBayesCrashesPerYear(entry.site, spfs.get(entry.site.performanceFunction!)!, years);
      const { shape } = empiricalBayesPosterior(estimate.predictedPerYear, estimate.overdispersion, sumCrashMatrix(entry.site.crashes), years);
      // Five standard errors of a mean of `draws` ratios.
      expect(Math.abs(sums[index]! / draws - 1)).toBeLessThan(5 * Math.sqrt(1 / shape / draws));
      checked += 1;
    });
    expect(checked).toBeGreaterThan(30);
  });
});
