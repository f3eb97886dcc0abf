import { describe, expect, it } from "vitest";
import { preparePlan } from "../../../src/analysis/preparePlan.js";
import { analyseUncertainty } from "../../../src/analysis/uncertainty/analyseUncertainty.js";
import { loadScenario } from "../../../src/io/loadScenario.js";
import type { Scenario } from "../../../src/model/types.js";
import { constructedScenario } from "./constructedScenario.js";

const baseOptions = { seed: 2027, threads: 1, solveOptions: {} } as const;

function withoutStandardErrors(scenario: Scenario): Scenario {
  return {
    ...scenario,
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
    expect(result.effectsWithStandardError).toBe(0);
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
    const result = await analyseUncertainty(preparePlan(scenario), { ...baseOptions, draws: 300, sampleBaselines: false, budget: scenario.budget });
    const bySite = new Map(result.summary.selections.map((s) => [s.site, s]));
    expect(bySite.get("A")!.class).toBe("core");
    expect(bySite.get("A")!.probability).toBe(1);
    expect(bySite.get("B")!.class).toBe("marginal");
    // 300 draws: standard error of the share is sqrt(0.7 × 0.3 / 300) = 0.026; allow 4 of them.
    expect(Math.abs(bySite.get("B")!.probability - 0.7)).toBeLessThan(4 * 0.026);
    expect(bySite.get("C")!.probability).toBeCloseTo(1 - bySite.get("B")!.probability, 12);
    expect(result.effectsWithStandardError).toBe(1);
    expect(result.effectsWithoutStandardError).toBe(2);
    expect(result.summary.regret.mean).toBeGreaterThan(0);
  });

  it("draws baselines around the observed rate: the chosen list's mean KSI avoided is the plan's within sampling error", async () => {
    // Certain CMFs, so only the Poisson-gamma baseline varies; Gamma(n, T) has mean n/T (the observed rate).
    const scenario = constructedScenario(
      [
        { id: "A", fatalAndSerious: 16, cmf: 0.6, standardError: 0 },
        { id: "B", fatalAndSerious: 9, cmf: 0.8, standardError: 0 },
      ],
      2,
    );
    const draws = 400;
    const result = await analyseUncertainty(preparePlan(scenario), { ...baseOptions, draws, sampleBaselines: true, budget: scenario.budget });
    const planKsi = result.plan.totals.ksiAvoided;
    // KSI avoided = 10 years × (0.4 × rateA + 0.2 × rateB); Var(rate) = n / T² (gamma): hand-computed sd below.
    const sd = 10 * Math.sqrt(0.4 ** 2 * (16 / 25) + 0.2 ** 2 * (9 / 25));
    expect(planKsi).toBeCloseTo(10 * (0.4 * 16 / 5 + 0.2 * 9 / 5), 9);
    expect(Math.abs(result.summary.planKsiAvoided.mean - planKsi)).toBeLessThan((4 * sd) / Math.sqrt(draws));
    expect(result.summary.planKsiAvoided.p95 - result.summary.planKsiAvoided.p5).toBeGreaterThan(2 * sd);
  });
});
