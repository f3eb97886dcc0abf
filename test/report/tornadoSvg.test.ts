import { describe, expect, it } from "vitest";
import type { SensitivityCase, SensitivityResult } from "../../src/analysis/uncertainty/oneAtATimeSensitivity.js";
import { progressBar } from "../../src/report/progressBar.js";
import { tornadoSvg, wrapLabel } from "../../src/report/tornadoSvg.js";

const unchanged = { entering: [], leaving: [] };
function sensitivityCase(label: string, ksiAvoidedChange: number, bcRatioChange: number, listChanges: boolean): SensitivityCase {
  return { label, ksiAvoided: 10 + ksiAvoidedChange, ksiAvoidedChange, bcRatio: 2 + bcRatioChange, bcRatioChange, listChanges, ...unchanged };
}

describe("tornadoSvg", () => {
  const result: SensitivityResult = {
    baseKsiAvoided: 10,
    baseBcRatio: 2,
    rows: [
      { parameter: "CMF a & <b>", base: "0.5", low: sensitivityCase("0.3", 4, 0.5, false), high: sensitivityCase("0.7", -4, -0.5, true) },
      { parameter: "discount rate", base: "4.0%", low: sensitivityCase("2.0%", 0, 1, false), high: sensitivityCase("7.0%", 0, -1, false) },
    ],
  };
  const svg = tornadoSvg(result, "Test chart");

  it("draws one bar per case and panel, scaled so the widest reaches the panel edge", () => {
    const bars = [...svg.matchAll(/<rect x="([\d.]+)" y="[\d.]+" width="([\d.]+)" height="18"/g)].map((m) => Number(m[2]));
    expect(bars).toHaveLength(8);
    // Half panel 150 px less a 10 px margin = 140 px for the widest swing in each panel.
    expect(Math.max(...bars.slice(0, 4))).toBeCloseTo(140, 6);
    expect(bars[2]).toBe(0); // discount rate does not move KSI avoided
    expect(svg.match(/<circle /g)).toHaveLength(2); // one row changes the list, plus the legend
  });

  it("escapes text so the SVG stays well-formed", () => {
    expect(svg).toContain("CMF a &amp; &lt;b&gt;");
    expect(svg).not.toContain("<b>");
  });
});

describe("tornado labels are wrapped, never cut", () => {
  const long = "CMF of protected intersection with leading pedestrian interval and raised crossings (0.58 / 0.98)";
  it("keeps every character of a long label over lines of at most 44 characters", () => {
    const lines = wrapLabel(long);
    expect(lines.length).toBeGreaterThan(1);
    expect(lines.every((line) => line.length <= 44)).toBe(true);
    expect(lines.join(" ")).toBe(long);
    expect(wrapLabel("x".repeat(100)).join("")).toBe("x".repeat(100));
  });
  it("gives a wrapped row room for its lines and prints the whole label", () => {
    const svg = tornadoSvg({ baseKsiAvoided: 10, baseBcRatio: 2, rows: [{ parameter: long.replace(/ \(.*\)$/, ""), base: "0.8", low: sensitivityCase("0.58", 1, 0.1, false), high: sensitivityCase("0.98", -1, -0.1, false) }] }, "t");
    const spans = [...svg.matchAll(/<tspan x="10" y="([\d.]+)">([^<]*)<\/tspan>/g)];
    expect(spans.map((m) => m[2]).join(" ")).toBe(long);
    expect(svg).not.toContain("…");
    const ys = spans.map((m) => Number(m[1]));
    expect(ys[1]! - ys[0]!).toBe(14);
  });
});

describe("progressBar", () => {
  it("fills in proportion and overwrites its line", () => {
    expect(progressBar(5, 10, 10)).toBe("\r[#####-----]  50% 5/10 draws");
    expect(progressBar(10, 10, 4)).toBe("\r[####] 100% 10/10 draws");
    expect(progressBar(1, 4, 4, "budget levels")).toBe("\r[#---]  25% 1/4 budget levels");
  });
});
