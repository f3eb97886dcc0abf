import { describe, expect, it } from "vitest";
import { niceTicks } from "../../src/report/niceTicks.js";

describe("niceTicks", () => {
  // Expected values worked by hand from the 1-2-5 "nice numbers" rule (Heckbert, Graphics Gems, 1990).
  it("uses steps of 1, 2 or 5 times a power of ten", () => {
    expect(niceTicks(0, 100, 5)).toEqual([0, 20, 40, 60, 80, 100]);
    expect(niceTicks(0, 28_924_600, 6)).toEqual([0, 5e6, 10e6, 15e6, 20e6, 25e6]);
    expect(niceTicks(0, 0.9, 3)).toEqual([0, 0.5]);
  });

  it("returns the single value for an empty range", () => {
    expect(niceTicks(3, 3)).toEqual([3]);
  });
});
