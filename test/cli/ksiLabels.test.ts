import { mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { KSI_AVOIDED_LABEL } from "../../src/report/ksiAvoidedLabel.js";
import { marginalValueUnit } from "../../src/report/marginalValueWords.js";
import { runCaptured } from "./captureIo.js";

const DEMO = "scenarios/demo.yaml";
// "KSI" alone could be read as people killed or seriously injured; here it is only ever said of crashes.
const BARE_KSI = /\bKSI\b(?! crashes)/;

/** Lines where "KSI" stands without "crashes" after it. */
function bareKsi(text: string): string[] {
  return text.split("\n").filter((line) => BARE_KSI.test(line));
}

describe("labels say K+A crashes, not people, in every table, chart and JSON definition (demo scenario)", () => {
  const outputs: Record<string, string> = {};
  let folder: string;
  beforeAll(async () => {
    folder = mkdtempSync(join(tmpdir(), "averta-labels-"));
    const run = async (name: string, argv: string[]) => {
      const io = await runCaptured(argv);
      expect(io.code, name).toBe(0);
      outputs[name] = io.stdout;
    };
    await run("plan table", ["plan", DEMO]);
    await run("plan json", ["plan", DEMO, "--format", "json"]);
    await run("compare table", ["compare", DEMO, "--budget", "5M", "--budget", "9.7M"]);
    await run("compare json", ["compare", DEMO, "--budget", "5M", "--budget", "9.7M", "--format", "json"]);
    await run("frontier table", ["frontier", DEMO, "--steps", "2"]);
    await run("frontier json", ["frontier", DEMO, "--steps", "2", "--format", "json", "--chart", join(folder, "f.svg")]);
    await run("screen table", ["screen", DEMO, "--top", "3"]);
    // The uncertainty sections are left out: they are labelled with the uncertainty command's own outputs.
    expect((await runCaptured(["report", DEMO, "--out", join(folder, "r.html"), "--steps", "2", "--draws", "0"])).code).toBe(0);
    outputs["report html"] = readFileSync(join(folder, "r.html"), "utf8");
    outputs["frontier svg"] = readFileSync(join(folder, "f.svg"), "utf8");
  });

  it("never says KSI without saying crashes, and names K+A crashes avoided in each output that counts them", () => {
    for (const [name, text] of Object.entries(outputs)) {
      expect(bareKsi(text), name).toEqual([]);
      if (name !== "screen table" && !name.endsWith("json")) expect(text, name).toContain(KSI_AVOIDED_LABEL);
    }
    expect(outputs["screen table"]).toMatch(/K\+A crashes\/yr/);
  });

  it("defines ksiAvoided in the JSON outputs as K+A crashes, not people, keeping the key", () => {
    for (const name of ["plan json", "compare json", "frontier json"]) {
      const json = JSON.parse(outputs[name]!) as { definitions: { ksiAvoided: string } };
      expect(json.definitions.ksiAvoided, name).toMatch(/K\+A/);
      expect(json.definitions.ksiAvoided, name).toMatch(/not people/);
    }
    const plan = JSON.parse(outputs["plan json"]!) as { totals: { ksiAvoided: number }; selected: { ksiAvoided: number }[] };
    expect(plan.totals.ksiAvoided).toBeGreaterThan(0);
  });

  it("explains the budget's marginal value (λ) in words, per extra 1M of the scenario's currency, wherever it is shown", () => {
    const unit = marginalValueUnit("ksi", "USD");
    for (const name of ["plan table", "report html"]) {
      expect(outputs[name], name).toContain("λ");
      expect(outputs[name], name).toContain(unit);
    }
    const plan = JSON.parse(outputs["plan json"]!) as {
      budgetMarginalValue: number;
      definitions: { budgetMarginalValue: string };
      justification: { budgetMarginalValue: number; budgetMarginalValuePerMillion: number; budgetMarginalValueDefinition: string };
    };
    expect(plan.definitions.budgetMarginalValue).toContain(unit);
    expect(plan.justification.budgetMarginalValueDefinition).toContain(unit);
    expect(plan.justification.budgetMarginalValuePerMillion).toBeCloseTo(plan.justification.budgetMarginalValue * 1e6, 9);
    // The table shows the same per-1M figure the JSON gives (two decimals).
    expect(outputs["plan table"]).toContain(`λ = ${plan.justification.budgetMarginalValuePerMillion.toFixed(2)} ${unit}`);
    expect(outputs["frontier table"]).toContain("K+A crashes avoided per extra 1M USD");
  });
});
