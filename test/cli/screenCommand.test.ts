import { CSV_PREAMBLE_LINES } from "../../src/report/csvPreamble.js";
import { describe, expect, it } from "vitest";
import type { CliIo } from "../../src/cli/CliIo.js";
import { runCli } from "../../src/cli/runCli.js";

function capture(): CliIo & { out: string[]; err: string[] } {
  const out: string[] = [];
  const err: string[] = [];
  return { out, err, stdout: (t) => out.push(t), stderr: (t) => err.push(t), stderrIsTty: false };
}

describe("averta screen", () => {
  it("prints a ranked table with a proposal", async () => {
    const io = capture();
    expect(await runCli(["screen", "scenarios/demo.yaml", "--top", "5"], io)).toBe(0);
    expect(io.out.join("")).toMatch(/Proposed for the programme \(top 5 by excess\): [A-Z]-\d\d(, [A-Z]-\d\d){4}/);
  });
  it("writes JSON and CSV with every site", async () => {
    const json = capture();
    expect(await runCli(["screen", "scenarios/demo-eb.yaml", "--format", "json"], json)).toBe(0);
    const parsed = JSON.parse(json.out.join("")) as { sites: unknown[]; proposed: string[] };
    expect(parsed.sites).toHaveLength(51);
    expect(parsed.proposed).toHaveLength(10);
    const csv = capture();
    expect(await runCli(["screen", "scenarios/demo.yaml", "-f", "csv"], csv)).toBe(0);
    expect(csv.out.join("").trim().split("\r\n")).toHaveLength(CSV_PREAMBLE_LINES + 52);
  });
  it("rejects a bad --top with exit code 2", async () => {
    expect(await runCli(["screen", "scenarios/demo.yaml", "--top", "0"], capture())).toBe(2);
  });
});

describe("averta plan on the Empirical Bayes demo", () => {
  it("plans with the EB baseline and no fallback warnings", async () => {
    const io = capture();
    expect(await runCli(["plan", "scenarios/demo-eb.yaml"], io)).toBe(0);
    expect(io.out.join("")).toMatch(/Baseline: empirical-bayes\s+Status: optimal/);
    expect(io.err.join("")).not.toMatch(/eb-fallback|not Empirical Bayes/);
  });
});
