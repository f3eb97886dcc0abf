import { execFileSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { runCaptured } from "./captureIo.js";

const DEMO = "scenarios/demo.yaml";

interface UncertaintyJson {
  draws: number;
  seed: number;
  method: { effectsWithStandardError: number; effectsWithoutStandardError: number };
  plan: { ksiAvoided: number; projects: number };
  overDraws: { solvedDraws: number; ksiAvoided: { mean: number; p5: number; p50: number; p95: number }; probabilityBcAboveOne: number };
  selections: { site: string; probability: number; inPlan: boolean; class: string }[];
  sensitivity: { rows: { parameter: string }[] };
  cautions: string[];
}

async function uncertainty(...extra: string[]): Promise<string> {
  const { code, stdout, stderr } = await runCaptured(["uncertainty", DEMO, "--format", "json", "--draws", "3", ...extra]);
  expect(stderr).toBe("");
  expect(code).toBe(0);
  return stdout;
}

describe("averta uncertainty on the demo", () => {
  // Threads run the compiled worker, so the build must be current.
  beforeAll(() => {
    execFileSync("npx", ["tsc", "-p", "tsconfig.build.json"], { stdio: "pipe" });
  });

  it("gives the same JSON for the same seed, on one thread or two, and another for another seed", async () => {
    const first = await uncertainty("--seed", "7", "--threads", "1");
    const again = await uncertainty("--seed", "7", "--threads", "1");
    const twoThreads = await uncertainty("--seed", "7", "--threads", "2");
    const otherSeed = await uncertainty("--seed", "8", "--threads", "1");
    expect(again).toBe(first);
    expect(twoThreads).toBe(first);
    expect(otherSeed).not.toBe(first);

    const result = JSON.parse(first) as UncertaintyJson;
    expect(result.draws).toBe(3);
    expect(result.seed).toBe(7);
    expect(result.overDraws.solvedDraws).toBe(3);
    // The demo catalogue publishes 7 standard errors among the effects its sites may get (catalogs/demo-catalogue.yaml).
    expect(result.method.effectsWithStandardError).toBe(7);
    expect(result.method.effectsWithoutStandardError).toBeGreaterThan(0);
    const { p5, p50, p95 } = result.overDraws.ksiAvoided;
    expect(p5).toBeLessThanOrEqual(p50);
    expect(p50).toBeLessThanOrEqual(p95);
    expect(result.selections.filter((s) => s.inPlan).length).toBe(result.plan.projects);
    expect(result.sensitivity.rows.map((r) => r.parameter)).toEqual(expect.arrayContaining(["discount rate", "unit crash costs", "service lives"]));
    expect(result.cautions.length).toBeGreaterThan(0);
  });

  it("prints a table and writes a tornado SVG", async () => {
    const folder = mkdtempSync(join(tmpdir(), "averta-uncertainty-"));
    const svg = join(folder, "tornado.svg");
    const { code, stdout, stderr } = await runCaptured(["uncertainty", DEMO, "--draws", "2", "--threads", "1", "--tornado", svg]);
    expect(code).toBe(0);
    expect(stdout).toMatch(/Probability the list's B\/C exceeds 1/);
    expect(stdout).toMatch(/Cautions:/);
    expect(stderr).toContain(svg);
    const chart = readFileSync(svg, "utf8");
    expect(chart.startsWith("<svg")).toBe(true);
    expect(chart).toContain("discount rate");
  });

  it("rejects bad options and an existing --out with exit code 2, leaving files untouched", async () => {
    const folder = mkdtempSync(join(tmpdir(), "averta-uncertainty-"));
    const existing = join(folder, "kept.json");
    writeFileSync(existing, "keep me");
    for (const argv of [
      ["uncertainty", DEMO, "--draws", "0"],
      ["uncertainty", DEMO, "--seed", "-1"],
      ["uncertainty", DEMO, "--threads", "two"],
      ["uncertainty", DEMO, "--format", "csv"],
      ["uncertainty", DEMO, "--tornado", join(folder, "chart.png")],
      ["uncertainty", "scenarios/no-such-scenario.yaml", "--draws", "2"],
      ["uncertainty", DEMO, "--draws", "2", "--out", existing],
    ]) {
      const { code, stderr } = await runCaptured(argv);
      expect(code, argv.join(" ")).toBe(2);
      expect(stderr).toMatch(/error/);
      expect(stderr).not.toMatch(/\n\s+at /);
    }
    expect(readFileSync(existing, "utf8")).toBe("keep me");
    expect(existsSync(join(folder, "chart.png"))).toBe(false);
  });
});
