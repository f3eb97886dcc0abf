import { BENEFIT_START_LAG_YEARS } from "../../model/programmeTypes.js";
import { formatFixed, formatMoney } from "../formatNumber.js";
import { escapeHtml } from "./escapeHtml.js";
import { programmeTimelineSvg, yearSpendChartSvg } from "./programmeCharts.js";
import type { ReportInput } from "./ReportInput.js";

/** The multi-year programme in the report: timeline, spend against each year's budget, and the year-by-year table (empty for a one-year list). */
export function programmeSection(input: ReportInput): string {
  const { plan } = input;
  const programme = plan.prepared.scenario.programme;
  if (programme === undefined || plan.years === undefined) return "";
  const currency = escapeHtml(plan.prepared.scenario.currency);
  const rows = plan.years
    .map((year) => `<tr><td>${year.year}</td><td class="num">${formatMoney(year.budget)}</td><td class="num">${formatMoney(year.carriedIn)}</td><td class="num">${formatMoney(year.spend)}</td><td class="num">${formatMoney(year.unspent)}</td><td class="num">${year.projects}</td><td class="num">${formatFixed(year.ksiAvoided, 2)}</td><td class="num">${formatFixed(year.cumulativeKsiAvoided, 2)}</td></tr>`)
    .join("\n");
  return `<section id="programme">
<h2>The programme year by year</h2>
<p>${programme.firstYear}–${programme.firstYear + programme.years - 1}, carry-over ${escapeHtml(programme.carryOver)}${programme.costEscalationRate === 0 ? "" : `, capital costs escalating ${formatFixed(programme.costEscalationRate * 100, 1)}% a year`}. Benefits start ${BENEFIT_START_LAG_YEARS} year after the build year; money is discounted to ${programme.firstYear}; the horizon counts from ${programme.firstYear}, so a later build has fewer years of benefit in it.</p>
<figure>${programmeTimelineSvg(plan)}<figcaption class="figure-note">One row per project. Vermillion: its build year; orange: capital phased before it (design); green: in service, from the year after the build year.</figcaption></figure>
<figure>${yearSpendChartSvg(plan, plan.prepared.scenario.currency)}<figcaption class="figure-note">Filled: capital spent in the year. Dashed: the year's budget plus what earlier years carried in (${currency}).</figcaption></figure>
<table class="list compact" id="programme-years">
<caption>Spend against each year's budget (money in ${currency})</caption>
<thead><tr><th>Year</th><th class="num">Budget</th><th class="num">Carried in</th><th class="num">Spent</th><th class="num">Unspent</th><th class="num">Projects built</th><th class="num">K+A avoided by them</th><th class="num">Cumulative K+A avoided</th></tr></thead>
<tbody>
${rows}
</tbody>
</table>
<p class="note">The robustness and sensitivity sections are not yet computed for a multi-year programme: the draws of CMFs and baselines do not model build years. The later years rest on today's crash data and CMFs; re-plan every year.</p>
</section>`;
}
