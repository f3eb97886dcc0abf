import { formatFixed, formatMoney } from "../formatNumber.js";
import { escapeHtml } from "./escapeHtml.js";
import { notFundedReason, type NotFundedCause } from "./notFundedReason.js";
import type { ReportInput } from "./ReportInput.js";
import { treatmentNames } from "./treatmentNames.js";

const CAUSE_ORDER: readonly NotFundedCause[] = ["never-fund rule", "no treatment applies", "no KSI avoided", "budget"];

/** Sites left out of the list, grouped by cause, with each site's best option and reason. */
export function notFundedSection(input: ReportInput): string {
  const { plan, frontier } = input;
  const scenario = plan.prepared.scenario;
  const funded = new Set(plan.funded.map((project) => project.entry.site.id));
  const left = plan.prepared.sites
    .filter((entry) => !funded.has(entry.site.id))
    .map((entry) => notFundedReason(entry, frontier))
    .sort((a, b) => CAUSE_ORDER.indexOf(a.cause) - CAUSE_ORDER.indexOf(b.cause) || (b.best?.ksiAvoided ?? 0) - (a.best?.ksiAvoided ?? 0));
  if (left.length === 0) return `<section id="not-funded"><h2>Not funded and why</h2><p>Every candidate site is funded.</p></section>`;
  const rows = left.map(
    ({ entry, best, cause, reason }) => `<tbody class="project" data-site="${escapeHtml(entry.site.id)}">
<tr><td><span class="site-id">${escapeHtml(entry.site.id)}</span> ${escapeHtml(entry.site.name)}</td><td>${escapeHtml(entry.site.district)}</td><td>${escapeHtml(cause)}</td><td>${best ? escapeHtml(treatmentNames(scenario, best.treatments)) : "–"}</td><td class="num">${best ? formatMoney(best.cost) : "–"}</td><td class="num">${best ? formatFixed(best.ksiAvoided, 2) : "–"}</td></tr>
<tr class="reason"><td colspan="6">${escapeHtml(reason)}</td></tr>
</tbody>`,
  );
  return `<section id="not-funded">
<h2>Not funded and why</h2>
<p>${left.length} candidate sites are not in the list. "Best option" is the one that avoids the most KSI crashes at that site.</p>
<table class="list">
<thead><tr><th>Site</th><th>District</th><th>Cause</th><th>Best option</th><th class="num">Its cost</th><th class="num">Its KSI avoided</th></tr></thead>
${rows.join("\n")}
</table>
</section>`;
}
