import { describe, expect, it } from "vitest";
import { displayWidth, textTable, wrap } from "../../src/report/textTable.js";

describe("textTable", () => {
  it("lays out headings, aligned cells and a spanning total with matching junctions", () => {
    const text = textTable(
      [{ heading: "Site" }, { heading: "Name" }, { heading: "Cost", align: "right" }],
      [["I-1", "Mill Gate", "5"], ["I-22", "Ash", "1,250"], { lead: "Total: 2", span: 2, cells: ["1,255"] }],
    );
    expect(text.split("\n")).toEqual([
      "┌──────┬───────────┬───────┐",
      "│ Site │ Name      │  Cost │",
      "├──────┼───────────┼───────┤",
      "│ I-1  │ Mill Gate │     5 │",
      "├──────┼───────────┼───────┤",
      "│ I-22 │ Ash       │ 1,250 │",
      "├──────┴───────────┼───────┤",
      "│ Total: 2         │ 1,255 │",
      "└──────────────────┴───────┘",
    ]);
  });

  it("wraps a column at its maxWidth, at spaces, and keeps every line the same width", () => {
    const text = textTable([{ heading: "Treatments", maxWidth: 12 }, { heading: "n", align: "right" }], [["raised-crosswalk + lighting", "3"]]);
    const lines = text.split("\n");
    expect(new Set(lines.map(displayWidth)).size).toBe(1);
    expect(lines.filter((line) => line.startsWith("│")).map((line) => line.split("│")[1]!.trim())).toEqual(["Treatments", "raised-cross", "walk +", "lighting"]);
  });

  it("widens a span whose lead is longer than its columns", () => {
    const text = textTable([{ heading: "A" }, { heading: "B" }, { heading: "C" }], [["1", "2", "3"], { lead: "a long total label", span: 2, cells: ["9"] }]);
    expect(new Set(text.split("\n").map(displayWidth)).size).toBe(1);
    expect(text).toContain("│ a long total label │ 9 │");
  });

  it("measures wide and combining characters as a terminal shows them", () => {
    expect(displayWidth("Ölweg")).toBe(5);
    expect(displayWidth("Öl\u0308")).toBe(2);
    expect(displayWidth("東京")).toBe(4);
    const text = textTable([{ heading: "Name" }], [["東京"], ["Ab"]]);
    expect(new Set(text.split("\n").map(displayWidth)).size).toBe(1);
  });

  it("never loses text when wrapping, even a word longer than the line", () => {
    expect(wrap("x".repeat(25), 10)).toEqual(["x".repeat(10), "x".repeat(10), "x".repeat(5)]);
    expect(wrap("a bb ccc dddd", 4).join(" ")).toBe("a bb ccc dddd");
    expect(wrap("one\ntwo", 20)).toEqual(["one", "two"]);
  });
});
