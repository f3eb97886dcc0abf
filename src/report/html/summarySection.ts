import { formatFixed, formatMoney } from "../formatNumber.js";
import { escapeHtml } from "./escapeHtml.js";
import type { ReportInput } from "./ReportInput.js";
import { shakyProjectsNote } from "./shakyProjectsNote.js";

/** The key figures a finance reader needs first: budget, spend, KSI avoided, PVs, B/C, NPV; and shaky projects when draws were run. */
export function summarySection(input: ReportInput): string {
  const { plan } = input;
  const { totals, solution } = plan;
  const currency = escapeHtml(plan.prepared.scenario.currency);
  const horizon = plan.prepared.scenario.economics.horizonYears;
  const spentShare = plan.budget > 0 ? (100 * totals.cost) / plan.budget : 0;
  const figure = (id: string, label: string, value: string, note: string) =>
    `<div class="figure" id="summary-${id}"><div class="figure-label">${label}</div><div class="figure-value">${value}</div><div class="figure-note">${note}</div></div>`;
  const status =
    solution.status === "optimal"
      ? "This list is proven optimal: no other list within the budget and rules avoids more."
      : `Solver status: ${escapeHtml(solution.status)}${solution.diagnosis ? ` (${escapeHtml(solution.diagnosis)})` : ""}.`;
  const goal = plan.prepared.objective === "ksi" ? "killed or seriously injured (KSI) crashes avoided" : "monetised benefit (present value of crash costs avoided)";
  return `<section id="summary">
<h2>Summary</h2>
<p class="lead">The capital list below maximises ${goal} within the budget and the scenario's policy rules. ${status}</p>
<div class="figures">
${figure("budget", "Budget", `${formatMoney(plan.budget)} <span class="unit">${currency}</span>`, "capital available")}
${figure("spend", "Capital spend", `${formatMoney(totals.cost)} <span class="unit">${currency}</span>`, `${formatFixed(spentShare, 1)}% of budget; ${formatMoney(plan.budget - totals.cost)} left`)}
${figure("projects", "Projects", String(totals.projects), "sites funded")}
${figure("ksi", "KSI crashes avoided", formatFixed(totals.ksiAvoided, 1), `over up to ${horizon} years; ${formatFixed(totals.ksiAvoidedPerYear, 2)} a year at first`)}
${figure("benefit", "Benefit PV", `${formatMoney(totals.benefitPV)} <span class="unit">${currency}</span>`, "crash costs avoided, discounted")}
${figure("lifecycle", "Lifecycle cost PV", `${formatMoney(totals.lifecycleCostPV)} <span class="unit">${currency}</span>`, "capital plus discounted upkeep")}
${figure("bc", "Benefit / cost", formatFixed(totals.bcRatio, 1), "benefit PV ÷ lifecycle cost PV")}
${figure("npv", "Net present value", `${formatMoney(totals.npv)} <span class="unit">${currency}</span>`, "benefit PV − lifecycle cost PV")}
${figure("cost-per-ksi", "Cost per KSI avoided", `${formatMoney(totals.costPerKsi)} <span class="unit">${currency}</span>`, "lifecycle cost PV ÷ KSI avoided")}
</div>
${rankingGain(input)}
${shakyProjectsNote(input)}
</section>`;
}

/** What optimising gains over ranking sites by B/C and funding down the list at the same budget. */
function rankingGain(input: ReportInput): string {
  const { ranking } = input.planCase;
  const rankingTotals = ranking.rankingTotals;
  const gain = ranking.extraKsiAvoided;
  const currency = escapeHtml(input.plan.prepared.scenario.currency);
  const share = rankingTotals.ksiAvoided > 0 ? ` (${formatFixed((100 * gain) / rankingTotals.ksiAvoided, 1)}% more)` : "";
  // Below the table's precision the two lists are, for a reader, equally good.
  const verdict =
    Math.abs(gain) < 0.05
      ? "this list avoids as many KSI crashes within the same budget"
      : gain > 0
        ? `this list avoids <strong>${formatFixed(gain, 1)} more KSI crashes</strong>${share} within the same budget`
        : `the ranking's list avoids ${formatFixed(-gain, 1)} more KSI crashes, but only by breaking the policy rules this list meets`;
  const rules = ranking.rankingMeetsRules ? "" : " The ranking's list breaks at least one of the scenario's policy rules.";
  return `<div class="gain" id="summary-gain" data-extra-ksi="${gain}">
<p>Against the usual practice of ranking sites by benefit-cost ratio and funding down the list until the money runs out (${rankingTotals.projects} projects, ${formatMoney(rankingTotals.cost)} ${currency} spent, ${formatFixed(rankingTotals.ksiAvoided, 1)} KSI avoided), ${verdict}; benefit PV ${ranking.extraBenefitPV >= 0 ? "+" : "−"}${formatMoney(Math.abs(ranking.extraBenefitPV))} ${currency}.${rules}</p>
<p class="note">Ranking used: ${escapeHtml(ranking.definition)}</p>
</div>`;
}
