import { describe, expect, it } from "vitest";
import { combineCmfs } from "../../src/model/combineCmfs.js";
import { treatmentCmf } from "../../src/model/treatmentCmf.js";
import { ALL_SEVERITIES, ALL_TYPES, treatment } from "./fixtures.js";

describe("combineCmfs (Highway Safety Manual Part D multiplicative rule)", () => {
  const a = treatment({ id: "a", effects: [{ crashTypes: ["pedestrian"], severities: ALL_SEVERITIES, cmf: 0.9, source: "test" }] });
  const b = treatment({ id: "b", effects: [{ crashTypes: ["pedestrian", "angle"], severities: ["K", "A"], cmf: 0.8, source: "test" }] });

  it("multiplies the CMFs that cover a cell: 0.90 × 0.80 = 0.72", () => {
    expect(combineCmfs([a, b], "pedestrian", "K")).toBeCloseTo(0.72, 12);
  });
  it("a treatment with no effect on a cell contributes 1", () => {
    expect(combineCmfs([a, b], "pedestrian", "O")).toBeCloseTo(0.9, 12);
    expect(combineCmfs([a, b], "rear-end", "K")).toBe(1);
    expect(combineCmfs([], "angle", "A")).toBe(1);
  });
  it("a specific effect listed before a catch-all one takes precedence in its cells", () => {
    const mixed = treatment({
      id: "m",
      effects: [
        { crashTypes: ["pedestrian"], severities: ALL_SEVERITIES, cmf: 0.5, source: "specific" },
        { crashTypes: ALL_TYPES, severities: ALL_SEVERITIES, cmf: 0.9, source: "catch-all" },
      ],
    });
    expect(treatmentCmf(mixed, "pedestrian", "A")).toBe(0.5);
    expect(treatmentCmf(mixed, "angle", "A")).toBe(0.9);
  });
});

describe("combineCmfs: alternative rules, checked against a published worked example", () => {
  // Texas DOT Traffic Safety Program manual, section 5.4.5.5 "Examples of applying multiple CMFs":
  // CMFs 0.95, 0.65 and 0.80 give dominant effect 0.65, multiplicative 0.494 and dominant common
  // residuals (0.65 × 0.80 × 0.95)^0.65 = 0.632.
  const one = (id: string, cmf: number) => treatment({ id, effects: [{ crashTypes: ["angle"], severities: ALL_SEVERITIES, cmf, source: "test" }] });
  const set = [one("a", 0.95), one("b", 0.65), one("c", 0.8)];
  it("multiplicative: 0.494", () => {
    expect(combineCmfs(set, "angle", "A", undefined, { rule: "multiplicative" })).toBeCloseTo(0.494, 3);
  });
  it("dominant effect: 0.65", () => {
    expect(combineCmfs(set, "angle", "A", undefined, { rule: "dominant-effect" })).toBe(0.65);
  });
  it("dominant common residuals: 0.632", () => {
    expect(combineCmfs(set, "angle", "A", undefined, { rule: "dominant-common-residuals" })).toBeCloseTo(0.632, 3);
  });
  it("one acting treatment keeps its own CMF under every rule; treatments not acting on the cell are ignored", () => {
    const other = treatment({ id: "z", effects: [{ crashTypes: ["pedestrian"], severities: ALL_SEVERITIES, cmf: 0.5, source: "test" }] });
    for (const rule of ["multiplicative", "dominant-effect", "dominant-common-residuals"] as const) {
      expect(combineCmfs([set[1]!, other], "angle", "K", undefined, { rule })).toBe(0.65);
    }
  });
  it("dominant common residuals never credits a combination with less than its strongest member", () => {
    // (0.42 × 0.6)^0.42 = 0.56 > 0.42 by the bare formula.
    expect(combineCmfs([one("a", 0.42), one("b", 0.6)], "angle", "A", undefined, { rule: "dominant-common-residuals" })).toBe(0.42);
  });
  it("the floor bounds each cell's combined CMF from below", () => {
    expect(combineCmfs(set, "angle", "A", undefined, { rule: "multiplicative", floor: 0.6 })).toBe(0.6);
    expect(combineCmfs(set, "angle", "A", undefined, { rule: "dominant-effect", floor: 0.6 })).toBe(0.65);
  });
  it("the rules order as they should: dominant effect ≥ dominant common residuals ≥ multiplicative for CMFs below 1 (random cases)", () => {
    let cases = 0;
    for (let i = 1; i <= 200; i++) {
      const cmfs = [((i * 37) % 90) / 100 + 0.05, ((i * 53) % 90) / 100 + 0.05];
      const pair = cmfs.map((cmf, j) => one(`t${j}`, cmf));
      const mult = combineCmfs(pair, "angle", "A", undefined, { rule: "multiplicative" });
      const dcr = combineCmfs(pair, "angle", "A", undefined, { rule: "dominant-common-residuals" });
      const dom = combineCmfs(pair, "angle", "A", undefined, { rule: "dominant-effect" });
      expect(dom).toBeGreaterThanOrEqual(dcr - 1e-12);
      expect(dcr).toBeGreaterThanOrEqual(mult - 1e-12);
      cases++;
    }
    expect(cases).toBe(200);
  });
});
