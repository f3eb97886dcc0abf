import { existsSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { runCaptured } from "./captureIo.js";

const DEMO = "scenarios/demo.yaml";

describe("averta frontier (smoke, demo scenario)", () => {
  it("prints JSON levels whose KSI avoided never falls, and writes an SVG chart", async () => {
    const folder = mkdtempSync(join(tmpdir(), "averta-frontier-"));
    const chart = join(folder, "frontier.svg");
    const io = await runCaptured(["frontier", DEMO, "--from", "1M", "--to", "9.7M", "--steps", "3", "--format", "json", "--chart", chart]);
    const code = io.code;
    expect(code).toBe(0);
    const json = JSON.parse(io.stdout) as { levels: { budget: number; ksiAvoided: number; spend: number; status: string }[]; scenarioBudget: number };
    expect(json.levels.map((level) => level.budget)).toEqual([1e6, 3.9e6, 6.8e6, 9.7e6]);
    for (let i = 0; i < json.levels.length; i += 1) {
      expect(json.levels[i]!.status).toBe("optimal");
      expect(json.levels[i]!.spend).toBeLessThanOrEqual(json.levels[i]!.budget);
      if (i > 0) expect(json.levels[i]!.ksiAvoided).toBeGreaterThanOrEqual(json.levels[i - 1]!.ksiAvoided);
    }
    expect(json.scenarioBudget).toBe(9.7e6);
    expect(readFileSync(chart, "utf8")).toMatch(/^<svg [^>]*role="img"/);
  });

  it("refuses an existing --chart without --force before writing anything (exit 2)", async () => {
    const folder = mkdtempSync(join(tmpdir(), "averta-frontier-"));
    const chart = join(folder, "frontier.svg");
    const out = join(folder, "frontier.csv");
    writeFileSync(chart, "mine");
    const io = await runCaptured(["frontier", DEMO, "--steps", "1", "--out", out, "--chart", chart]);
    const code = io.code;
    expect(code).toBe(2);
    expect(readFileSync(chart, "utf8")).toBe("mine");
    expect(existsSync(out)).toBe(false);
  });

  it("reports a bad scenario with file:line and exit 2", async () => {
    const folder = mkdtempSync(join(tmpdir(), "averta-frontier-"));
    const bad = join(folder, "bad.yaml");
    writeFileSync(bad, readFileSync(DEMO, "utf8").replace(/^budget: 9\.7M$/m, "budget: lots"));
    const io = await runCaptured(["frontier", bad]);
    const code = io.code;
    expect(code).toBe(2);
    expect(io.stderr).toContain(`${bad}:16:`);
    expect(io.stderr).not.toContain("    at ");
  });

  it("rejects --to below --from with exit 2", async () => {
    const io = await runCaptured(["frontier", DEMO, "--from", "5M", "--to", "1M"]);
    expect(io.code).toBe(2);
    expect(io.stderr).toContain("--to");
  });
});
