import { execFileSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { runCaptured } from "./captureIo.js";

const DEMO = "scenarios/demo.yaml";

interface UncertaintyJson {
  draws: number;
  seed: number;
  definitions: { ksiAvoided: string };
  method: {
    effectsWithStandardError: number;
    effectsWithoutStandardError: number;
    assumedCmfCv: number | "off";
    effects: { total: number; uncertain: number; withStandardError: number; withAssumedCv: number; heldExact: number };
    effectsUncertain: string;
    baselineSites: { observed: number; empiricalBayes: number; fixed: number };
  };
  plan: { ksiAvoided: number; projects: number; cost: number };
  overDraws: {
    solvedDraws: number;
    ksiAvoided: { mean: number; p5: number; p50: number; p95: number };
    bcRatio: { mean: number; p5: number; p50: number; p95: number };
    probabilityBcAboveOne: number;
    effectsUncertain: string;
  };
  selectionsEffectsUncertain: string;
  selections: { site: string; treatments: string[]; probability: number; inPlan: boolean; class: string }[];
  shakyProjects: {
    site: string;
    treatments: string[];
    cost: number;
    probability: number;
    effectsUncertain: string;
    drawsWithout: number;
    replacedBy: { site: string; treatments: string[]; cost: number; shareOfDrawsWithout: number; shareOfDrawsWith: number | null }[];
  }[];
  sensitivity: { rows: { parameter: string }[] };
  cautions: string[];
}

async function uncertainty(...extra: string[]): Promise<string> {
  return uncertaintyOf(DEMO, "--draws", "3", ...extra);
}

async function uncertaintyOf(file: string, ...extra: string[]): Promise<string> {
  const { code, stdout, stderr } = await runCaptured(["uncertainty", file, "--format", "json", ...extra]);
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

  it("draws every effect of the demo, 16 of them with the assumed CV, and says so beside every probability", async () => {
    const result = JSON.parse(await uncertaintyOf(DEMO, "--draws", "40", "--threads", "1")) as UncertaintyJson;
    const { effects } = result.method;
    // 7 published standard errors (catalogs/demo-catalogue.yaml); every other effect takes the default CV 0.2.
    expect(result.method.assumedCmfCv).toBe(0.2);
    expect(effects).toEqual({ total: effects.total, uncertain: effects.total, withStandardError: 7, withAssumedCv: effects.total - 7, heldExact: 0 });
    const basis = `${effects.total} of ${effects.total} effects uncertain (7 with a published standard error, ${effects.total - 7} with the assumed CV)`;
    expect(result.method.effectsUncertain).toBe(basis);
    expect(result.overDraws.effectsUncertain).toBe(basis);
    expect(result.selectionsEffectsUncertain).toBe(basis);
    expect(result.definitions.ksiAvoided).toMatch(/^K\+A crashes avoided/);
    // A P(B/C > 1) of 100% here is not from effects held exact: none is.
    expect(result.method.effects.heldExact).toBe(0);
    // The demo's baselines are all Empirical Bayes (baseline: auto), drawn from their gamma posteriors;
    // S-05 is excluded by a never-fund rule, so its baseline is never drawn.
    expect(result.method.baselineSites).toEqual({ observed: 0, empiricalBayes: 50, fixed: 0 });

    // Shaky projects: exactly the funded ones below half the draws, largest cost first, with replacements outside the list.
    const funded = result.selections.filter((s) => s.inPlan);
    const below = funded.filter((s) => s.probability < 0.5).map((s) => `${s.site}: ${s.treatments.join("+")}`);
    expect(result.shakyProjects.map((s) => `${s.site}: ${s.treatments.join("+")}`).sort()).toEqual(below.sort());
    expect(result.shakyProjects.length).toBeGreaterThan(0);
    const inPlan = new Set(funded.map((s) => `${s.site}: ${s.treatments.join("+")}`));
    result.shakyProjects.forEach((project, index) => {
      if (index > 0) expect(result.shakyProjects[index - 1]!.cost).toBeGreaterThanOrEqual(project.cost);
      expect(project.effectsUncertain).toBe(basis);
      expect(project.drawsWithout).toBe(Math.round((1 - project.probability) * result.overDraws.solvedDraws));
      for (const replacement of project.replacedBy) {
        expect(inPlan.has(`${replacement.site}: ${replacement.treatments.join("+")}`)).toBe(false);
        expect(replacement.shareOfDrawsWithout).toBeGreaterThan(replacement.shareOfDrawsWith ?? 0);
      }
    });

    const { code, stdout } = await runCaptured(["uncertainty", DEMO, "--draws", "5", "--threads", "1"]);
    expect(code).toBe(0);
    expect(stdout).toContain(`CMFs: ${basis}.`);
    expect(stdout).toMatch(new RegExp(`Probability the list's B/C exceeds 1: [0-9.]+% \\(\\d+ of 5 draws; ${basis.replace(/[()+]/g, "\\$&")}\\)`));
    expect(stdout).toMatch(/^Shaky projects: /m);
    expect(stdout).toContain("K+A crashes avoided");
  });

  it("holds effects without a standard error exact with assumedCmfCv: off, says so, and the B/C spread narrows", async () => {
    const folder = mkdtempSync(join(tmpdir(), "averta-uncertainty-"));
    const off = join(folder, "demo-cv-off.yaml");
    // The catalogue by absolute path: a relative one may not leave the scenario's folder.
    const text = readFileSync(DEMO, "utf8").replace("catalogues: [../catalogs/demo-catalogue.yaml]", `catalogues: [${resolve("catalogs/demo-catalogue.yaml")}]`);
    writeFileSync(off, `${text}\nuncertainty:\n  assumedCmfCv: off\n`);
    const args = ["--draws", "40", "--threads", "1", "--fixed-baseline", "--seed", "3"];
    const exact = JSON.parse(await uncertaintyOf(off, ...args)) as UncertaintyJson;
    const drawn = JSON.parse(await uncertaintyOf(DEMO, ...args)) as UncertaintyJson;
    const total = exact.method.effects.total;
    expect(exact.method.assumedCmfCv).toBe("off");
    expect(exact.method.effects).toEqual({ total, uncertain: 7, withStandardError: 7, withAssumedCv: 0, heldExact: total - 7 });
    expect(exact.overDraws.effectsUncertain).toBe(`7 of ${total} effects uncertain (7 with a published standard error, 0 with the assumed CV); ${total - 7} held exact (assumed CV off)`);
    const width = (r: UncertaintyJson) => r.overDraws.bcRatio.p95 - r.overDraws.bcRatio.p5;
    expect(width(drawn)).toBeGreaterThan(width(exact));
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
      ["uncertainty", DEMO, "--format", "xml"],
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
