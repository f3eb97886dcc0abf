import type { NotFundedCase, NotFundedReason } from "../../analysis/justifyPlan.js";
import { sitesWithoutCandidates } from "../../model/sitesWithoutCandidates.js";
import { formatMoney } from "../formatNumber.js";
import { marginalValueWords } from "../marginalValueWords.js";
import { noCandidatesText } from "../noCandidatesText.js";
import { escapeHtml } from "./escapeHtml.js";
import { NOT_FUNDED_LABELS, notFundedExplanation } from "./notFundedExplanation.js";
import type { ReportInput } from "./ReportInput.js";
import { treatmentNames } from "./treatmentNames.js";

// Near misses first: those a finance reader can act on.
const REASON_ORDER: readonly NotFundedReason[] = ["budget", "bc-below-1", "no-effect", "no-alternatives", "excluded"];

/**
 * Sites left out of the list, with the justification's reason for each, the option nearest to
 * entering and its entry threshold, and the method's caveat. Nearest to entering first.
 */
export function notFundedSection(input: ReportInput): string {
  const { plan, planCase, frontier } = input;
  const { justification } = planCase;
  const scenario = plan.prepared.scenario;
  const objective = plan.prepared.objective;
  const relativeCut = (site: NotFundedCase) => (site.threshold === null || !(site.threshold.cost > 0) ? Infinity : site.threshold.costCut / site.threshold.cost);
  const left = [...justification.notFunded].sort((a, b) => REASON_ORDER.indexOf(a.reason) - REASON_ORDER.indexOf(b.reason) || relativeCut(a) - relativeCut(b));
  if (left.length === 0) return `<section id="not-funded"><h2>Not funded and why</h2><p>Every candidate site is funded.</p></section>`;
  const entersAt = (site: string) => frontier.find((level) => level.plan.funded.some((project) => project.entry.site.id === site))?.budget;
  const districts = new Map(plan.prepared.sites.map((entry) => [entry.site.id, entry.site.district]));
  const rows = left.map((site) => {
    const threshold = site.threshold;
    const reason = notFundedExplanation(scenario, objective, site, entersAt(site.site));
    const enters = threshold === null ? "–" : threshold.costCut <= 0 ? "its cost (near miss)" : threshold.costThreshold > 0 ? formatMoney(threshold.costThreshold) : objective === "ksi" ? "needs more K+A crashes avoided" : "needs more benefit";
    return `<tbody class="project" data-site="${escapeHtml(site.site)}" data-reason="${site.reason}">
<tr><td><span class="site-id">${escapeHtml(site.site)}</span> ${escapeHtml(site.name)}</td><td>${escapeHtml(districts.get(site.site) ?? "")}</td><td>${escapeHtml(NOT_FUNDED_LABELS[site.reason])}</td><td>${threshold ? escapeHtml(treatmentNames(scenario, threshold.treatments)) : "–"}</td><td class="num">${threshold ? formatMoney(threshold.cost) : "–"}</td><td class="num">${enters}</td></tr>
<tr class="reason"><td colspan="6">${escapeHtml(reason)}</td></tr>
</tbody>`;
  });
  const noCandidates = noCandidatesText(sitesWithoutCandidates(scenario.sites));
  const lambda = justification.budgetMarginalValue;
  const margin =
    lambda === null
      ? "No entry thresholds are given: the scenario's policy rules price the margin as well as the budget."
      : `At this budget the marginal value of money, λ, is about ${escapeHtml(marginalValueWords(lambda, objective, scenario.currency))} (from the ${justification.marginalValueSource === "solver" ? "solver" : "LP relaxation"}): what one more 1M ${escapeHtml(scenario.currency)} would buy at the margin; the thresholds below follow from it.`;
  return `<section id="not-funded">
<h2>Not funded and why</h2>
<p>${left.length} candidate sites are not in the list, nearest to entering first.${noCandidates !== undefined ? ` <span id="no-candidates">${escapeHtml(noCandidates)}.</span>` : ""} ${margin} "Option" is the site's option nearest to entering; "Enters at" is the cost at or below which it would enter, by the method below.</p>
<table class="list">
<thead><tr><th>Site</th><th>District</th><th>Why</th><th>Option</th><th class="num">Its cost</th><th class="num">Enters at</th></tr></thead>
${rows.join("\n")}
</table>
<p class="note" id="threshold-method">How the thresholds are found, and their limits: ${escapeHtml(justification.method)}</p>
</section>`;
}
