import { existsSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { runCaptured } from "./captureIo.js";

const scratch = mkdtempSync(join(tmpdir(), "averta-targets-"));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe("output files named on the command line", () => {
  it("--out with an empty name exits 2 naming --out (it used to fail as an internal fault)", async () => {
    const run = await runCaptured(["plan", "scenarios/demo.yaml", "--out", ""]);
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(/^error: --out: needs a file name/);
  });

  it("plan refuses an existing --out before reading the scenario or solving", async () => {
    const file = join(scratch, "existing-plan.txt");
    writeFileSync(file, "the user's own file");
    const run = await runCaptured(["plan", "scenarios/demo.yaml", "--out", file]);
    expect(run.code).toBe(2);
    // The scenario's warning note comes from loading it; a refusal up front never gets there.
    expect(run.stderr).not.toContain("warning(s) about the input");
    expect(run.stderr).toContain("already exists");
  });

  it("frontier refuses a --chart that is not an .svg file, and writes nothing", async () => {
    const chart = join(scratch, "chart.png");
    const run = await runCaptured(["frontier", "scenarios/demo.yaml", "--steps", "2", "--chart", chart]);
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(/^error: --chart: /);
    expect(existsSync(chart)).toBe(false);
  });

  it("frontier refuses --out and --chart naming the same file, even with --force", async () => {
    const file = join(scratch, "same.svg");
    const run = await runCaptured(["frontier", "scenarios/demo.yaml", "--steps", "2", "--out", file, "--chart", file, "--force"]);
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(/^error: --chart: names the same file as --out/);
    expect(existsSync(file)).toBe(false);
  });

  it("uncertainty names --tornado (not --out) when the chart's folder is missing, before any draws", async () => {
    const run = await runCaptured(["uncertainty", "scenarios/demo.yaml", "--draws", "2", "--threads", "1", "--tornado", join(scratch, "no-such-folder", "t.svg")]);
    expect(run.code).toBe(2);
    expect(run.stderr).toContain("choose another --tornado path");
    expect(run.stdout).toBe("");
  });

  it("report names --csv when the CSV already exists", async () => {
    const csv = join(scratch, "list.csv");
    writeFileSync(csv, "mine");
    const run = await runCaptured(["report", "scenarios/demo.yaml", "--draws", "0", "--steps", "2", "--out", join(scratch, "r.html"), "--csv", csv]);
    expect(run.code).toBe(2);
    expect(run.stderr).toContain("choose another --csv path");
    expect(readdirSync(scratch)).not.toContain("r.html");
  });
});
