import { describe, expect, it } from "vitest";
import type { ComparisonSiteCounts, TreatedSiteCounts } from "../../src/model/beforeAfterTypes.js";
import { comparisonGroupBeforeAfter } from "../../src/model/comparisonGroupBeforeAfter.js";

const counts = (site: string, beforeYears: number, afterYears: number, beforeObserved: number, afterObserved: number) => ({ site, beforeYears, afterYears, beforeObserved, afterObserved });

describe("comparisonGroupBeforeAfter (Hauer 1997, ch. 9)", () => {
  const treated: TreatedSiteCounts[] = [counts("T1", 4, 2, 20, 6), counts("T2", 3, 3, 10, 7)];
  const comparison: ComparisonSiteCounts[] = [counts("C1", 4, 2, 40, 22), counts("C2", 4, 3, 60, 48)];

  it("matches a hand computation", () => {
    // By hand: M = 100 over 8 site-years, N = 70 over 5: rate ratio (70/5) / (100/8) = 14 / 12.5 = 1.12;
    // Hauer's small-sample correction: r_C = 1.12 / (1 + 1/100) = 1.108911.
    // Treated before on the after periods' lengths: 20 × 2/4 + 10 × 3/3 = 20; π̂ = 1.108911 × 20 = 22.178218.
    // Var(π̂)/π̂² = (20 × 0.25 + 10 × 1) / 20² + 1/100 + 1/70 = 0.0375 + 0.01 + 0.014286 = 0.061786.
    // λ = 13: θ = (13 / 22.178218) / 1.061786 = 0.586158 / 1.061786 = 0.552052;
    // Var(θ) = 0.552052² × (1/13 + 0.061786) / 1.061786² = 0.037496; SE = 0.193640.
    const estimate = comparisonGroupBeforeAfter(treated, comparison)!;
    expect(estimate.expectedAfter).toBeCloseTo(22.178218, 6);
    expect(estimate.expectedAfterVariance / estimate.expectedAfter ** 2).toBeCloseTo(0.061786, 6);
    expect(estimate.observedAfter).toBe(13);
    expect(estimate.theta).toBeCloseTo(0.552052, 6);
    expect(estimate.standardError).toBeCloseTo(0.19364, 5);
    expect(estimate.lower95).toBeCloseTo(0.552052 - 1.96 * 0.19364, 4);
    expect(estimate).toMatchObject({ method: "comparison-group", sites: 2 });
  });

  it("with equal periods everywhere the treated term is 1/K", () => {
    // K = 30, M = 100, N = 100 (no trend): r_C = 1/1.01; Var/π̂² = 1/30 + 1/100 + 1/100.
    const estimate = comparisonGroupBeforeAfter([counts("T", 3, 3, 30, 20)], [counts("C", 3, 3, 100, 100)])!;
    expect(estimate.expectedAfter).toBeCloseTo(30 / 1.01, 10);
    expect(estimate.expectedAfterVariance / estimate.expectedAfter ** 2).toBeCloseTo(1 / 30 + 0.02, 12);
  });

  it("doubling every comparison count leaves θ almost unchanged and narrows the interval", () => {
    const doubled = comparison.map((site) => ({ ...site, beforeObserved: 2 * site.beforeObserved, afterObserved: 2 * site.afterObserved }));
    const base = comparisonGroupBeforeAfter(treated, comparison)!;
    const more = comparisonGroupBeforeAfter(treated, doubled)!;
    expect(Math.abs(more.theta - base.theta)).toBeLessThan(0.02);
    expect(more.standardError).toBeLessThan(base.standardError);
  });

  it("null when K, M, N or λ is 0, or there are no sites", () => {
    expect(comparisonGroupBeforeAfter([counts("T", 3, 3, 0, 5)], comparison)).toBeNull();
    expect(comparisonGroupBeforeAfter(treated, [counts("C", 3, 3, 0, 5)])).toBeNull();
    expect(comparisonGroupBeforeAfter(treated, [counts("C", 3, 3, 5, 0)])).toBeNull();
    expect(comparisonGroupBeforeAfter([counts("T", 3, 3, 10, 0)], comparison)).toBeNull();
    expect(comparisonGroupBeforeAfter([], comparison)).toBeNull();
    expect(comparisonGroupBeforeAfter(treated, [])).toBeNull();
  });

  it("refuses a period of no length", () => {
    expect(() => comparisonGroupBeforeAfter(treated, [counts("C", 0, 3, 5, 5)])).toThrow(RangeError);
  });
});
