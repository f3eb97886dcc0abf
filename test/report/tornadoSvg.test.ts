import { describe, expect, it } from "vitest";
import type { SensitivityCase, SensitivityResult } from "../../src/analysis/uncertainty/oneAtATimeSensitivity.js";
import { progressBar } from "../../src/report/progressBar.js";
import { tornadoSvg } from "../../src/report/tornadoSvg.js";

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

describe("progressBar", () => {
  it("fills in proportion and overwrites its line", () => {
    expect(progressBar(5, 10, 10)).toBe("\r[#####-----]  50% 5/10 draws");
    expect(progressBar(10, 10, 4)).toBe("\r[####] 100% 10/10 draws");
  });
});
