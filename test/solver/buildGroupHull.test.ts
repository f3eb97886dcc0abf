import { describe, expect, it } from "vitest";
import { buildGroupHull } from "../../src/solver/buildGroupHull.js";

// Hand-drawn example (points as cost, value), checked on graph paper:
//   none (0,0); 0: (10,5); 1: (20,6) below the chord from 0 to 3; 2: (25,4) dominated by 0 and 1
//   (the report names the best cheaper option, 1);
//   3: (30,12); 4: (30,9) dominated by 3 (same cost, less); 5: (40,13).
const group = {
  id: "X",
  required: false,
  options: [
    { cost: 10, value: 5 },
    { cost: 20, value: 6 },
    { cost: 25, value: 4 },
    { cost: 30, value: 12 },
    { cost: 30, value: 9 },
    { cost: 40, value: 13 },
  ],
};

describe("buildGroupHull", () => {
  it("keeps the upper convex hull from doing nothing to the best option", () => {
    // Slopes: none->0 = 0.5, 0->3 = 0.35, 3->5 = 0.1: decreasing, so all three are vertices.
    expect(buildGroupHull(group).vertices).toEqual([null, 0, 3, 5]);
  });

  it("gives each removed option its reason", () => {
    const { removed } = buildGroupHull(group);
    const byOption = new Map(removed.map((r) => [r.option, r]));
    expect(byOption.get(1)).toMatchObject({ reason: "lp-dominated", by: 0, and: 3 });
    expect(byOption.get(2)).toMatchObject({ reason: "dominated", by: 1 });
    expect(byOption.get(2)!.explanation).toBe("dominated by option 1: costs more, avoids less");
    expect(byOption.get(4)).toMatchObject({ reason: "dominated", by: 3 });
    expect(byOption.get(4)!.explanation).toBe("dominated by option 3: costs the same, avoids less");
    expect(removed).toHaveLength(3);
  });

  it("starts a required site's hull at its cheapest option", () => {
    expect(buildGroupHull({ ...group, required: true }).vertices).toEqual([0, 3, 5]);
  });

  it("lets a free option with value replace doing nothing, and drops worthless options", () => {
    const hull = buildGroupHull({
      id: "Y",
      required: false,
      options: [
        { cost: 0, value: 1 },
        { cost: 5, value: 0 },
        { cost: 0, value: 0 },
      ],
    });
    expect(hull.vertices).toEqual([0]);
    expect(hull.removed.map((r) => [r.option, r.reason, r.by])).toEqual([
      [1, "dominated", 0],
      [2, "dominated", 0],
    ]);
  });

  it("treats an option level with doing nothing as dominated by doing nothing", () => {
    const hull = buildGroupHull({ id: "Z", required: false, options: [{ cost: 0, value: 0 }, { cost: 3, value: 2 }] });
    expect(hull.vertices).toEqual([null, 1]);
    expect(hull.removed[0]).toMatchObject({ option: 0, reason: "dominated", by: null });
  });
});
