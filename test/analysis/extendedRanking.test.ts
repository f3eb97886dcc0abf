import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { extendedRanking } from "../../src/analysis/extendedRanking.js";
import { planProgramme, type PlanResult } from "../../src/analysis/planProgramme.js";
import { preparePlan } from "../../src/analysis/preparePlan.js";
import { traditionalRanking } from "../../src/analysis/traditionalRanking.js";
import { checkSolution } from "../../src/solver/index.js";
import { randomScenario } from "./randomScenario.js";
import { ruleViolations } from "./scenarioRules.js";
import { randomSites, syntheticPlan } from "./syntheticPlan.js";

const extend = (plan: PlanResult) => extendedRanking(plan, traditionalRanking(plan));

/** No step of the extended ranking's kind is left that fits: more benefit, no less capital, within the money left. */
function noStepFits(plan: PlanResult, choice: readonly (number | null)[], spend: number): boolean {
  const left = plan.budget - spend;
  return plan.prepared.sites.every((entry, g) => {
    const current = choice[g] === null ? null : entry.alternatives[choice[g]!]!;
    return entry.alternatives.every((alternative) => {
      const extraCost = alternative.cost - (current?.cost ?? 0);
      return !(alternative.benefitPV > (current?.benefitPV ?? 0) && extraCost >= 0 && extraCost <= left);
    });
  });
}

