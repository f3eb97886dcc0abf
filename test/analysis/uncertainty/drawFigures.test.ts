import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { preparePlan } from "../../../src/analysis/preparePlan.js";
import { drawFigures } from "../../../src/analysis/uncertainty/drawFigures.js";
import { buildDrawTables } from "../../../src/analysis/uncertainty/drawTables.js";
import { loadScenario } from "../../../src/io/loadScenario.js";
import { buildCrashMatrix } from "../../../src/model/crashMatrix.js";
import { drawRandomSource } from "../../../src/model/random/drawRandomSource.js";
import { createPcg32, type RandomSource } from "../../../src/model/random/pcg32.js";
import type { CmfCombination, RenewalRule, Scenario, SiteBaselineMethod } from "../../../src/model/types.js";
import { runCaptured } from "../../cli/captureIo.js";
import { referenceDrawSites } from "./referenceDraws.js";

const pick = <T>(random: RandomSource, values: readonly T[]): T => values[Math.floor(random.nextUnitFloat() * values.length)]!;

/**
 * A random variant of a demo scenario: a subset of its sites with rescaled crash counts (some
 * severities emptied, so observed draws spread them by the site's mix), and random renewal,
 * traffic growth, CMF combination rule and floor, baseline method, assumed CV and treatment limit.
 */
function randomScenario(base: Scenario, seed: number): Scenario {
  const random = createPcg32(BigInt(seed), 7n);
  const sites = base.sites
    .filter(() => random.nextUnitFloat() < 0.4)
    .map((site) => {
      const emptied = pick(random, ["", "K", "A", "KA", "BCO"]);
      return { ...site, crashes: buildCrashMatrix((type, severity) => (emptied.includes(severity) ? 0 : Math.round(site.crashes[type][severity] * 2 * random.nextUnitFloat()))) };
    });
  const combination: CmfCombination = { rule: pick(random, ["multiplicative", "dominant-effect", "dominant-common-residuals"] as const), ...(random.nextUnitFloat() < 0.3 ? { floor: 0.45 } : {}) };
  return {
    ...base,
    sites,
    maxTreatmentsPerSite: pick(random, [1, 2, 3]),
    baseline: pick(random, ["observed", "empirical-bayes", "auto"] as SiteBaselineMethod[] as Scenario["baseline"][]),
    economics: {
      ...base.economics,
      renewal: pick(random, ["none", "renew", "residual-value"] as RenewalRule[]),
      trafficGrowthRate: pick(random, [0, 0.02, -0.01]),
      cmfCombination: combination,
    },
    uncertainty: { assumedCmfCv: pick(random, ["off", 0.2, 0.6] as const) },
    rules: [],
  };
}

/** Every alternative's K+A avoided and benefit in one draw, by the reference path, in the fast path's flat order. */
function referenceFigures(scenario: Scenario, seed: number, draw: number, sampleBaselines: boolean): { ksi: number[]; benefit: number[] } {
  const sites = referenceDrawSites(preparePlan(scenario), draw, { seed, sampleBaselines });
  const alternatives = sites.flatMap((entry) => entry.alternatives);
  return { ksi: alternatives.map((a) => a.ksiAvoided), benefit: alternatives.map((a) => a.benefitPV) };
}

describe("the uncertainty draws' fast path (draw tables and typed arrays) computes exactly what the straightforward path computes", () => {
  const bases = [loadScenario("scenarios/demo.yaml").scenario, loadScenario("scenarios/demo-eb.yaml").scenario];

  it("gives bit-identical figures to the reference path on 200 random scenarios, with and without drawn baselines", () => {
    let compared = 0;
    for (let seed = 1; seed <= 200; seed += 1) {
      const scenario = randomScenario(bases[seed % 2]!, seed);
      const sampleBaselines = seed % 3 !== 0;
      const tables = buildDrawTables(preparePlan(scenario), sampleBaselines);
      for (const draw of [0, 7]) {
        const fast = drawFigures(tables, scenario.economics, drawRandomSource(seed, draw));
        const reference = referenceFigures(scenario, seed, draw, sampleBaselines);
        // toStrictEqual on plain arrays compares every number with Object.is: no rounding allowed.
        expect(Array.from(fast.ksiAvoided)).toStrictEqual(reference.ksi);
        expect(Array.from(fast.benefitPV)).toStrictEqual(reference.benefit);
        compared += reference.ksi.length;
      }
    }
    expect(compared).toBeGreaterThan(2_000);
  });

  it("reproduces the plan's own figures exactly when nothing is drawn (CMFs held, baselines fixed)", () => {
    for (const base of bases) {
      const scenario: Scenario = { ...base, uncertainty: { assumedCmfCv: "off" }, catalogue: { ...base.catalogue, treatments: base.catalogue.treatments.map((t) => ({ ...t, effects: t.effects.map(({ standardError: _dropped, ...effect }) => effect) })) } };
      const prepared = preparePlan(scenario);
      const fast = drawFigures(buildDrawTables(prepared, false), scenario.economics, drawRandomSource(1, 0));
      const plan = prepared.sites.flatMap((entry) => entry.alternatives);
      expect(Array.from(fast.ksiAvoided)).toStrictEqual(plan.map((a) => a.ksiAvoided));
      expect(Array.from(fast.benefitPV)).toStrictEqual(plan.map((a) => a.benefitPV));
    }
  });
});

// Outputs of `averta uncertainty` written by the release before the fast path (commit f06baa3),
// same arguments: the fast path must not change a byte of them.
describe("uncertainty output is byte-identical to the release before the fast path, for the same seed", () => {
  const F = "test/fixtures/uncertainty";
  const cases: readonly (readonly [string, readonly string[]])[] = [
    ["demo.json", ["scenarios/demo.yaml", "-n", "120", "-s", "11", "-f", "json"]],
    ["demo.txt", ["scenarios/demo.yaml", "-n", "120", "-s", "11"]],
    ["demo.csv", ["scenarios/demo.yaml", "-n", "120", "-s", "11", "-f", "csv"]],
    ["demo-fixed-baseline.json", ["scenarios/demo.yaml", "-n", "120", "-s", "5", "-f", "json", "--fixed-baseline"]],
    ["demo-eb.json", ["scenarios/demo-eb.yaml", "-n", "120", "-s", "11", "-f", "json"]],
    ["demo-with-rules.json", ["scenarios/demo-with-rules.yaml", "-n", "120", "-s", "11", "-f", "json"]],
    ["variant-b.json", [`${F}/variant-b.yaml`, "-n", "120", "-s", "4", "-f", "json", "-b", "6M"]],
  ];
  for (const [file, args] of cases) {
    it(`${file}: ${args.join(" ")}`, async () => {
      const run = await runCaptured(["uncertainty", ...args, "-t", "1"]);
      expect(run.code).toBe(0);
      expect(run.stdout === readFileSync(`${F}/${file}`, "utf8")).toBe(true);
    });
  }

  it("and the same bytes on two threads", async () => {
    const run = await runCaptured(["uncertainty", "scenarios/demo-eb.yaml", "-n", "120", "-s", "11", "-f", "json", "-t", "2"]);
    expect(run.stdout === readFileSync(`${F}/demo-eb.json`, "utf8")).toBe(true);
  });
});
