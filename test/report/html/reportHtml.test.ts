import { CSV_PREAMBLE_LINES } from "../../../src/report/csvPreamble.js";
import { beforeAll, describe, expect, it } from "vitest";
import { casePlan, type PlanCase } from "../../../src/analysis/casePlan.js";
import { planProgramme, type PlanResult } from "../../../src/analysis/planProgramme.js";
import { preparePlan } from "../../../src/analysis/preparePlan.js";
import { analyseUncertainty } from "../../../src/analysis/uncertainty/analyseUncertainty.js";
import { oneAtATimeSensitivity } from "../../../src/analysis/uncertainty/oneAtATimeSensitivity.js";
import { loadScenario } from "../../../src/io/loadScenario.js";
import { CAUTIONS } from "../../../src/report/cautions.js";
import { formatMoney } from "../../../src/report/formatNumber.js";
import { capitalListSection } from "../../../src/report/html/capitalListSection.js";
import { reportHtml } from "../../../src/report/html/reportHtml.js";
import type { ReportInput, ReportUncertainty } from "../../../src/report/html/ReportInput.js";
import { syntheticPlan } from "../../analysis/syntheticPlan.js";

let plan: PlanResult;
let planCase: PlanCase;
let base: ReportInput;
let uncertainty: ReportUncertainty;
beforeAll(async () => {
  const { scenario } = loadScenario("scenarios/demo.yaml");
  const prepared = preparePlan(scenario);
  plan = await planProgramme(prepared);
  planCase = await casePlan(plan);
  base = { plan, planCase, frontier: [{ budget: plan.budget, plan }], warnings: [{ where: "demo.yaml:3:1", message: "a <b>warning</b>" }], csvFileName: "list.csv" };
  // Few draws keep the test quick; what is checked is that the report shows what the analysis found.
  const draws = await analyseUncertainty(prepared, { draws: 24, seed: 11, threads: 1, sampleBaselines: true, budget: plan.budget, solveOptions: {} });
  uncertainty = { draws, sensitivity: await oneAtATimeSensitivity(plan) };
});

/** The HTML of one `<tbody>` of a section, by its site id. */
function projectBlock(html: string, section: string, site: string): string {
  const body = html.slice(html.indexOf(`<section id="${section}">`));
  const start = body.indexOf(`<tbody class="project" data-site="${site}"`);
  expect(start).toBeGreaterThan(-1);
  return body.slice(start, body.indexOf("</tbody>", start));
}

