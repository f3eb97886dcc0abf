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
