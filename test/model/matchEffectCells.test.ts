import { describe, expect, it } from "vitest";
import { matchEffectCells } from "../../src/model/matchEffectCells.js";
import { CRASH_TYPES, SEVERITIES } from "../../src/model/types.js";

// Cells are crash type × severity products; "same" is set equality of both lists, "partial" any shared cell.
const pedestrian = { crashTypes: ["pedestrian" as const], severities: SEVERITIES };
const everything = { crashTypes: CRASH_TYPES, severities: SEVERITIES };
const ksiOnly = { crashTypes: CRASH_TYPES, severities: ["K" as const, "A" as const] };

describe("matchEffectCells", () => {
  it("finds the effect on exactly the same cells, whatever the order of the lists", () => {
    expect(matchEffectCells([ksiOnly, pedestrian], { crashTypes: ["pedestrian"], severities: ["O", "C", "B", "A", "K"] })).toEqual({ kind: "same", index: 1 });
    expect(matchEffectCells([ksiOnly], { crashTypes: [...CRASH_TYPES].reverse(), severities: ["A", "K"] })).toEqual({ kind: "same", index: 0 });
  });

  it("prefers an exact match to an earlier effect that only overlaps (a catch-all)", () => {
    expect(matchEffectCells([everything, pedestrian], pedestrian)).toEqual({ kind: "same", index: 1 });
  });

  it("reports a partial overlap, and none when no cell is shared", () => {
    expect(matchEffectCells([pedestrian], { crashTypes: ["pedestrian", "bicycle"], severities: SEVERITIES })).toEqual({ kind: "partial", index: 0 });
    expect(matchEffectCells([ksiOnly], { crashTypes: ["angle"], severities: ["K"] })).toEqual({ kind: "partial", index: 0 });
    // Shared crash type but no shared severity: no cell in common.
    expect(matchEffectCells([ksiOnly], { crashTypes: ["angle"], severities: ["B", "C", "O"] })).toEqual({ kind: "none" });
    expect(matchEffectCells([], pedestrian)).toEqual({ kind: "none" });
  });
});
