import { describe, expect, it } from "vitest";
import { completeCrashMatrix } from "../../src/model/crashMatrix.js";
import { suggestCandidates } from "../../src/model/suggestCandidates.js";
import { ALL_SEVERITIES, ALL_TYPES, handSite, treatment } from "./fixtures.js";

// One intersection, five years: pedestrian K1 A4 B5, angle A1 C2 O10, rear-end O6 (29 crashes, 6 K+A).
const site = handSite({ crashes: completeCrashMatrix({ pedestrian: { K: 1, A: 4, B: 5 }, angle: { A: 1, C: 2, O: 10 }, "rear-end": { O: 6 } }) });
const effect = (crashTypes: readonly (typeof ALL_TYPES)[number][], cmf: number, severities = ALL_SEVERITIES) => ({ crashTypes, severities, cmf, source: "test" });

describe("suggestCandidates", () => {
  it("ranks by K+A, then all crashes, in the cells each treatment acts on (hand-counted)", () => {
    const treatments = [
      treatment({ id: "ped-only", effects: [effect(["pedestrian"], 0.6)] }), // 5 K+A, 10 crashes
      treatment({ id: "angle-only", effects: [effect(["angle"], 0.5)] }), // 1 K+A, 13 crashes
      treatment({ id: "ped-and-angle-severe", effects: [effect(["pedestrian", "angle"], 0.8, ["K", "A", "B", "C"])] }), // 6 K+A, 13 crashes
      treatment({ id: "rear-end-only", effects: [effect(["rear-end"], 0.7)] }), // 0 K+A, 6 crashes
    ];
    const suggestions = suggestCandidates(site, treatments, 10);
    expect(suggestions.map((s) => [s.treatment, s.ksiCovered, s.crashesCovered])).toEqual([
      ["ped-and-angle-severe", 6, 13],
      ["ped-only", 5, 10],
      ["angle-only", 1, 13],
      ["rear-end-only", 0, 6],
    ]);
    // Crash types by crashes covered, most first: pedestrian 10, angle 3 (A1 C2; its O cells are not acted on).
    expect(suggestions[0]!.crashTypes).toEqual(["pedestrian", "angle"]);
    // Avoided over the window: 6 K+A × (1 − 0.8) = 1.2; 13 crashes × 0.2 = 2.6.
    expect(suggestions[0]!.ksiAvoided).toBeCloseTo(1.2, 12);
    expect(suggestions[0]!.crashesAvoided).toBeCloseTo(2.6, 12);
  });

  it("counts only cells where the CMF is below 1, and lets specific effects take precedence over a catch-all", () => {
    const treatments = [
      // Pedestrian cells get 1.1 (an increase): only the catch-all's other cells count: angle 13 + rear-end 6, K+A 1.
      treatment({ id: "trade-off", effects: [effect(["pedestrian"], 1.1), effect(ALL_TYPES, 0.9)] }),
    ];
    const [only] = suggestCandidates(site, treatments);
    expect([only!.ksiCovered, only!.crashesCovered]).toEqual([1, 19]);
    expect(only!.crashTypes).toEqual(["angle", "rear-end"]);
  });

  it("leaves out treatments for other kinds, per-km treatments at a site without length, and treatments acting on none of its crashes", () => {
    const treatments = [
      treatment({ id: "segment-only", appliesTo: ["segment"], effects: [effect(ALL_TYPES, 0.5)] }),
      treatment({ id: "per-km", appliesTo: ["intersection", "segment"], cost: { basis: "per-km", amount: 1000 }, effects: [effect(ALL_TYPES, 0.5)] }),
      treatment({ id: "head-on", effects: [effect(["head-on"], 0.5)] }),
      treatment({ id: "fits", effects: [effect(["rear-end"], 0.5)] }),
    ];
    expect(suggestCandidates(site, treatments).map((s) => s.treatment)).toEqual(["fits"]);
    const withLength = { ...site, lengthKm: 1.5 };
    expect(suggestCandidates(withLength, treatments).map((s) => s.treatment)).toEqual(["per-km", "fits"]);
    expect(suggestCandidates({ ...site, crashes: completeCrashMatrix(undefined) }, treatments)).toEqual([]);
  });

  it("breaks ties on the same cells by crashes avoided, then by id, and keeps at most max", () => {
    const treatments = [
      treatment({ id: "b-weak", effects: [effect(ALL_TYPES, 0.9)] }),
      treatment({ id: "a-weak", effects: [effect(ALL_TYPES, 0.9)] }),
      treatment({ id: "strong", effects: [effect(ALL_TYPES, 0.5)] }),
    ];
    expect(suggestCandidates(site, treatments, 3).map((s) => s.treatment)).toEqual(["strong", "a-weak", "b-weak"]);
    expect(suggestCandidates(site, treatments, 2).map((s) => s.treatment)).toEqual(["strong", "a-weak"]);
    expect(suggestCandidates(site, [...treatments].reverse(), 3).map((s) => s.treatment)).toEqual(["strong", "a-weak", "b-weak"]);
    expect(() => suggestCandidates(site, treatments, 1.5)).toThrow(RangeError);
  });
});
