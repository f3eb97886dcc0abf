import { formatFixed, formatMoney } from "../formatNumber.js";
import { rankingComparisonText } from "../rankingComparisonText.js";
import { escapeHtml } from "./escapeHtml.js";
import type { ReportInput } from "./ReportInput.js";
import { shakyProjectsNote } from "./shakyProjectsNote.js";

/** The key figures a finance reader needs first: budget, spend, K+A crashes avoided, PVs, B/C, NPV, the gain over a B/C ranking, and shaky projects when draws were run. */
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
  const goal = plan.prepared.objective === "ksi" ? "K+A crashes avoided (KSI crashes: crashes with a fatality (K) or a serious injury (A), counted as crashes, not people)" : "monetised benefit (present value of crash costs avoided)";
  return `<section id="summary">
<h2>Summary</h2>
<p class="lead">The capital list below maximises ${goal} within the budget and the scenario's policy rules. ${status}</p>
<div class="figures">
${figure("budget", "Budget", `${formatMoney(plan.budget)} <span class="unit">${currency}</span>`, "capital available")}
${figure("spend", "Capital spend", `${formatMoney(totals.cost)} <span class="unit">${currency}</span>`, `${formatFixed(spentShare, 1)}% of budget; ${formatMoney(plan.budget - totals.cost)} left`)}
${figure("projects", "Projects", String(totals.projects), "sites funded")}
${figure("ksi", "K+A crashes avoided", formatFixed(totals.ksiAvoided, 1), `over up to ${horizon} years; ${formatFixed(totals.ksiAvoidedPerYear, 2)} a year at first`)}
${figure("benefit", "Benefit PV", `${formatMoney(totals.benefitPV)} <span class="unit">${currency}</span>`, "crash costs avoided, discounted")}
${figure("lifecycle", "Lifecycle cost PV", `${formatMoney(totals.lifecycleCostPV)} <span class="unit">${currency}</span>`, "capital plus discounted upkeep")}
${figure("bc", "Benefit / cost", formatFixed(totals.bcRatio, 1), "benefit PV ÷ lifecycle cost PV")}
${figure("npv", "Net present value", `${formatMoney(totals.npv)} <span class="unit">${currency}</span>`, "benefit PV − lifecycle cost PV")}
${figure("cost-per-ksi", "Cost per K+A crash avoided", `${formatMoney(totals.costPerKsi)} <span class="unit">${currency}</span>`, "lifecycle cost PV ÷ K+A crashes avoided")}
</div>
${rankingGain(input)}
${shakyProjectsNote(input)}
</section>`;
}

/**
 * What optimising gains over ranking sites by B/C and funding down the list: both lists' spend,
 * then the comparison at equal spend two ways (the optimal list at the ranking's spend, and the
 * ranking carried on by incremental B/C until the budget is used).
 */
function rankingGain(input: ReportInput): string {
  const { ranking, atRankingSpend, extendedRanking } = input.planCase;
  const rankingTotals = ranking.rankingTotals;
  const gain = ranking.extraKsiAvoided;
  const currency = escapeHtml(input.plan.prepared.scenario.currency);
  const text = rankingComparisonText(input.planCase);
  const choice = atRankingSpend.extraKsiAvoided;
  const share = choice !== null && rankingTotals.ksiAvoided > 0 ? ` (${formatFixed((100 * choice) / rankingTotals.ksiAvoided, 1)}% more)` : "";
  // Below the shown precision the two lists are, for a reader, equally good.
  const verdict =
    choice === null
      ? "no list meets the rules at the ranking's spend"
      : Math.abs(choice) < 0.05
        ? "at the same spend the optimal list avoids as many K+A crashes"
        : choice > 0
          ? `at the same spend the optimal list avoids <strong>${formatFixed(choice, 1)} more K+A crashes</strong>${share}: the gain from better choice alone`
          : `at the same spend the ranking's list avoids ${formatFixed(-choice, 1)} more K+A crashes, ${ranking.rankingMeetsRules ? "because this list maximises benefit PV, not K+A crashes" : "but only by breaking the policy rules this list meets"}`;
  const row = (label: string, budget: number, totals: { cost: number; projects: number; ksiAvoided: number; benefitPV: number } | null, id: string) =>
    `<tr data-list="${id}"><th scope="row">${label}</th><td class="num">${formatMoney(budget)}</td>${
      totals === null
        ? '<td colspan="4">no list meets the rules</td>'
        : `<td class="num">${formatMoney(totals.cost)}</td><td class="num">${totals.projects}</td><td class="num">${formatFixed(totals.ksiAvoided, 1)}</td><td class="num">${formatMoney(totals.benefitPV)}</td>`
    }</tr>`;
  const budget = input.plan.budget;
  return `<div class="gain" id="summary-gain" data-extra-ksi="${gain}" data-extra-ksi-at-ranking-spend="${choice ?? ""}" data-extra-ksi-over-extended="${extendedRanking.extraKsiAvoided}">
<p>Against the usual practice of ranking sites by benefit-cost ratio and funding down the list until the next site does not fit (${rankingTotals.projects} projects, ${formatMoney(rankingTotals.cost)} ${currency} spent, ${formatFixed(rankingTotals.ksiAvoided, 1)} K+A crashes avoided), ${verdict}.</p>
<table class="list compact ranking">
<caption>The optimal list against a B/C ranking, at the same budget and at equal spend (money in ${currency})</caption>
<thead><tr><th>List</th><th class="num">Budget</th><th class="num">Spend</th><th class="num">Projects</th><th class="num">K+A crashes avoided</th><th class="num">Benefit PV</th></tr></thead>
<tbody>
${row("Optimal list", budget, ranking.optimalTotals, "optimal")}
${row("B/C ranking", budget, rankingTotals, "ranking")}
${row("Optimal list at the ranking's spend", atRankingSpend.budget, choice === null ? null : atRankingSpend.plan.totals, "optimal-at-ranking-spend")}
${row("Ranking carried on by incremental B/C", budget, extendedRanking.totals, "extended-ranking")}
</tbody>
</table>
<p>${escapeHtml(text.extended)}${text.split === null ? "" : ` ${escapeHtml(text.split)}`}${ranking.rankingMeetsRules ? "" : " The ranking's list breaks at least one of the scenario's policy rules."}</p>
<p class="note">Ranking used: ${escapeHtml(ranking.definition)} At the ranking's spend: ${escapeHtml(atRankingSpend.definition)} Ranking carried on: ${escapeHtml(extendedRanking.definition)}</p>
</div>`;
}
