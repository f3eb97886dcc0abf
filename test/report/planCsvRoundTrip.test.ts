import { CSV_PREAMBLE_LINES } from "../../src/report/csvPreamble.js";
import { beforeAll, describe, expect, it } from "vitest";
import { planProgramme, type PlanResult } from "../../src/analysis/planProgramme.js";
import { preparePlan } from "../../src/analysis/preparePlan.js";
import { loadScenario } from "../../src/io/loadScenario.js";
import type { Scenario } from "../../src/model/types.js";
import { planCsv } from "../../src/report/planCsv.js";
import { planJson } from "../../src/report/planJson.js";
import { parseCsv } from "./parseCsv.js";

// Site names a spreadsheet would run as formulas (OWASP "CSV Injection": cells starting with =, +, -, @).
const HOSTILE_NAMES = ['=HYPERLINK("http://example.invalid","x")', "+1+1", "-2+3", "@SUM(A1:A2)"];

let result: PlanResult;
beforeAll(async () => {
  const { scenario } = loadScenario("scenarios/demo.yaml");
  // Rename the first sites, which the demo list funds at its budget (checked below).
  const hostile: Scenario = { ...scenario, sites: scenario.sites.map((site, index) => (index < HOSTILE_NAMES.length ? { ...site, name: HOSTILE_NAMES[index]! } : site)) };
  result = await planProgramme(preparePlan(hostile));
});

describe("capital list CSV export", () => {
  it("neutralises formula-leading cells with a leading quote mark", () => {
    const rows = parseCsv(planCsv(result)).slice(CSV_PREAMBLE_LINES);
    const names = rows.slice(1).map((row) => row[1]);
    for (const name of HOSTILE_NAMES) {
      expect(names).toContain(`'${name}`);
      expect(names).not.toContain(name);
    }
  });

  it("round-trips through an RFC 4180 parser to the same numbers as the plan's JSON", () => {
    const [header, ...rows] = parseCsv(planCsv(result)).slice(CSV_PREAMBLE_LINES);
    const json = planJson(result) as { selected: { site: string; cost: number; lifecycleCostPV: number; ksiAvoided: number; benefitPV: number; bcRatio: number | null; npv: number; costPerKsi: number | null }[] };
    expect(rows).toHaveLength(json.selected.length);
    expect(rows.length).toBeGreaterThan(0);
    const column = (name: string) => header!.indexOf(name);
    for (const name of ["capital_cost_USD", "ksi_avoided", "bc_ratio", "npv_USD", "cost_per_ksi_USD"]) expect(column(name)).toBeGreaterThanOrEqual(0);
    rows.forEach((row, index) => {
      const selected = json.selected[index]!;
      expect(row[column("site_id")]).toBe(selected.site);
      // Exact equality: both sides are JavaScript's shortest round-trip decimal form of the same double.
      expect(Number(row[column("capital_cost_USD")])).toBe(selected.cost);
      expect(Number(row[column("lifecycle_cost_pv_USD")])).toBe(selected.lifecycleCostPV);
      expect(Number(row[column("ksi_avoided")])).toBe(selected.ksiAvoided);
      expect(Number(row[column("benefit_pv_USD")])).toBe(selected.benefitPV);
      expect(Number(row[column("bc_ratio")])).toBe(selected.bcRatio);
      expect(Number(row[column("npv_USD")])).toBe(selected.npv);
      expect(Number(row[column("cost_per_ksi_USD")])).toBe(selected.costPerKsi);
    });
  });
});