describe("reportHtml: the case for the list (justification, upgrades, ranking)", () => {
  it("states the gain over the B/C ranking that casePlan computed", () => {
    const html = reportHtml(base);
    const gain = /id="summary-gain" data-extra-ksi="([^"]+)"/.exec(html);
    expect(Number(gain![1])).toBe(planCase.ranking.extraKsiAvoided);
    // The demo is a case where ranking by B/C leaves money on the table: the optimal list avoids more.
    expect(planCase.ranking.extraKsiAvoided).toBeGreaterThan(1);
    expect(html).toContain(`${planCase.ranking.rankingTotals.projects} projects, ${formatMoney(planCase.ranking.rankingTotals.cost)} USD spent`);
  });

  it("shows both lists' spend and the comparison at equal spend, two ways", () => {
    const html = reportHtml(base);
    const gain = html.slice(html.indexOf('id="summary-gain"'), html.indexOf("</div>", html.indexOf('id="summary-gain"')));
    const row = (list: string) => new RegExp(`<tr data-list="${list}">(.*?)</tr>`).exec(gain)![1]!;
    const cells = (list: string) => [...row(list).matchAll(/<td class="num">([^<]*)<\/td>/g)].map((m) => m[1]);
    const { ranking, atRankingSpend, extendedRanking } = planCase;
    // Budget, spend, projects, K+A crashes avoided (one decimal), benefit PV: the analysis's own figures.
    expect(cells("optimal")).toEqual([formatMoney(plan.budget), formatMoney(plan.totals.cost), String(plan.totals.projects), plan.totals.ksiAvoided.toFixed(1), formatMoney(plan.totals.benefitPV)]);
    expect(cells("ranking").slice(0, 2)).toEqual([formatMoney(plan.budget), formatMoney(ranking.rankingTotals.cost)]);
    // (a) solved with the budget set to the ranking's spend; (b) the ranking carried on within the full budget.
    expect(cells("optimal-at-ranking-spend").slice(0, 2)).toEqual([formatMoney(ranking.rankingTotals.cost), formatMoney(atRankingSpend.plan.totals.cost)]);
    expect(cells("extended-ranking").slice(0, 2)).toEqual([formatMoney(plan.budget), formatMoney(extendedRanking.totals.cost)]);
    expect(Number(/data-extra-ksi-at-ranking-spend="([^"]+)"/.exec(gain)![1])).toBe(atRankingSpend.extraKsiAvoided);
    expect(Number(/data-extra-ksi-over-extended="([^"]+)"/.exec(gain)![1])).toBe(extendedRanking.extraKsiAvoided);
    // On the demo the plain ranking stops far short of the budget, so the equal-spend figures differ from the plain gain.
    expect(ranking.rankingTotals.cost).toBeLessThan(0.8 * plan.totals.cost);
    expect(atRankingSpend.extraKsiAvoided!).toBeGreaterThan(0);
    expect(atRankingSpend.extraKsiAvoided!).toBeLessThan(ranking.extraKsiAvoided);
    expect(extendedRanking.totals.cost).toBeGreaterThan(ranking.rankingTotals.cost);
    expect(extendedRanking.totals.cost).toBeLessThanOrEqual(plan.budget);
  });

  it("gives each funded project its B/C rank and cost per K+A crash avoided from the justification", () => {
    const html = reportHtml(base);
    for (const project of planCase.justification.funded) {
      const block = projectBlock(html, "capital-list", project.site);
      expect(block).toMatch(new RegExp(`${project.bcRank}(st|nd|rd|th) of ${planCase.justification.funded.length} by B/C`));
      expect(block).toContain(`${formatMoney(project.costPerKsi)} lifecycle cost per K+A crash avoided`);
    }
    expect(planCase.justification.funded.length).toBe(plan.funded.length);
  });

  it("flags exactly the upgrades whose incremental B/C is below 1", () => {
    const html = reportHtml(base);
    const list = html.slice(html.indexOf('<section id="capital-list">'), html.indexOf("</section>", html.indexOf('<section id="capital-list">')));
    const flagged = planCase.upgrades.filter((check) => check.forKsiNotMoney);
    expect(list.match(/<span class="tag flag"/g)?.length ?? 0).toBe(flagged.length);
    for (const check of planCase.upgrades) {
      expect(projectBlock(html, "capital-list", check.site).includes("tag flag")).toBe(check.forKsiNotMoney);
    }
  });

  it("flags an upgrade chosen for K+A crashes avoided, not money, with its incremental B/C (the demo has none)", async () => {
    // The upgrade adds 2 KSI worth 200 for 300 more lifecycle cost: ΔB/ΔC = 200/300 < 1 (HSM Part B, Ch. 7), yet it avoids more KSI.
    const flagged = await planProgramme(syntheticPlan([{ id: "A", options: [{ cost: 100, ksi: 5, benefit: 1000 }, { cost: 400, ksi: 7, benefit: 1200 }] }], 500));
    const flaggedCase = await casePlan(flagged);
    expect(flaggedCase.upgrades.map((check) => check.forKsiNotMoney)).toEqual([true]);
    const html = capitalListSection({ plan: flagged, planCase: flaggedCase, frontier: [{ budget: 500, plan: flagged }], warnings: [], csvFileName: "x.csv" });
    expect(html.match(/<span class="tag flag"/g)).toHaveLength(1);
    expect(html).toContain("Chosen for K+A crashes avoided, not money: the step up from t0 has incremental B/C 0.67, below 1; on money alone the site would get t0.");
    expect(html).toContain("1 project is an upgrade whose extra cost");
  });

  it("explains every site left out with the justification's reason and threshold", () => {
    const html = reportHtml(base);
    const notFunded = planCase.justification.notFunded;
    expect(notFunded.length).toBeGreaterThan(0);
    let withThreshold = 0;
    for (const site of notFunded) {
      const block = projectBlock(html, "not-funded", site.site);
      expect(block).toContain(`data-reason="${site.reason}"`);
      const threshold = site.threshold;
      if (site.reason === "budget" && threshold !== null && threshold.costCut > 0 && threshold.costThreshold > 0) {
        expect(block).toContain(`cost at most about ${formatMoney(threshold.costThreshold)}`);
        expect(block).toContain(`${formatMoney(threshold.costCut)} or`);
        withThreshold += 1;
      }
    }
    expect(withThreshold).toBeGreaterThan(0);
    expect(html).toContain('id="threshold-method"');
    expect(html).toContain("Limits: this is exact for the LP relaxation only");
  });
});

