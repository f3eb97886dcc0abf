import { describe, expect, it } from "vitest";
import { buildGroupHull } from "../../src/solver/buildGroupHull.js";
import { prepareProgramme } from "../../src/solver/prepareProgramme.js";
import { solveProgramme } from "../../src/solver/solveProgramme.js";
import type { Programme } from "../../src/solver/types.js";
import { randomProgramme, seededRandom } from "./randomProgramme.js";

// Reference: a fresh solveProgramme on the changed programme, which shares no prepared state.

describe("prepareProgramme", () => {
  it("solves a 30-level budget frontier exactly as fresh solves do", async () => {
    const programme = randomProgramme(7, { groups: 300, minOptions: 3, maxOptions: 6, maxCost: 1000, requiredChance: 0.02 });
    const prepared = prepareProgramme(programme);
    let levels = 0;
    for (let level = 1; level <= 30; level += 1) {
      const budget = Math.round((programme.budget * level) / 10);
      const fromPrepared = await prepared.solve({ budget });
      const fresh = await solveProgramme({ ...programme, budget });
      expect(fromPrepared).toEqual(fresh);
      levels += 1;
    }
    expect(levels).toBe(30);
  });

  it("solves 50 uncertainty draws (new values, same costs) exactly as fresh solves do", async () => {
    const programme = randomProgramme(8, { groups: 200, minOptions: 3, maxOptions: 6, maxCost: 1000 });
    const prepared = prepareProgramme(programme);
    const random = seededRandom(99);
    let draws = 0;
    for (let draw = 0; draw < 50; draw += 1) {
      const values = programme.groups.map((g) => g.options.map((o) => Math.round(o.value * (0.5 + random()))));
      const changed: Programme = {
        ...programme,
        groups: programme.groups.map((g, i) => ({ ...g, options: g.options.map((o, a) => ({ cost: o.cost, value: values[i]![a]! })) })),
      };
      expect(await prepared.solve({ values })).toEqual(await solveProgramme(changed));
      draws += 1;
    }
    // The base values are still served after the draws.
    expect(await prepared.solve()).toEqual(await solveProgramme(programme));
    expect(draws).toBe(50);
  });

  it("gives the same answer twice and exposes each site's hull", async () => {
    const programme = randomProgramme(9, { groups: 120, minOptions: 3, maxOptions: 6, maxCost: 1000, sideConstraints: true });
    const prepared = prepareProgramme(programme);
    expect(await prepared.solve()).toEqual(await prepared.solve());
    expect(prepared.hull(5)).toEqual(buildGroupHull(programme.groups[5]!));
  });

  it("rejects malformed values in a change with a RangeError", async () => {
    const programme = randomProgramme(10, { groups: 5 });
    const prepared = prepareProgramme(programme);
    await expect(prepared.solve({ values: programme.groups.map((g) => g.options.map(() => Number.NaN)) })).rejects.toThrow(RangeError);
  });
});
