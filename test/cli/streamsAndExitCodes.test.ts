import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { runCli } from "../../src/cli/runCli.js";
import { captureIo } from "./captureIo.js";

// Runs the built CLI as a user's shell would; `npm test` builds dist first.
const MAIN = "dist/src/cli/main.js";
function averta(...args: string[]) {
  return spawnSync(process.execPath, [MAIN, ...args], { encoding: "utf8" });
}

const scratch = mkdtempSync(join(tmpdir(), "averta-streams-"));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe("the built CLI: streams and exit codes", () => {
  let plan: ReturnType<typeof averta>;
  beforeAll(() => {
    plan = averta("plan", "scenarios/demo.yaml", "--format", "json");
  });

  it("plan --format json exits 0 and prints only JSON on stdout, so it can be piped", () => {
    expect(plan.status).toBe(0);
    const parsed = JSON.parse(plan.stdout) as Record<string, unknown>;
    expect(typeof parsed).toBe("object");
    expect(plan.stderr).not.toContain("{");
  });

  it("a bad file exits 2 with an empty stdout and the message on stderr", () => {
    const run = averta("plan", "test/fixtures/bad/sites-empty.yaml", "--format", "json");
    expect(run.status).toBe(2);
    expect(run.stdout).toBe("");
    expect(run.stderr).toMatch(/^error: test\/fixtures\/bad\/sites-empty\.yaml:11:8: sites: /);
  });

  it("check prints its summary on stdout and warnings on stderr", () => {
    const run = averta("check", "scenarios/demo.yaml");
    expect(run.status).toBe(0);
    expect(run.stdout).toContain("scenarios/demo.yaml: valid");
    expect(run.stdout).not.toContain("warning:");
    expect(run.stderr.split("\n").filter(Boolean).every((line) => line.startsWith("warning:"))).toBe(true);
  });

  it("an unknown command exits 2 and prints nothing on stdout", () => {
    const run = averta("frobnicate", "scenarios/demo.yaml");
    expect(run.status).toBe(2);
    expect(run.stdout).toBe("");
    expect(run.stderr).toContain("frobnicate");
  });

  it("an unknown option exits 2 and prints nothing on stdout", () => {
    const run = averta("plan", "scenarios/demo.yaml", "--budjet", "5M");
    expect(run.status).toBe(2);
    expect(run.stdout).toBe("");
    expect(run.stderr).toContain("--budjet");
  });

  it("a bad option value exits 2", () => {
    expect(averta("plan", "scenarios/demo.yaml", "--format", "xml").status).toBe(2);
    expect(averta("plan", "scenarios/demo.yaml", "--budget", "lots").status).toBe(2);
  });

  it("--out writes the file, reports it on stderr, and keeps stdout empty", () => {
    const out = join(scratch, "plan.json");
    const run = averta("plan", "scenarios/demo.yaml", "--format", "json", "--out", out);
    expect(run.status).toBe(0);
    expect(run.stdout).toBe("");
    expect(run.stderr).toContain(`wrote ${out}`);
    expect(readFileSync(out, "utf8")).toBe(plan.stdout);
  });
});

describe("--out never replaces a user's file without --force", () => {
  it("exits 2 and leaves the file as it was; with --force it is replaced", async () => {
    const out = join(scratch, "mine.csv");
    writeFileSync(out, "my notes");
    const refused = captureIo();
    expect(await runCli(["plan", "scenarios/demo.yaml", "--format", "csv", "--out", out], refused)).toBe(2);
    expect(refused.err).toContain("--force");
    expect(readFileSync(out, "utf8")).toBe("my notes");
    const forced = captureIo();
    expect(await runCli(["plan", "scenarios/demo.yaml", "--format", "csv", "--out", out, "--force"], forced)).toBe(0);
    expect(readFileSync(out, "utf8")).not.toBe("my notes");
  });
});
