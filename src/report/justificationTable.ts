import Table from "cli-table3";
import type { PlanCase } from "../analysis/casePlan.js";
import { formatFixed, formatMoney } from "./formatNumber.js";

/** The justification section of `plan`'s table: the case for each funded project, why the rest are out, upgrades and the ranking comparison. */
export function justificationTable(planCase: PlanCase): string {
  const { justification, upgrades, ranking, currency } = planCase;
  const style = { head: [], border: [] };
  // B/C, NPV and cost per KSI are in the list above; this table adds what the list cannot show.
  const funded = new Table({
    head: ["Site", "B/C rank", "Other alternatives at the site"],
    colAligns: ["left", "right", "right"],
    style,
  } as ConstructorParameters<typeof Table>[0]);
  for (const project of justification.funded) {
    funded.push([
      project.site,
      `${project.bcRank} of ${justification.funded.length}`,
      [project.alternativesNotChosen === 0 ? "" : `${project.alternativesNotChosen} not chosen`, project.sharedCrashCells === 0 ? "" : `treatments share ${project.sharedCrashCells} crash cell(s)`].filter((text) => text !== "").join("; "),
    ]);
  }
  const out = new Table({
    head: ["Site", "Name", "Why not funded"],
    colAligns: ["left", "left", "left"],
    style,
    wordWrap: true,
    colWidths: [null, 28, 70],
  } as ConstructorParameters<typeof Table>[0]);
  for (const site of justification.notFunded) out.push([site.site, site.name, site.explanation]);

  const lambda = justification.budgetMarginalValue;
  const unit = planCase.objective === "ksi" ? "KSI avoided" : "benefit PV";
  const flagged = upgrades.filter((check) => check.forKsiNotMoney);
  const lines = [
    "Why these projects",
    funded.toString(),
    justification.funded.some((project) => project.alternativesNotChosen > 0)
      ? "Other alternatives at funded sites were not chosen because a better alternative at the same site was."
      : "",
    "",
    "Why not the others",
    justification.notFunded.length === 0 ? "Every candidate site is funded." : out.toString(),
    lambda === null
      ? "No entry thresholds: the budget's marginal value is unknown for this programme (policy rules also price the margin)."
      : `Thresholds use the budget's marginal value λ = ${formatFixed(lambda * 1e6, 3)} ${unit} per 1M (${justification.marginalValueSource}), i.e. ${formatMoney(lambda > 0 ? 1 / lambda : Infinity)} ${currency} per unit of ${unit} at the margin.`,
    `Method: ${justification.method}`,
    "",
    "Upgrades by incremental B/C (Highway Safety Manual, Part B, Chapter 7)",
    upgrades.length === 0 ? "No funded site had more than one alternative." : `${upgrades.length} funded site(s) had several alternatives; ${flagged.length} chosen upgrade(s) have incremental B/C below 1 over the next cheaper alternative (chosen for KSI, not money)${flagged.length > 0 ? ":" : "."}`,
    ...flagged.map(
      (check) =>
        `- ${check.site} ${check.name}: ${check.chosen.join(" + ")} over ${check.stepFrom?.join(" + ") ?? "nothing"}, incremental B/C ${formatFixed(check.incrementalBcRatio ?? Number.NaN, 2)}` +
        (check.preferredOnMoney === null ? "" : `; on money alone: ${check.preferredOnMoney.join(" + ")}`),
    ),
    "",
    "Against a B/C ranking at the same budget",
    `The ranking funds ${ranking.rankingTotals.projects} project(s) for ${formatMoney(ranking.rankingTotals.cost)} ${currency} and avoids ${formatFixed(ranking.rankingTotals.ksiAvoided, 2)} KSI; ` +
      `the optimal list avoids ${formatFixed(ranking.extraKsiAvoided, 2)} more KSI (benefit PV ${ranking.extraBenefitPV >= 0 ? "+" : ""}${formatMoney(ranking.extraBenefitPV)}).` +
      (ranking.rankingMeetsRules ? "" : " The ranking's list breaks at least one policy rule."),
    `Ranking used: ${ranking.definition}`,
  ];
  // No trailing newline: planTable separates sections itself.
  return lines.join("\n");
}
