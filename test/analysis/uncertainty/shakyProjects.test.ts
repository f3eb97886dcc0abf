import { describe, expect, it } from "vitest";
import { planProgramme } from "../../../src/analysis/planProgramme.js";
import { preparePlan } from "../../../src/analysis/preparePlan.js";
import { analyseUncertainty } from "../../../src/analysis/uncertainty/analyseUncertainty.js";
import type { DrawOutcome } from "../../../src/analysis/uncertainty/evaluateDraw.js";
import { shakyProjects } from "../../../src/analysis/uncertainty/shakyProjects.js";
import type { SolveStatus } from "../../../src/solver/index.js";
import { syntheticPlan } from "../syntheticPlan.js";
import { constructedScenario } from "./constructedScenario.js";

/** Draw outcomes with the given best lists; only `status` and `choice` matter to shakyProjects. */
function outcomes(lists: readonly (readonly (number | null)[])[], status: SolveStatus = "optimal"): DrawOutcome[] {
  return lists.map((choice, draw) => ({ draw, status, choice, optimumObjective: 0, planKsiAvoided: 0, planBenefitPV: 0, planLifecycleCostPV: 0, planObjective: 0, planFeasible: true }));
}

const repeat = (times: number, choice: readonly (number | null)[]) => Array.from({ length: times }, () => choice);

describe("shakyProjects", () => {
  it("flags funded projects in fewer than half the best lists, largest cost first, with the alternatives whose share rises most without them", async () => {
    // Sites A (500), B (100, or a cheaper 60), C (200), D (100); budget 600: the plan funds A and B's first option.
    const plan = await planProgramme(
      syntheticPlan(
        [
          { id: "A", options: [{ cost: 500, ksi: 10 }] },
          { id: "B", options: [{ cost: 100, ksi: 6 }, { cost: 60, ksi: 5 }] },
          { id: "C", options: [{ cost: 200, ksi: 4 }] },
          { id: "D", options: [{ cost: 100, ksi: 3 }] },
        ],
        600,
      ),
    );
    expect(plan.solution.choice).toEqual([0, 0, null, null]);
    const draws = [
      ...repeat(2, [0, 0, null, null]),
      ...repeat(2, [null, 0, 0, 0]),
      ...repeat(2, [0, 1, null, null]),
      ...repeat(3, [null, 1, 0, null]),
      ...repeat(1, [null, null, 0, 0]),
    ];
    // An unsolved draw counts for nothing.
    const shaky = shakyProjects(plan, [...outcomes(draws), ...outcomes([[null, null, null, null]], "infeasible")]);
    // Worked by hand: A is in 4 of 10 best lists, B's first option in 4 of 10; A costs more, so it comes first.
    expect(shaky.map((s) => [s.site, s.probability, s.drawsWithout])).toEqual([
      ["A", 0.4, 6],
      ["B", 0.4, 6],
    ]);
    // Without A (6 draws): C in 6, D in 3, B's cheaper option in 3; with A (4 draws): C 0, D 0, B's cheaper 2.
    // Rises: C 1, D 0.5, B's cheaper 0 (not a replacement). C (200) does not cover A's 500, so D follows.
    expect(shaky[0]!.replacements.map((r) => [r.site, r.alternativeIndex, r.shareOfDrawsWithout, r.shareOfDrawsWith])).toEqual([
      ["C", 0, 1, 0],
      ["D", 0, 0.5, 0],
    ]);
    // Without B's first option (6 draws): its cheaper option in 5, C in 4, D in 1; with it (4 draws): 0, 2, 2.
    // Rises 5/6, 4/6 − 2/4 = 1/6, and negative for D; the cheaper option (60) does not cover 100, C does.
    const b = shaky[1]!.replacements;
    expect(b.map((r) => [r.site, r.alternativeIndex])).toEqual([
      ["B", 1],
      ["C", 0],
    ]);
    expect(b[0]!.shareOfDrawsWithout).toBeCloseTo(5 / 6, 12);
    expect(b[1]!.shareOfDrawsWithout).toBeCloseTo(4 / 6, 12);
    expect(b[1]!.shareOfDrawsWith).toBeCloseTo(0.5, 12);
  });

  it("ranks by the share without the project when no draw selects it, and flags nothing when no draw was solved", async () => {
    const plan = await planProgramme(syntheticPlan([{ id: "A", options: [{ cost: 5, ksi: 5 }] }, { id: "B", options: [{ cost: 5, ksi: 4 }] }], 5));
    expect(plan.solution.choice).toEqual([0, null]);
    const shaky = shakyProjects(plan, outcomes([...repeat(3, [null, 0]), [null, null]]));
    expect(shaky).toHaveLength(1);
    expect(shaky[0]!.probability).toBe(0);
    expect(shaky[0]!.replacements.map((r) => [r.site, r.shareOfDrawsWithout, r.shareOfDrawsWith])).toEqual([["B", 0.75, null]]);
    expect(shakyProjects(plan, outcomes([[null, null]], "not-solved"))).toEqual([]);
  });

  it("finds the project a rival with an uncertain CMF beats in most draws, and names that rival as its replacement", async () => {
    // Two of three can be funded. A (CMF 0.6) and B (0.7) are certain; C's CMF has mean 0.71 and SE 0.35, so
    // the plan funds A and B, but C beats B whenever its draw is below 0.7: P = Phi((ln 0.7 − mu)/sigma) with
    // sigma² = ln(1 + (0.35/0.71)²), mu = ln 0.71 − sigma²/2, about 0.580 (hand-computed). B is in about 42%.
    const scenario = constructedScenario(
      [
        { id: "A", fatalAndSerious: 20, cmf: 0.6, standardError: 0 },
        { id: "B", fatalAndSerious: 20, cmf: 0.7, standardError: 0 },
        { id: "C", fatalAndSerious: 20, cmf: 0.71, standardError: 0.35 },
      ],
      2,
    );
    const draws = 300;
    const result = await analyseUncertainty(preparePlan({ ...scenario, uncertainty: { assumedCmfCv: "off" } }), {
      draws,
      seed: 2027,
      threads: 1,
      sampleBaselines: false,
      budget: scenario.budget,
      solveOptions: {},
    });
    const { shaky } = result.summary;
    expect(shaky.map((s) => s.site)).toEqual(["B"]);
    // 300 draws: standard error of the share sqrt(0.42 × 0.58 / 300) = 0.028; allow 4 of them.
    expect(Math.abs(shaky[0]!.probability - 0.42)).toBeLessThan(4 * 0.028);
    expect(shaky[0]!.replacements.map((r) => [r.site, r.shareOfDrawsWithout, r.shareOfDrawsWith])).toEqual([["C", 1, 0]]);
  });
});
