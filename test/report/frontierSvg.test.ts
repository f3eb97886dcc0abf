import { describe, expect, it } from "vitest";
import type { FrontierSummary } from "../../src/analysis/summariseFrontier.js";
import { frontierSvg } from "../../src/report/frontierSvg.js";

const row = (budget: number, ksiAvoided: number, status: "optimal" | "infeasible" = "optimal") => ({
  budget,
  status,
  spend: budget,
  projects: 1,
  ksiAvoided,
  benefitPV: 0,
  bcRatio: 0,
  marginalKsiPerMillion: null,
  diminishing: false,
});
const summary: FrontierSummary = {
  rows: [row(0, 0, "infeasible"), row(1e6, 10), row(2e6, 16), row(3e6, 20)],
  referenceKsiPerMillion: 6,
  referenceFromBudget: 1e6,
  referenceToBudget: 2e6,
  diminishingFrom: 2e6,
};
const context = { scenarioName: "Test <city> & co", currency: "USD", scenarioBudget: 1.5e6, objective: "ksi" as const };

describe("frontierSvg", () => {
  const svg = frontierSvg(summary, context);

  it("is accessible: role img, labelled by a title and a description, with text escaped", () => {
    expect(svg).toMatch(/^<svg [^>]*role="img"[^>]*aria-labelledby="frontier-title frontier-desc"/);
    expect(svg).toContain('<title id="frontier-title">Budget frontier: K+A crashes avoided against budget, Test &lt;city&gt; &amp; co</title>');
    expect(svg).toMatch(/<desc id="frontier-desc">[^<]+<\/desc>/);
  });

  it("loads nothing from outside: the only URL is the SVG namespace; no scripts, images or styles", () => {
    expect(svg.match(/https?:\/\/[^"]+/g)).toEqual(["http://www.w3.org/2000/svg"]);
    expect(svg).not.toMatch(/<script|<image|<style|href=/);
  });

  it("draws a step curve over the solved levels only, rising (upwards on screen) with budget", () => {
    const d = /<path d="([^"]+)"/.exec(svg)![1]!;
    const commands = d.split(" ");
    // Three solved levels: one move, then a horizontal and a vertical segment per further level.
    expect(commands.filter((c) => c.startsWith("M"))).toHaveLength(1);
    expect(commands.filter((c) => c.startsWith("H"))).toHaveLength(2);
    expect(commands.filter((c) => c.startsWith("V"))).toHaveLength(2);
    const ys = [Number(commands[0]!.split(",")[1]), ...commands.filter((c) => c.startsWith("V")).map((c) => Number(c.slice(1)))];
    for (let i = 1; i < ys.length; i += 1) expect(ys[i]!).toBeLessThan(ys[i - 1]!);
  });

  it("marks the scenario's budget with a dashed line between the 1M and 2M ticks", () => {
    const mark = /<line x1="([\d.]+)" x2="[\d.]+" [^>]*stroke-dasharray/.exec(svg)!;
    const tickX = (label: string) => Number(new RegExp(`<text x="([\\d.]+)" y="[\\d.]+" text-anchor="middle">${label}</text>`).exec(svg)![1]);
    expect(Number(mark[1])).toBeCloseTo((tickX("1M") + tickX("2M")) / 2, 0);
    expect(svg).toContain("scenario budget 1.5M");
  });

  it("uses the Okabe-Ito colour-blind-safe blue and vermillion (Okabe & Ito, 2008)", () => {
    expect(svg).toContain('stroke="#0072B2"');
    expect(svg).toContain('stroke="#D55E00"');
  });
});
