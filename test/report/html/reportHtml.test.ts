import { beforeAll, describe, expect, it } from "vitest";
import { planProgramme, type PlanResult } from "../../../src/analysis/planProgramme.js";
import { preparePlan } from "../../../src/analysis/preparePlan.js";
import { loadScenario } from "../../../src/io/loadScenario.js";
import { CAUTIONS } from "../../../src/report/cautions.js";
import { reportHtml } from "../../../src/report/html/reportHtml.js";
import type { ReportInput } from "../../../src/report/html/ReportInput.js";

let plan: PlanResult;
let base: ReportInput;
beforeAll(async () => {
  const { scenario } = loadScenario("scenarios/demo.yaml");
  plan = await planProgramme(preparePlan(scenario));
  base = { plan, frontier: [{ budget: plan.budget, plan }], warnings: [{ where: "demo.yaml:3:1", message: "a <b>warning</b>" }], csvFileName: "list.csv" };
});

describe("reportHtml optional inputs (seams for other analyses)", () => {
  it("leaves out robustness, sensitivity and the ranking gain when not given", () => {
    const html = reportHtml(base);
    expect(html).not.toContain('id="robustness"');
    expect(html).not.toContain('id="sensitivity"');
    expect(html).not.toContain('id="summary-gain"');
    expect(html).not.toContain("Funded in draws");
  });

  it("renders each one when given, with figures computed from it", () => {
    const first = plan.funded[0]!.entry.site.id;
    const html = reportHtml({
      ...base,
      robustness: { selectionProbability: new Map([[first, 0.42]]), draws: 200, method: "CMFs drawn from their standard errors" },
      sensitivity: { description: "Discount rate varied.", cases: [{ label: "discount rate 7%", projects: 40, cost: 9_600_000, ksiAvoided: 150.3 }] },
      rankingComparison: { method: "funding sites in order of B/C", projects: 30, cost: 9_500_000, ksiAvoided: plan.totals.ksiAvoided - 12.5 },
      reasons: new Map([[first, "Richer reason from elsewhere."]]),
    });
    expect(html).toContain('id="robustness"');
    expect(html).toContain("42%");
    expect(html).toContain('id="sensitivity"');
    expect(html).toContain("discount rate 7%");
    expect(html).toMatch(/id="summary-gain"[^]*12\.5 more KSI crashes/);
    expect(html).toContain("Richer reason from elsewhere.");
  });

  it("carries every caution, the warnings escaped, and a CSV data: link", () => {
    const html = reportHtml(base);
    for (const caution of CAUTIONS) expect(html).toContain(caution.replace(/'/g, "&#39;"));
    expect(html).toContain("a &lt;b&gt;warning&lt;/b&gt;");
    expect(html).toMatch(/href="data:text\/csv;charset=utf-8,site_id%2Csite_name/);
  });
});