describe("extendedRanking: the B/C ranking carried on by incremental B/C", () => {
  it("upgrades a funded site with the money the ranking left, on a hand-built case", async () => {
    // Benefit = 1000 × KSI, lifecycle = capital, so B/C = 1000 × KSI / cost (worked by hand).
    // Best B/C: A cheap (10 for 6, 600), B (60 for 27, 450), C (40 for 14, 350). Budget 90: the ranking takes A cheap and B
    // (70, 33 KSI); C (40) does not fit the 20 left. Upgrading A costs 15 more for 5 KSI (ΔB/ΔC = 5000/15 = 333.3) and fits:
    // 85 spent, 38 KSI, which is also the optimum here (A dear + B; no other pair of sites fits 90).
    const plan = await planProgramme(
      syntheticPlan(
        [
          { id: "A", options: [{ cost: 10, ksi: 6 }, { cost: 25, ksi: 11 }] },
          { id: "B", options: [{ cost: 60, ksi: 27 }] },
          { id: "C", options: [{ cost: 40, ksi: 14 }] },
        ],
        90,
      ),
    );
    const ranking = traditionalRanking(plan);
    expect(ranking.rankingTotals.cost).toBe(70);
    const extended = extendedRanking(plan, ranking);
    expect(extended.steps).toEqual([{ site: "A", fromTreatments: ["t0"], toTreatments: ["t1"], extraCost: 15, extraLifecycleCostPV: 15, extraBenefitPV: 5000, incrementalBcRatio: 5000 / 15 }]);
    expect(extended.totals.cost).toBe(85);
    expect(extended.totals.ksiAvoided).toBe(38);
    expect(extended.extraKsiAvoided).toBe(0);
    expect(extended.sites).toEqual(["A", "B"]);
    expect(extended.meetsRules).toBe(true);
  });

  it("funds a skipped site with a cheaper alternative that fits, from doing nothing", async () => {
    // A (30 for 18, B/C 600) is funded; B's best B/C is its dear option (50 for 20, 400), which does not fit the 30 left.
    // Its cheap option (20 for 4, B/C 200) fits and is taken from doing nothing: 50 spent, 22 KSI; B's upgrade then needs 30 > 10.
    const plan = await planProgramme(
      syntheticPlan(
        [
          { id: "A", options: [{ cost: 30, ksi: 18 }] },
          { id: "B", options: [{ cost: 20, ksi: 4 }, { cost: 50, ksi: 20 }] },
        ],
        60,
      ),
    );
    const extended = extend(plan);
    expect(extended.steps.map((step) => [step.site, step.fromTreatments, step.toTreatments, step.incrementalBcRatio])).toEqual([["B", null, ["t0"], 200]]);
    expect(extended.totals.cost).toBe(50);
    expect(extended.totals.ksiAvoided).toBe(22);
  });

  it("takes the steepest step first and also steps with incremental B/C below 1", async () => {
    // A: 10 for benefit 100 (B/C 10); its upgrade adds 50 for 40 more benefit (ΔB/ΔC 0.8).
    // B: 10 for benefit 60 (B/C 6); its upgrade adds 20 for 30 more (ΔB/ΔC 1.5). Budget 100: both cheap options (20),
    // then B's upgrade (1.5 > 0.8; 40 spent), then A's (0.8; 90 spent): incremental analysis judges each increment by its own ratio.
    const plan = await planProgramme(
      syntheticPlan(
        [
          { id: "A", options: [{ cost: 10, ksi: 1, benefit: 100 }, { cost: 60, ksi: 2, benefit: 140 }] },
          { id: "B", options: [{ cost: 10, ksi: 1, benefit: 60 }, { cost: 30, ksi: 2, benefit: 90 }] },
        ],
        100,
      ),
    );
    const extended = extend(plan);
    expect(extended.steps.map((step) => [step.site, step.incrementalBcRatio])).toEqual([["B", 1.5], ["A", 0.8]]);
    expect(extended.totals.cost).toBe(90);
  });

  it("stays within the budget, is feasible and leaves no step that fits, on seeded random instances", async () => {
    let instances = 0;
    let extendedFurther = 0;
    for (let seed = 301; seed <= 360; seed += 1) {
      const sites = randomSites(seed, 8, 4);
      const total = sites.reduce((t, s) => t + Math.max(...s.options.map((o) => o.cost)), 0);
      const plan = await planProgramme(syntheticPlan(sites, Math.round(total * (0.2 + 0.1 * (seed % 5)))));
      const ranking = traditionalRanking(plan);
      const extended = extendedRanking(plan, ranking);
      expect(extended.totals.cost).toBeLessThanOrEqual(plan.budget);
      expect(checkSolution(plan.programme, extended.choice).feasible).toBe(true);
      expect(extended.meetsRules).toBe(true);
      expect(noStepFits(plan, extended.choice, extended.totals.cost)).toBe(true);
      // It only adds to the ranking's list, and being feasible it cannot beat the optimum.
      expect(extended.totals.cost).toBeGreaterThanOrEqual(ranking.rankingTotals.cost);
      expect(extended.totals.benefitPV).toBeGreaterThanOrEqual(ranking.rankingTotals.benefitPV);
      expect(extended.extraKsiAvoided).toBeGreaterThanOrEqual(-1e-9);
      if (extended.steps.length > 0) extendedFurther += 1;
      instances += 1;
    }
    expect(instances).toBe(60);
    // The extension does something on many instances: the plain ranking often stops short of the budget.
    expect(extendedFurther).toBeGreaterThan(10);
  });

  it("on random scenarios with policy rules: within the budget, one alternative a site, rules reported truly (300 runs)", async () => {
    let runs = 0;
    let breaksRules = 0;
    await fc.assert(
      fc.asyncProperty(randomScenario, async (scenario) => {
        const plan = await planProgramme(preparePlan(scenario));
        const extended = extend(plan);
        runs += 1;
        expect(extended.totals.cost).toBeLessThanOrEqual(plan.budget * (1 + 1e-9));
        expect(extended.choice).toHaveLength(plan.prepared.sites.length);
        extended.choice.forEach((a, g) => {
          if (a !== null) expect(a).toBeLessThan(plan.prepared.sites[g]!.alternatives.length);
        });
        expect(noStepFits(plan, extended.choice, extended.totals.cost)).toBe(true);
        // Whether it meets the rules, read independently of buildProgramme (scenarioRules.ts).
        const picks = extended.choice.flatMap((a, g) => (a === null ? [] : [{ site: plan.prepared.sites[g]!.site.id, treatments: plan.prepared.sites[g]!.alternatives[a]!.treatments }]));
        expect(extended.meetsRules).toBe(ruleViolations(scenario, picks, plan.budget).length === 0);
        if (!extended.meetsRules) breaksRules += 1;
      }),
      { numRuns: 300, seed: 20270412 },
    );
    expect(runs).toBe(300);
    // The rules are what a ranking ignores: some runs must show it.
    expect(breaksRules).toBeGreaterThan(0);
  });
});
