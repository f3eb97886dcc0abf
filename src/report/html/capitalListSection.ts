import { formatFixed, formatMoney } from "../formatNumber.js";
import { escapeHtml } from "./escapeHtml.js";
import { projectReason } from "./projectReason.js";
import type { ReportInput } from "./ReportInput.js";
import { treatmentNames } from "./treatmentNames.js";

/** The funded list as a table, one project per row with its reason beneath, and totals. */
export function capitalListSection(input: ReportInput): string {
  const { plan, robustness } = input;
  const scenario = plan.prepared.scenario;
  const currency = escapeHtml(scenario.currency);
  const columns = robustness === undefined ? 8 : 9;
  const rows = plan.funded.map((project) => {
    const { entry, alternative } = project;
    const probability = robustness?.selectionProbability.get(entry.site.id);
    const robustnessCell =
      robustness === undefined ? "" : `<td class="num">${probability === undefined ? "–" : `${formatFixed(100 * probability, 0)}%`}</td>`;
    const reason = input.reasons?.get(entry.site.id) ?? projectReason(project);
    return `<tbody class="project" data-site="${escapeHtml(entry.site.id)}">
<tr><td><span class="site-id">${escapeHtml(entry.site.id)}</span> ${escapeHtml(entry.site.name)}${entry.required ? ' <span class="tag">must fund</span>' : ""}</td><td class="treatments">${escapeHtml(treatmentNames(scenario, alternative.treatments))}</td><td>${escapeHtml(entry.site.district)}</td><td class="num">${formatMoney(alternative.cost)}</td><td class="num">${formatFixed(alternative.ksiAvoided, 2)}</td><td class="num">${formatFixed(alternative.bcRatio, 1)}</td><td class="num">${formatMoney(alternative.npv)}</td><td class="num">${formatMoney(alternative.costPerKsi)}</td>${robustnessCell}</tr>
<tr class="reason"><td colspan="${columns}">${escapeHtml(reason)}</td></tr>
</tbody>`;
  });
  const { totals } = plan;
  const robustnessHead = robustness === undefined ? "" : `<th class="num" title="share of ${robustness.draws} uncertainty draws in which the site is funded">Funded in draws</th>`;
  const empty = plan.funded.length === 0 ? `<tbody><tr><td colspan="${columns}">No project is funded at this budget.</td></tr></tbody>` : "";
  return `<section id="capital-list">
<h2>The capital list</h2>
<p>${totals.projects} projects, ordered by site. Money in ${currency}; KSI avoided over each project's service life within the horizon; cost per KSI is lifecycle cost PV per KSI crash avoided.${robustness === undefined ? "" : ` "Funded in draws" is the share of ${robustness.draws} draws (${escapeHtml(robustness.method)}) in which the site is in the optimal list.`}</p>
<table class="list">
<thead><tr><th>Site</th><th>Treatments</th><th>District</th><th class="num">Cost</th><th class="num">KSI avoided</th><th class="num">B/C</th><th class="num">NPV</th><th class="num">Cost per KSI</th>${robustnessHead}</tr></thead>
${rows.join("\n")}${empty}
<tfoot><tr><td colspan="3">Total: ${totals.projects} projects</td><td class="num">${formatMoney(totals.cost)}</td><td class="num">${formatFixed(totals.ksiAvoided, 2)}</td><td class="num">${formatFixed(totals.bcRatio, 1)}</td><td class="num">${formatMoney(totals.npv)}</td><td class="num">${formatMoney(totals.costPerKsi)}</td>${robustness === undefined ? "" : "<td></td>"}</tr></tfoot>
</table>
</section>`;
}
