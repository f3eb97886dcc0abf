import { describe, expect, it } from "vitest";
import { incrementalBenefitCost } from "../../src/analysis/incrementalBenefitCost.js";
import { syntheticAlternative } from "./syntheticPlan.js";

// An alternative with given benefit PV and lifecycle cost PV (capital = lifecycle here).
const alt = (benefit: number, cost: number, name: string) => syntheticAlternative("S", { cost, lifecycle: cost, ksi: 1, benefit, treatments: [name] }, 0);

describe("incrementalBenefitCost", () => {
  it("reproduces the published two-option example: Land Transport NZ, Economic Evaluation Manual (2007), vol. 1 §2.10", () => {
    // Source (read via the search tool, smartmovez.org.nz copy of the EEM §2.10): option A benefits 3000, cost 400 (BCR 7.5);
    // option B benefits 4000, cost 1000 (BCR 4.0); incremental BCR of B over A = (4000 − 3000)/(1000 − 400) = 1.7 (rounded there).
    const analysis = incrementalBenefitCost([alt(4000, 1000, "B"), alt(3000, 400, "A")]);
    expect(analysis.steps).toHaveLength(1);
    expect(analysis.steps[0]!.from).toBe(1);
    expect(analysis.steps[0]!.to).toBe(0);
    expect(analysis.steps[0]!.incrementalBcRatio).toBeCloseTo(1000 / 600, 12);
    expect(analysis.steps[0]!.incrementalBcRatio.toFixed(1)).toBe("1.7");
    // ΔB/ΔC > 1, so the challenger–defender procedure prefers the dearer option B.
    expect(analysis.preferred).toBe(0);
  });

  it("follows the HSM Part B Chapter 7 challenger–defender procedure (steps from memory) on a constructed case", () => {
    // Hand-computed. Costs 100, 200, 250, 400; benefits 300, 500, 480, 560.
    //  - C (250, 480) benefits less than B (200, 500): dominated, off the ladder.
    //  - Ladder: A→B ΔB/ΔC = 200/100 = 2.0; B→D = 60/200 = 0.3.
    //  - Procedure: A (B/C 3.0) defends; B beats it (2.0 > 1); C vs B: ΔB < 0, B stays; D vs B: 0.3 < 1, B stays → B.
    const alternatives = [alt(300, 100, "A"), alt(500, 200, "B"), alt(480, 250, "C"), alt(560, 400, "D")];
    const analysis = incrementalBenefitCost(alternatives);
    expect(analysis.dominated).toEqual([2]);
    expect(analysis.steps.map((s) => [s.from, s.to, s.incrementalBcRatio])).toEqual([
      [0, 1, 2],
      [1, 3, 0.3],
    ]);
    expect(analysis.preferred).toBe(1);
  });

  it("leaves out alternatives with B/C below 1 from the preferred choice, and finds none when all are below 1", () => {
    expect(incrementalBenefitCost([alt(50, 100, "A"), alt(300, 200, "B")]).preferred).toBe(1);
    expect(incrementalBenefitCost([alt(50, 100, "A"), alt(90, 200, "B")]).preferred).toBeNull();
  });
});
