import { formatFixed, formatMoney } from "../formatNumber.js";
import { escapeHtml } from "./escapeHtml.js";
import { frontierChartSvg } from "./frontierChartSvg.js";
import { frontierSliderData } from "./frontierSliderData.js";
import { hasList } from "../hasList.js";
import type { ReportInput } from "./ReportInput.js";
import { scriptJson } from "./scriptJson.js";

/**
 * What each budget buys: the frontier chart, the interactive slider over the precomputed
 * optimal lists (data embedded as JSON), and a table of the levels for print.
 */
export function budgetSection(input: ReportInput): string {
  const { plan, frontier } = input;
  const scenario = plan.prepared.scenario;
  const currency = escapeHtml(scenario.currency);
  const data = frontierSliderData(scenario, frontier, plan.budget);
  const total = (id: string, label: string) => `<div><dt>${label}</dt><dd id="slider-${id}"></dd></div>`;
  const levelRows = frontier
    .map(({ budget, plan: level }) => {
      const chosen = budget === plan.budget ? ' class="chosen-row"' : "";
      if (!hasList(level)) return `<tr${chosen}><td class="num">${formatMoney(budget)}</td><td colspan="4">no list possible (${escapeHtml(level.solution.status)})</td></tr>`;
      const t = level.totals;
      return `<tr${chosen}><td class="num">${formatMoney(budget)}</td><td class="num">${t.projects}</td><td class="num">${formatMoney(t.cost)}</td><td class="num">${formatFixed(t.ksiAvoided, 1)}</td><td class="num">${formatMoney(t.costPerKsi)}</td></tr>`;
    })
    .join("\n");
  return `<section id="budget">
<h2>What each budget buys</h2>
<p>Each point is the optimal list at that budget, solved afresh; lines join the computed levels. The vermillion diamond marks the chosen budget. Extra money buys less and less once the most effective sites are funded.</p>
<figure>${frontierChartSvg(frontier, plan.budget, scenario.currency)}</figure>
<div class="slider-panel screen-only">
<label for="budget-slider">Try another budget:</label>
<input type="range" id="budget-slider" min="0" max="${Math.max(0, frontier.length - 1)}" step="1" value="${data.chosen}">
<output id="slider-budget" for="budget-slider"></output>
<dl class="slider-totals">${total("projects", "Projects")}${total("cost", `Spend (${currency})`)}${total("ksi", "K+A crashes avoided")}${total("ksi-per-year", "K+A crashes avoided a year at first")}${total("benefit", `Benefit PV (${currency})`)}${total("bc", "B/C")}${total("npv", `NPV (${currency})`)}${total("cost-per-ksi", `Cost per K+A crash avoided (${currency})`)}</dl>
<p class="note"><span id="slider-status"></span> <span id="slider-change"></span></p>
<div class="slider-list"><table class="list compact"><thead><tr><th>Site</th><th>District</th><th>Treatments</th><th class="num">Cost</th><th class="num">K+A crashes avoided</th><th>vs chosen</th></tr></thead><tbody id="slider-funded"></tbody></table></div>
</div>
<table class="list compact levels">
<caption>Optimal list at each budget level (money in ${currency})</caption>
<thead><tr><th class="num">Budget</th><th class="num">Projects</th><th class="num">Spend</th><th class="num">K+A crashes avoided</th><th class="num">Cost per K+A crash avoided</th></tr></thead>
<tbody>
${levelRows}
</tbody>
</table>
<script type="application/json" id="frontier-data">${scriptJson(data)}</script>
</section>`;
}
