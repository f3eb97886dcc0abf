import { describe, expect, it } from "vitest";
import { KSI_AVOIDED_LABEL } from "../../src/report/ksiAvoidedLabel.js";
import { runCaptured } from "./captureIo.js";

const DEMO = "scenarios/demo.yaml";

interface PlanJson {
  selected: { site: string; treatments: string[] }[];
  totals: { cost: number; ksiAvoided: number; benefitPV: number; bcRatio: number };
}
interface CompareJson {
  entering: { site: string }[];
  leaving: { site: string }[];
  changedTreatment: { site: string; before: { treatments: string[] }; after: { treatments: string[] } }[];
  change: { spend: number; ksiAvoided: number; benefitPV: number; bcRatio: number };
}

async function runJson<T>(argv: string[]): Promise<T> {
  const io = await runCaptured(argv);
  expect(io.code).toBe(0);
  return JSON.parse(io.stdout) as T;
}

describe("averta compare (smoke, demo scenario)", () => {
  it("at two budgets: entering and leaving are the set differences of the two plan JSON lists", async () => {
    const planA = await runJson<PlanJson>(["plan", DEMO, "--budget", "5M", "--format", "json"]);
    const planB = await runJson<PlanJson>(["plan", DEMO, "--budget", "9.7M", "--format", "json"]);
    const compare = await runJson<CompareJson>(["compare", DEMO, "--budget", "5M", "--budget", "9.7M", "--format", "json"]);
    const sitesA = new Set(planA.selected.map((p) => p.site));
    const sitesB = new Set(planB.selected.map((p) => p.site));
    const sorted = (xs: Iterable<string>) => [...xs].sort();
    expect(sorted(compare.entering.map((p) => p.site))).toEqual(sorted([...sitesB].filter((s) => !sitesA.has(s))));
    expect(sorted(compare.leaving.map((p) => p.site))).toEqual(sorted([...sitesA].filter((s) => !sitesB.has(s))));
    const treatmentsA = new Map(planA.selected.map((p) => [p.site, [...p.treatments].sort().join("+")]));
    const changed = planB.selected.filter((p) => treatmentsA.has(p.site) && treatmentsA.get(p.site) !== [...p.treatments].sort().join("+")).map((p) => p.site);
    expect(sorted(compare.changedTreatment.map((c) => c.site))).toEqual(sorted(changed));
    expect(compare.change.spend).toBeCloseTo(planB.totals.cost - planA.totals.cost, 6);
    expect(compare.change.ksiAvoided).toBeCloseTo(planB.totals.ksiAvoided - planA.totals.ksiAvoided, 9);
    expect(compare.change.benefitPV).toBeCloseTo(planB.totals.benefitPV - planA.totals.benefitPV, 3);
    expect(compare.change.bcRatio).toBeCloseTo(planB.totals.bcRatio - planA.totals.bcRatio, 9);
    // The two budgets differ enough that the lists differ (otherwise the test above proves little).
    expect(compare.entering.length + compare.leaving.length + compare.changedTreatment.length).toBeGreaterThan(0);
  });

  it("compares two scenarios at their own budgets, and prints a table", async () => {
    const io = await runCaptured(["compare", DEMO, "scenarios/demo-with-rules.yaml"]);
    expect(io.code).toBe(0);
    expect(io.stdout).toContain("What-if: A = scenarios/demo.yaml");
    // The K+A row and column say what is counted.
    expect(io.stdout).toContain(KSI_AVOIDED_LABEL);
  });

  it("needs exactly two budgets with one scenario (exit 2), and reports a bad budget", async () => {
    const one = await runCaptured(["compare", DEMO, "--budget", "5M"]);
    expect(one.code).toBe(2);
    expect(one.stderr).toContain("--budget");
    const bad = await runCaptured(["compare", DEMO, "--budget", "5M", "--budget", "lots"]);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toContain("'lots'");
  });

  it("says when one side has no list, and why, instead of showing it as an empty list", async () => {
    const table = await runCaptured(["compare", DEMO, "--budget", "0", "--budget", "5M"]);
    // A side without a feasible list: exit 3 (README, "Exit codes, errors and limits").
    expect(table.code).toBe(3);
    expect(table.stdout).toMatch(/Status\s+│\s+infeasible\s+│\s+optimal/);
    expect(table.stdout).toMatch(/No list in A: .*I-03/);
    const json = JSON.parse((await runCaptured(["compare", DEMO, "--budget", "0", "--budget", "5M", "--format", "json"])).stdout);
    expect(json.statusA).toBe("infeasible");
    expect(json.statusB).toBe("optimal");
    expect(json.diagnosisA).toMatch(/I-03/);
    expect(json.diagnosisB).toBeUndefined();
  });
});
