import Table from "cli-table3";
import { planMethodNotes } from "../analysis/planMethodNotes.js";
import type { PlanResult } from "../analysis/planProgramme.js";
import { sitesWithoutCandidates } from "../model/sitesWithoutCandidates.js";
import { CAUTIONS } from "./cautions.js";
import { describeAssumptions, type Assumptions } from "./describeAssumptions.js";
import { formatFixed, formatMoney } from "./formatNumber.js";
import { hasList } from "./hasList.js";
import { KSI_AVOIDED_LABEL } from "./ksiAvoidedLabel.js";
import { noCandidatesText } from "./noCandidatesText.js";

/** The funded list as a terminal table, with totals against the budget, any extra sections (before the cautions) and the cautions. */
export function planTable(result: PlanResult, sections: readonly string[] = []): string {
  const { prepared, solution, totals } = result;
  const currency = prepared.scenario.currency;
  const methodBySite = new Map(prepared.baselines.map((baseline) => [baseline.site, baseline.method === "empirical-bayes" ? "EB" : "observed"]));
  const noCandidates = noCandidatesText(sitesWithoutCandidates(prepared.scenario.sites));
  const table = new Table({
    head: ["Site", "Name", "District", "Baseline", "Treatments", `Cost (${currency})`, KSI_AVOIDED_LABEL, "B/C", `NPV (${currency})`, `Cost per K+A crash avoided (${currency})`],
    colAligns: ["left", "left", "left", "left", "left", "right", "right", "right", "right", "right"],
    style: { head: [], border: [] },
    wordWrap: true,
    colWidths: [null, 26, null, null, 34],
  } as ConstructorParameters<typeof Table>[0]);
  for (const { entry, alternative } of result.funded) {
    table.push([
      entry.site.id + (entry.required ? " *" : ""),
      entry.site.name,
      entry.site.district,
      methodBySite.get(entry.site.id) ?? "",
      alternative.treatments.join(" + "),
      formatMoney(alternative.cost),
      formatFixed(alternative.ksiAvoided, 2),
      formatFixed(alternative.bcRatio, 2),
      formatMoney(alternative.npv),
      formatMoney(alternative.costPerKsi),
    ]);
  }
  table.push([
    { colSpan: 5, content: `Total: ${totals.projects} project(s)` },
    formatMoney(totals.cost),
    formatFixed(totals.ksiAvoided, 2),
    formatFixed(totals.bcRatio, 2),
    formatMoney(totals.npv),
    formatMoney(totals.costPerKsi),
  ]);

  const lines = [
    `${prepared.scenario.name}`,
    `Objective: ${prepared.objective === "ksi" ? "K+A crashes avoided (KSI crashes, not people)" : "benefit PV"}   Baseline: ${prepared.scenario.baseline}   Status: ${solution.status}${solution.status === "optimal" ? " (proven)" : ""}`,
    `Budget ${formatMoney(result.budget)} ${currency}; spent ${formatMoney(totals.cost)} (${formatFixed(result.budget > 0 ? (100 * totals.cost) / result.budget : 0, 1)}%); left ${formatMoney(result.budget - totals.cost)}`,
    `K+A crashes avoided ${formatFixed(totals.ksiAvoided, 2)} over the analysis period (${formatFixed(totals.ksiAvoidedPerYear, 2)} a year at first); benefit PV ${formatMoney(totals.benefitPV)}; lifecycle cost PV ${formatMoney(totals.lifecycleCostPV)}`,
    ...(solution.diagnosis ? [`Why: ${solution.diagnosis}`] : []),
    ...(noCandidates !== undefined ? [`${noCandidates}.`] : []),
    "",
    hasList(result) ? table.toString() : "",
    result.funded.some((project) => project.entry.required) ? "* required by a must-fund rule" : "",
    hasList(result)
      ? `Optimality: upper bound ${formatFixed(solution.bound, 3)}, gap ${solution.gap.toExponential(1)} (engine: ${solution.engine}).`
      : `No list at this budget (status ${solution.status}, engine: ${solution.engine}).`,
    "",
    "Method notes:",
    ...planMethodNotes(result).notes.map((note) => `- ${note}`),
    ...methodLines(describeAssumptions(prepared.scenario)).map((line) => `- ${line}`),
    "",
    ...sections.flatMap((section) => [section, ""]),
    "Cautions:",
    ...CAUTIONS.map((caution) => `- ${caution}`),
  ];
  return lines.filter((line, index, all) => !(line === "" && all[index - 1] === "")).join("\n") + "\n";
}

/** The method choices a reader of the table needs beside the figures (the JSON carries them all under assumptions). */
function methodLines(assumptions: Assumptions): string[] {
  return [
    `Valuing K and A crashes: ${assumptions.ksiCosting}.`,
    `Crash-cost price year: ${assumptions.crashCostEscalation}.`,
    `Combining treatments: ${assumptions.cmfCombination}.`,
    `Service lives: ${assumptions.serviceLives}.`,
    `Traffic growth: ${assumptions.trafficGrowth}.`,
    `SPF calibration: ${assumptions.calibration}.`,
  ];
}
