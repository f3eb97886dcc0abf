import { describe, expect, it } from "vitest";
import { runCaptured } from "./captureIo.js";

// Option values a programme manager might plausibly mistype; each must be refused with exit 2,
// a message naming the option, and nothing on stdout.
describe("option values on the command line", () => {
  it("--budget 4,5M is refused (a decimal comma), not read as 45 million", async () => {
    const run = await runCaptured(["plan", "scenarios/demo.yaml", "--budget", "4,5M", "--format", "json"]);
    expect(run.code).toBe(2);
    expect(run.stdout).toBe("");
    expect(run.stderr).toMatch(/^error: --budget: '4,5M' is not an amount \(write decimals with a point/);
  });

  it("compare --budget 5M,9.7M says to give --budget twice", async () => {
    const run = await runCaptured(["compare", "scenarios/demo.yaml", "--budget", "5M,9.7M"]);
    expect(run.code).toBe(2);
    expect(run.stderr).toContain("--budget 5M --budget 9.7M");
  });

  it("--budget -1M says an amount cannot be negative", async () => {
    const run = await runCaptured(["plan", "scenarios/demo.yaml", "--budget=-1M"]);
    expect(run.code).toBe(2);
    expect(run.stderr).toContain("cannot be negative");
  });

  it("whole-number options take plain digits only (not 1e1, 0x10 or an empty value)", async () => {
    for (const steps of ["1e1", "0x10", "", "2.5"]) {
      const run = await runCaptured(["frontier", "scenarios/demo.yaml", "--steps", steps]);
      expect(run.code, `--steps '${steps}'`).toBe(2);
      expect(run.stderr).toMatch(/^error: --steps: /);
    }
  });
});

describe("frontier budget range", () => {
  it("--from at or above the full-funding cost, without --to, is refused instead of repeating one level", async () => {
    const run = await runCaptured(["frontier", "scenarios/demo.yaml", "--from", "50M", "--steps", "2", "--format", "json"]);
    expect(run.code).toBe(2);
    expect(run.stdout).toBe("");
    expect(run.stderr).toMatch(/^error: --from: 50,000,000 is at or above/);
  });

  it("--to equal to --from is refused, as --to below --from is", async () => {
    for (const to of ["5M", "1M"]) {
      const run = await runCaptured(["frontier", "scenarios/demo.yaml", "--from", "5M", "--to", to]);
      expect(run.code, `--to ${to}`).toBe(2);
      expect(run.stderr).toMatch(/^error: --to: .* is not above --from 5,000,000/);
    }
  });
});

describe("no command", () => {
  it("averta with no command prints the help on stderr and exits 2 (a usage mistake); --help exits 0", async () => {
    const bare = await runCaptured([]);
    expect(bare.code).toBe(2);
    expect(bare.stdout).toBe("");
    expect(bare.stderr).toContain("Usage: averta");
    const help = await runCaptured(["--help"]);
    expect(help.code).toBe(0);
    expect(help.stdout).toContain("Usage: averta");
    const helpCommand = await runCaptured(["help", "plan"]);
    expect(helpCommand.code).toBe(0);
  });
});

describe("input paths on the command line", () => {
  it("a folder given as the GeoJSON site map is not called a .yaml file", async () => {
    const run = await runCaptured(["tally", "--crashes", "scenarios/vellmar-crashes.csv", "--sites", "scenarios", "--out", "never-written.yaml"]);
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(/^error: scenarios: is a folder, not a file/);
    expect(run.stderr).not.toContain(".yaml file");
  });

  it("a missing scenario named on the command line is not blamed on paths inside a scenario", async () => {
    const run = await runCaptured(["plan", "scenarios/no-such.yaml"]);
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(/^error: scenarios\/no-such\.yaml: file not found \(check the spelling/);
  });
});
