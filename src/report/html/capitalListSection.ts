import type { SelectionFrequency } from "../../analysis/uncertainty/summariseDraws.js";
import { effectsUncertainText } from "../effectsUncertainText.js";
import { formatFixed, formatMoney } from "../formatNumber.js";
import { escapeHtml } from "./escapeHtml.js";
import { fundedReason } from "./fundedReason.js";
import type { ReportInput } from "./ReportInput.js";
import { treatmentNames } from "./treatmentNames.js";

/**
 * The funded list as a table, one project per row with its reason beneath (from the
 * justification), upgrades flagged by incremental B/C, the share of uncertainty draws that
 * select each project when the analysis was run, and totals.
 */
export function capitalListSection(input: ReportInput): string {
  const { plan, planCase, uncertainty } = input;
  const scenario = plan.prepared.scenario;
  const currency = escapeHtml(scenario.currency);
  const columns = uncertainty === undefined ? 8 : 9;
  const cases = new Map(planCase.justification.funded.map((entry) => [entry.site, entry]));
  const upgrades = new Map(planCase.upgrades.map((check) => [check.site, check]));
  const methodBySite = new Map(plan.prepared.baselines.map((baseline) => [baseline.site, baseline.method]));
  const selections = new Map((uncertainty?.draws.summary.selections ?? []).filter((s) => s.inPlan).map((s) => [s.site, s]));
  const rows = plan.funded.map((project) => {
    const { entry, alternative } = project;
    const upgrade = upgrades.get(entry.site.id);
    const reason = fundedReason(scenario, project, cases.get(entry.site.id)!, plan.funded.length, upgrade);
    const flag = upgrade?.forKsiNotMoney === true ? ' <span class="tag flag" title="incremental B/C below 1 over the next cheaper alternative at this site">chosen for K+A crashes avoided, not money</span>' : "";
    const robustnessCell = uncertainty === undefined ? "" : selectionCell(selections.get(entry.site.id));
    return `<tbody class="project" data-site="${escapeHtml(entry.site.id)}">
<tr><td><span class="site-id">${escapeHtml(entry.site.id)}</span> ${escapeHtml(entry.site.name)}${entry.required ? ' <span class="tag">must fund</span>' : ""}${baselineTag(methodBySite.get(entry.site.id))}</td><td class="treatments">${escapeHtml(treatmentNames(scenario, alternative.treatments))}${alternative.buildYear === undefined ? "" : ` <span class="tag">built ${alternative.buildYear}</span>`}${flag}</td><td>${escapeHtml(entry.site.district)}</td><td class="num">${formatMoney(alternative.cost)}</td><td class="num">${formatFixed(alternative.ksiAvoided, 2)}</td><td class="num">${formatFixed(alternative.bcRatio, 1)}</td><td class="num">${formatMoney(alternative.npv)}</td><td class="num">${formatMoney(alternative.costPerKsi)}</td>${robustnessCell}</tr>
<tr class="reason"><td colspan="${columns}">${escapeHtml(reason)}</td></tr>
</tbody>`;
  });
  const { totals } = plan;
  const drawCount = uncertainty?.draws.summary.solvedDraws;
  const robustnessHead = uncertainty === undefined ? "" : `<th class="num" title="share of ${drawCount} uncertainty draws whose optimal list includes this project">Selected in draws</th>`;
  const robustnessNote =
    uncertainty === undefined
      ? ""
      : ` "Selected in draws" is the share of ${drawCount} uncertainty draws (${escapeHtml(effectsUncertainText(uncertainty.draws.effects))}) whose optimal list includes the project: <strong>core</strong> at 90% or more, <strong>marginal</strong> at 10% or more (see Robustness).`;
  const flagged = planCase.upgrades.filter((check) => check.forKsiNotMoney).length;
  const flagNote = flagged === 0 ? "" : ` ${flagged} project${flagged === 1 ? " is an upgrade" : "s are upgrades"} whose extra cost over the next cheaper option at the site returns less than it costs (incremental B/C below 1; Highway Safety Manual, Part B, Chapter 7): marked "chosen for K+A crashes avoided, not money".`;
  const empty = plan.funded.length === 0 ? `<tbody><tr><td colspan="${columns}">No project is funded at this budget.</td></tr></tbody>` : "";
  return `<section id="capital-list">
<h2>The capital list</h2>
<p>${totals.projects} projects, ordered by site. Money in ${currency}; K+A crashes avoided (KSI crashes: with a fatality or a serious injury; crashes, not people) over each project's service life within the horizon; cost per K+A crash avoided is lifecycle cost PV ÷ K+A crashes avoided.${flagNote}${robustnessNote}</p>
<table class="list">
<thead><tr><th>Site</th><th>Treatments</th><th>District</th><th class="num">Cost</th><th class="num">K+A crashes avoided</th><th class="num">B/C</th><th class="num">NPV</th><th class="num">Cost per K+A crash avoided</th>${robustnessHead}</tr></thead>
${rows.join("\n")}${empty}
<tfoot><tr><td colspan="3">Total: ${totals.projects} projects</td><td class="num">${formatMoney(totals.cost)}</td><td class="num">${formatFixed(totals.ksiAvoided, 2)}</td><td class="num">${formatFixed(totals.bcRatio, 1)}</td><td class="num">${formatMoney(totals.npv)}</td><td class="num">${formatMoney(totals.costPerKsi)}</td>${uncertainty === undefined ? "" : "<td></td>"}</tr></tfoot>
</table>
</section>`;
}

/** Which baseline the project's crashes come from; observed counts are flagged, since they are not corrected for regression to the mean. */
function baselineTag(method: string | undefined): string {
  return method === "empirical-bayes"
    ? ' <span class="tag baseline" title="expected crashes by Empirical Bayes">EB</span>'
    : ' <span class="tag baseline flag" title="expected crashes from observed counts, not corrected for regression to the mean">observed counts</span>';
}

function selectionCell(selection: SelectionFrequency | undefined): string {
  // Every funded project is in the summary's selections (inPlan); a miss would be a wiring fault.
  if (selection === undefined) throw new RangeError("a funded project is missing from the uncertainty summary: was it run on another list?");
  return `<td class="num selection ${selection.class}" data-probability="${selection.probability}">${formatFixed(100 * selection.probability, 0)}% <span class="class-label">${selection.class}</span></td>`;
}
