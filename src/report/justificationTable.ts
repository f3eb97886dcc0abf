import type { PlanCase } from "../analysis/casePlan.js";
import type { ProgrammeTotals } from "../analysis/summariseSelection.js";
import { formatFixed, formatMoney } from "./formatNumber.js";
import { KSI_AVOIDED_LABEL } from "./ksiAvoidedLabel.js";
import { marginalValueWords } from "./marginalValueWords.js";
import { rankingComparisonText } from "./rankingComparisonText.js";
import { PLAN_TABLE_ROWS } from "./planTable.js";
import { textTable } from "./textTable.js";

/** The justification section of `plan`'s table: the case for each funded project, why the rest are out, upgrades and the ranking comparison at equal spend. */
export function justificationTable(planCase: PlanCase, options: { readonly all?: boolean } = {}): string {
  const { justification, upgrades, ranking, atRankingSpend, extendedRanking, currency } = planCase;
  // B/C, NPV and cost per K+A crash are in the list above; this table adds what the list cannot show.
  const funded = textTable(
    [{ heading: "Site" }, { heading: "B/C rank", align: "right" }, { heading: "Other alternatives at the site", align: "right" }],
    capped(justification.funded, options.all).map((project) => [
      project.site,
      `${project.bcRank} of ${justification.funded.length}`,
      [project.alternativesNotChosen === 0 ? "" : `${project.alternativesNotChosen} not chosen`, project.sharedCrashCells === 0 ? "" : `treatments share ${project.sharedCrashCells} crash cell(s)`].filter((text) => text !== "").join("; "),
    ]),
  );
  const out = textTable(
    [{ heading: "Site" }, { heading: "Name", maxWidth: 26 }, { heading: "Why not funded", maxWidth: 68 }],
    capped(justification.notFunded, options.all).map((site) => [site.site, site.name, site.explanation]),
  );

  const lambda = justification.budgetMarginalValue;
  const unit = planCase.objective === "ksi" ? "K+A crash avoided" : `${currency} of benefit PV`;
  const flagged = upgrades.filter((check) => check.forKsiNotMoney);
  const text = rankingComparisonText(planCase);
  const lines = [
    "Why these projects",
    funded,
    ...moreNote(justification.funded.length, options.all),
    justification.funded.some((project) => project.alternativesNotChosen > 0)
      ? "Other alternatives at funded sites were not chosen because a better alternative at the same site was."
      : "",
    "",
    "Why not the others",
    justification.notFunded.length === 0 ? "Every candidate site is funded." : out,
    ...moreNote(justification.notFunded.length, options.all),
    lambda === null
      ? "No entry thresholds: the budget's marginal value is unknown for this programme (policy rules also price the margin)."
      : `Thresholds use the budget's marginal value λ = ${marginalValueWords(lambda, planCase.objective, currency)} at the margin (from the ${justification.marginalValueSource === "solver" ? "solver" : "LP relaxation"}), ` +
        `i.e. about ${formatMoney(lambda > 0 ? 1 / lambda : Infinity)} ${currency} of budget per extra ${unit}.`,
    `Method: ${justification.method}`,
    "",
    "Upgrades by incremental B/C (Highway Safety Manual, Part B, Chapter 7)",
    upgrades.length === 0 ? "No funded site had more than one alternative." : `${upgrades.length} funded site(s) had several alternatives; ${flagged.length} chosen upgrade(s) have incremental B/C below 1 over the next cheaper alternative (chosen for K+A crashes avoided, not money)${flagged.length > 0 ? ":" : "."}`,
    ...flagged.map(
      (check) =>
        `- ${check.site} ${check.name}: ${check.chosen.join(" + ")} over ${check.stepFrom?.join(" + ") ?? "nothing"}, incremental B/C ${formatFixed(check.incrementalBcRatio ?? Number.NaN, 2)}` +
        (check.preferredOnMoney === null ? "" : `; on money alone: ${check.preferredOnMoney.join(" + ")}`),
    ),
    "",
    "Against a B/C ranking at the same budget, and at equal spend",
    rankingTable(planCase),
    text.asTheyStand,
    text.atRankingSpend,
    text.extended,
    ...(text.split === null ? [] : [text.split]),
    `Ranking used: ${ranking.definition}`,
    `At the ranking's spend: ${atRankingSpend.definition}`,
    `Ranking carried on: ${extendedRanking.definition}`,
  ];
  // No trailing newline: planTable separates sections itself.
  return lines.join("\n");
}

/** The four lists side by side: budget, spend, projects, K+A crashes avoided, benefit PV, B/C and whether each meets the rules. */
function rankingTable(planCase: PlanCase): string {
  const { ranking, atRankingSpend, extendedRanking, currency } = planCase;
  const atSpend = atRankingSpend.extraKsiAvoided === null ? null : atRankingSpend.plan.totals;
  const lists: readonly (ProgrammeTotals | null)[] = [ranking.optimalTotals, ranking.rankingTotals, atSpend, extendedRanking.totals];
  const row = (label: string, cell: (totals: ProgrammeTotals) => string) => [label, ...lists.map((totals) => (totals === null ? "no list" : cell(totals)))];
  return textTable(
    [{ heading: "" }, ...["Optimal list", "B/C ranking", "Optimal at the ranking's spend", "Ranking carried on (incremental B/C)"].map((heading) => ({ heading, align: "right" as const }))],
    [
    [`Budget (${currency})`, formatMoney(planCase.budget), formatMoney(planCase.budget), formatMoney(atRankingSpend.budget), formatMoney(planCase.budget)],
    row(`Spend (${currency})`, (totals) => formatMoney(totals.cost)),
    row("Projects", (totals) => String(totals.projects)),
    row(KSI_AVOIDED_LABEL, (totals) => formatFixed(totals.ksiAvoided, 2)),
    row(`Benefit PV (${currency})`, (totals) => formatMoney(totals.benefitPV)),
    row("B/C", (totals) => formatFixed(totals.bcRatio, 2)),
    ["Meets the policy rules", "yes", yesNo(ranking.rankingMeetsRules), atSpend === null ? "no list" : "yes", yesNo(extendedRanking.meetsRules)],
    ],
  );
}

/** The first PLAN_TABLE_ROWS entries unless `all`: the JSON carries every one. */
function capped<T>(entries: readonly T[], all: boolean | undefined): readonly T[] {
  return all === true ? entries : entries.slice(0, PLAN_TABLE_ROWS);
}

function moreNote(count: number, all: boolean | undefined): string[] {
  return all === true || count <= PLAN_TABLE_ROWS ? [] : [`… and ${count - PLAN_TABLE_ROWS} more (--all lists every one; --format json carries them all).`];
}

function yesNo(flag: boolean): string {
  return flag ? "yes" : "no";
}
