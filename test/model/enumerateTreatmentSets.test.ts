import { describe, expect, it } from "vitest";
import { enumerateTreatmentSets } from "../../src/model/enumerateTreatmentSets.js";
import { treatment } from "./fixtures.js";

const ids = (sets: { id: string }[][]) => sets.map((set) => set.map((t) => t.id).join("+"));

describe("enumerateTreatmentSets", () => {
  const a = treatment({ id: "a" });
  const b = treatment({ id: "b", exclusiveGroup: "signal" });
  const c = treatment({ id: "c", exclusiveGroup: "signal" });
  const d = treatment({ id: "d" });

  it("lists every non-empty combination up to the limit, smallest first", () => {
    // 4 candidates, 2 of one exclusive group: C(4,1) + C(4,2) - 1 + C(4,3) - 2 = 4 + 5 + 2 = 11.
    const sets = enumerateTreatmentSets([a, b, c, d], { maxTreatments: 3 });
    expect(ids(sets)).toEqual(["a", "b", "c", "d", "a+b", "a+c", "a+d", "b+d", "c+d", "a+b+d", "a+c+d"]);
  });
  it("never puts two treatments of one exclusive group together", () => {
    const sets = enumerateTreatmentSets([a, b, c, d], { maxTreatments: 4 });
    expect(sets.every((set) => set.filter((t) => t.exclusiveGroup === "signal").length <= 1)).toBe(true);
  });
  it("honours the limit on treatments per site", () => {
    expect(enumerateTreatmentSets([a, b, d], { maxTreatments: 1 })).toHaveLength(3);
  });
  it("keeps only supersets of must-fund treatments and drops never-fund ones", () => {
    expect(ids(enumerateTreatmentSets([a, b, c, d], { maxTreatments: 3, required: ["d"] }))).toEqual(["d", "a+d", "b+d", "c+d", "a+b+d", "a+c+d"]);
    expect(ids(enumerateTreatmentSets([a, b, c, d], { maxTreatments: 2, forbidden: ["b", "c"] }))).toEqual(["a", "d", "a+d"]);
  });
});
