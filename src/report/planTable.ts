import Table from "cli-table3";
import type { PlanResult } from "../analysis/planProgramme.js";
import { sitesWithoutCandidates } from "../model/sitesWithoutCandidates.js";
import { CAUTIONS } from "./cautions.js";
import { formatFixed, formatMoney } from "./formatNumber.js";
import { hasList } from "./hasList.js";
import { noCandidatesText } from "./noCandidatesText.js";

/** The funded list as a terminal table, with totals against the budget, any extra sections (before the cautions) and the cautions. */
export function planTable(result: PlanResult, sections: readonly string[] = []): string {
  const { prepared, solution, totals } = result;
  const currency = prepared.scenario.currency;
  const noCandidates = noCandidatesText(sitesWithoutCandidates(prepared.scenario.sites));
  const table = new Table({
    head: ["Site", "Name", "District", "Treatments", `Cost (${currency})`, "KSI avoided", "B/C", `NPV (${currency})`, `Cost per KSI (${currency})`],
    colAligns: ["left", "left", "left", "left", "right", "right", "right", "right", "right"],
    style: { head: [], border: [] },
    wordWrap: true,
    colWidths: [null, 26, null, 34],
  } as ConstructorParameters<typeof Table>[0]);
  for (const { entry, alternative } of result.funded) {
    table.push([
      entry.site.id + (entry.required ? " *" : ""),
      entry.site.name,
      entry.site.district,
      alternative.treatments.join(" + "),
      formatMoney(alternative.cost),
      formatFixed(alternative.ksiAvoided, 2),
      formatFixed(alternative.bcRatio, 2),
      formatMoney(alternative.npv),
      formatMoney(alternative.costPerKsi),
    ]);
  }
  table.push([
    { colSpan: 4, content: `Total: ${totals.projects} project(s)` },
    formatMoney(totals.cost),
    formatFixed(totals.ksiAvoided, 2),
    formatFixed(totals.bcRatio, 2),
    formatMoney(totals.npv),
    formatMoney(totals.costPerKsi),
  ]);

  const lines = [
    `${prepared.scenario.name}`,
    `Objective: ${prepared.objective === "ksi" ? "KSI crashes avoided" : "benefit PV"}   Baseline: ${prepared.scenario.baseline}   Status: ${solution.status}${solution.status === "optimal" ? " (proven)" : ""}`,
    `Budget ${formatMoney(result.budget)} ${currency}; spent ${formatMoney(totals.cost)} (${formatFixed(result.budget > 0 ? (100 * totals.cost) / result.budget : 0, 1)}%); left ${formatMoney(result.budget - totals.cost)}`,
    `KSI avoided ${formatFixed(totals.ksiAvoided, 2)} over the analysis period (${formatFixed(totals.ksiAvoidedPerYear, 2)} a year at first); benefit PV ${formatMoney(totals.benefitPV)}; lifecycle cost PV ${formatMoney(totals.lifecycleCostPV)}`,
    ...(solution.diagnosis ? [`Why: ${solution.diagnosis}`] : []),
    ...(noCandidates !== undefined ? [`${noCandidates}.`] : []),
    "",
    hasList(result) ? table.toString() : "",
    result.funded.some((project) => project.entry.required) ? "* required by a must-fund rule" : "",
    hasList(result)
      ? `Optimality: upper bound ${formatFixed(solution.bound, 3)}, gap ${solution.gap.toExponential(1)} (engine: ${solution.engine}).`
      : `No list at this budget (status ${solution.status}, engine: ${solution.engine}).`,
    "",
    ...sections.flatMap((section) => [section, ""]),
    "Cautions:",
    ...CAUTIONS.map((caution) => `- ${caution}`),
  ];
  return lines.filter((line, index, all) => !(line === "" && all[index - 1] === "")).join("\n") + "\n";
}
