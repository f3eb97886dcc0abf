// The workbook marks an option dominated when another option at the same site costs no more and
// is worth no less, strictly better in one (Pareto dominance, common practice). The one-pass
// sort must agree with the definition checked pair by pair.
import { describe, expect, it } from "vitest";
import { dominatedFlags } from "../../src/analysis/workbookAlternatives.js";
import { seededRandom } from "../../scripts/seededRandom.js";

function byDefinition(options: readonly { cost: number; value: number }[]): boolean[] {
  return options.map((option, index) =>
    options.some((other, j) => j !== index && other.cost <= option.cost && other.value >= option.value && (other.cost < option.cost || other.value > option.value)),
  );
}

describe("dominatedFlags", () => {
  it("agrees with the pairwise definition on 2,000 random sets, with ties in cost and value", () => {
    const random = seededRandom(16);
    for (let trial = 0; trial < 2000; trial++) {
      const count = Math.floor(random() * 8);
      // Small integer grids make equal costs, equal values and exact duplicates common.
      const options = Array.from({ length: count }, () => ({ cost: Math.floor(random() * 5), value: Math.floor(random() * 5) }));
      expect(dominatedFlags(options), JSON.stringify(options)).toEqual(byDefinition(options));
    }
  });

  it("keeps exact duplicates, since neither is strictly better", () => {
    expect(dominatedFlags([{ cost: 3, value: 2 }, { cost: 3, value: 2 }])).toEqual([false, false]);
  });

  it("flags a dearer option worth the same, and a same-cost option worth less", () => {
    expect(dominatedFlags([{ cost: 5, value: 2 }, { cost: 3, value: 2 }, { cost: 3, value: 1 }])).toEqual([true, false, true]);
  });
});