describe("reportHtml: robustness and sensitivity from the uncertainty analysis", () => {
  it("leaves both out, and the draws column, when no analysis was given", () => {
    const html = reportHtml(base);
    expect(html).not.toContain('id="robustness"');
    expect(html).not.toContain('id="sensitivity"');
    expect(html).not.toContain("Selected in draws");
  });

  it("shows each funded project's selection probability and class as analyseUncertainty found them", () => {
    const html = reportHtml({ ...base, uncertainty });
    const inPlan = uncertainty.draws.summary.selections.filter((s) => s.inPlan);
    expect(inPlan.length).toBe(plan.funded.length);
    for (const selection of inPlan) {
      const block = projectBlock(html, "capital-list", selection.site);
      expect(block).toContain(`class="num selection ${selection.class}" data-probability="${selection.probability}"`);
    }
    const core = inPlan.filter((s) => s.class === "core").length;
    expect(html).toMatch(new RegExp(`id="robustness-classes">Selection shares, [^<]*<span class="effects-uncertain">[^<]+</span>: of the ${inPlan.length} funded projects, <strong>${core}</strong> are`));
  });

  it("states beside every probability how many effects were uncertain, and labels K+A crashes", () => {
    const html = reportHtml({ ...base, uncertainty });
    const section = html.slice(html.indexOf('<section id="robustness">'), html.indexOf("</section>", html.indexOf('<section id="robustness">')));
    const { effects } = uncertainty.draws;
    // The demo catalogue: 7 of its candidates' effects publish a standard error; the rest take the default CV.
    expect(effects.withStandardError).toBe(7);
    expect(effects.heldExact).toBe(0);
    const basis = `${effects.total} of ${effects.total} effects uncertain (7 with a published standard error, ${effects.total - 7} with the assumed CV)`;
    const { draws, summary } = uncertainty.draws;
    expect(section).toContain(`(${Math.round(summary.probabilityBcAboveOne * draws)} of ${draws}; <span class="effects-uncertain">${basis}</span>)`);
    expect(section).toContain("K+A crashes avoided");
    expect(section).not.toContain("KSI crashes avoided");
    expect(section).toContain("0.2 × CMF");
    expect(section).toContain("Jeffreys prior");
    const list = html.slice(html.indexOf('<section id="capital-list">'), html.indexOf("</section>", html.indexOf('<section id="capital-list">')));
    expect(list).toContain(basis);
  });

  it("flags the shaky funded projects in the summary, largest cost first, with what would replace each", () => {
    const html = reportHtml({ ...base, uncertainty });
    const { shaky } = uncertainty.draws.summary;
    const summary = html.slice(html.indexOf('<section id="summary">'), html.indexOf("</section>", html.indexOf('<section id="summary">')));
    expect(summary).toContain(`id="summary-shaky" data-shaky="${shaky.length}"`);
    // Every funded project below half the draws, and no other, in order of falling cost.
    const expected = uncertainty.draws.summary.selections.filter((s) => s.inPlan && s.probability < 0.5).map((s) => s.site);
    expect(shaky.map((s) => s.site).sort()).toEqual(expected.sort());
    expect(shaky.length).toBeGreaterThan(0);
    for (let i = 1; i < shaky.length; i += 1) expect(shaky[i - 1]!.cost).toBeGreaterThanOrEqual(shaky[i]!.cost);
    const listed = [...summary.matchAll(/<li data-site="([^"]+)"/g)].map((match) => match[1]);
    expect(listed).toEqual(shaky.map((s) => s.site));
    for (const project of shaky) {
      const item = summary.slice(summary.indexOf(`<li data-site="${project.site}"`), summary.indexOf("</li>", summary.indexOf(`<li data-site="${project.site}"`)));
      for (const replacement of project.replacements) expect(item).toContain(`<span class="site-id">${replacement.site}</span>`);
    }
    expect(reportHtml(base)).not.toContain('id="summary-shaky"');
  });

  it("draws the tornado inline and lists every sensitivity row", () => {
    const html = reportHtml({ ...base, uncertainty });
    const section = html.slice(html.indexOf('<section id="sensitivity">'), html.indexOf("</section>", html.indexOf('<section id="sensitivity">')));
    expect(section).toContain('<figure class="tornado"><svg xmlns="http://www.w3.org/2000/svg"');
    const rows = uncertainty.sensitivity.rows;
    expect(rows.length).toBeGreaterThan(3);
    expect(section.match(/<tbody>[^]*<\/tbody>/)![0].match(/<tr>/g)).toHaveLength(rows.length);
    const changing = rows.filter((row) => row.low.listChanges || row.high.listChanges).length;
    expect(section).toContain(`${changing} of ${rows.length} assumptions would change it`);
  });

  it("is a pure function: the same input gives the same bytes", () => {
    expect(reportHtml({ ...base, uncertainty })).toBe(reportHtml({ ...base, uncertainty }));
  });
});

describe("reportHtml: cautions, warnings, export", () => {
  it("carries every caution, the warnings escaped, and a CSV data: link", () => {
    const html = reportHtml(base);
    for (const caution of CAUTIONS) expect(html).toContain(caution.replace(/'/g, "&#39;"));
    expect(html).toContain("a &lt;b&gt;warning&lt;/b&gt;");
    const link = /href="data:text\/csv;charset=utf-8,([^"]*)"/.exec(html);
    expect(link).not.toBeNull();
    const csv = decodeURIComponent(link![1]!).split("\r\n");
    expect(csv[0]).toContain("# averta | plan of scenario");
    expect(csv[CSV_PREAMBLE_LINES]).toMatch(/^site_id,site_name,/);
  });
});
