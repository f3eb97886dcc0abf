import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { afterAll, describe, expect, it } from "vitest";

// Runs the built CLI as a user's shell would; `npm test` builds dist first.
const MAIN = "dist/src/cli/main.js";
function averta(...args: string[]) {
  return spawnSync(process.execPath, [MAIN, ...args], { encoding: "utf8" });
}

const scratch = mkdtempSync(join(tmpdir(), "averta-exit-"));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

// 301 small sites: one more than the lp-solver engine takes, so with --engine lp-solver no list is solved.
function manySitesScenario(): string {
  const sites = Array.from({ length: 301 }, (_, i) =>
    [
      `  - id: X-${i}`,
      `    name: Site ${i}`,
      "    kind: intersection",
      "    district: North",
      "    crashes: { pedestrian: { A: 1, B: 2 } }",
      "    candidates: [leading-pedestrian-interval]",
    ].join("\n"),
  );
  const text = [
    "name: Many sites",
    `catalogues: [${JSON.stringify(resolve("catalogs/demo-catalogue.yaml"))}]`,
    "currency: USD",
    "budget: 1M",
    "crashWindow: { firstYear: 2021, lastYear: 2025 }",
    "economics:",
    "  discountRate: 0.04",
    "  horizonYears: 20",
    "  crashCosts: { K: 11295400, A: 655000, B: 198500, C: 125600, O: 11900, source: FHWA-SA-17-071 (from memory) }",
    "baseline: observed",
    "sites:",
    ...sites,
    "",
  ].join("\n");
  const file = join(scratch, "many-sites.yaml");
  writeFileSync(file, text);
  return file;
}

describe("exit codes of the commands that solve (README: Exit codes, errors and limits)", () => {
  it("plan: an infeasible budget exits 3, still prints the result with its diagnosis, and says why on stderr", () => {
    // The demo's must-fund beacon at I-03 costs 30,000: a budget of 1 cannot pay for it.
    const run = averta("plan", "scenarios/demo.yaml", "--budget", "1", "--format", "json");
    expect(run.status).toBe(3);
    const json = JSON.parse(run.stdout) as { status: string; diagnosis: string; selected: unknown[] };
    expect(json.status).toBe("infeasible");
    expect(json.diagnosis).toMatch(/must-fund/);
    expect(json.selected).toEqual([]);
    expect(run.stderr).toMatch(/^error: no feasible list within 1: .*\(exit 3\)$/m);
  });

  it("plan: no list solved (the lp-solver engine refuses 301 sites) exits 4, distinct from bad input (2) and faults (1)", () => {
    const run = averta("plan", manySitesScenario(), "--engine", "lp-solver", "--format", "json");
    expect(run.status).toBe(4);
    const json = JSON.parse(run.stdout) as { status: string; engine: string };
    expect(json.status).toBe("not-solved");
    expect(json.engine).toBe("lp-solver");
    expect(run.stderr).toMatch(/\(exit 4\)$/m);
  });

  it("frontier: levels below the must-fund cost are part of the result (exit 0); no level with a list exits 3", () => {
    const some = averta("frontier", "scenarios/demo.yaml", "--steps", "2", "--format", "json");
    expect(some.status).toBe(0);
    const rows = (JSON.parse(some.stdout) as { levels: { status: string }[] }).levels.map((level) => level.status);
    expect(rows[0]).toBe("infeasible");
    expect(rows).toContain("optimal");
    const none = averta("frontier", "scenarios/demo.yaml", "--to", "20000", "--steps", "2", "--format", "json");
    expect(none.status).toBe(3);
  });

  it("frontier: a level that was not solved exits 4", () => {
    const run = averta("frontier", manySitesScenario(), "--engine", "lp-solver", "--steps", "1", "--format", "json");
    expect(run.status).toBe(4);
  });

  it("compare: one side without a feasible list exits 3", () => {
    const run = averta("compare", "scenarios/demo.yaml", "--budget", "1", "--budget", "5M");
    expect(run.status).toBe(3);
    expect(run.stdout).toContain("infeasible");
  });

  it("uncertainty and report: an infeasible list exits 3 (the report is still written, with its diagnosis)", () => {
    expect(averta("uncertainty", "scenarios/demo.yaml", "--budget", "1", "--draws", "2", "--threads", "1", "--format", "json").status).toBe(3);
    const out = join(scratch, "infeasible.html");
    const report = averta("report", "scenarios/demo.yaml", "--budget", "1", "--draws", "0", "--steps", "2", "--out", out);
    expect(report.status).toBe(3);
    expect(existsSync(out)).toBe(true);
  });

  it("plan: a feasible list exits 0", () => {
    expect(averta("plan", "scenarios/demo.yaml", "--format", "json").status).toBe(0);
  });
});
