import { planMethodNotes } from "../analysis/planMethodNotes.js";
import type { PlanResult } from "../analysis/planProgramme.js";
import { sitesWithoutCandidates } from "../model/sitesWithoutCandidates.js";
import { CAUTIONS } from "./cautions.js";
import { describeAssumptions, type Assumptions } from "./describeAssumptions.js";
import { formatFixed, formatMoney } from "./formatNumber.js";
import { hasList } from "./hasList.js";
import { KSI_AVOIDED_LABEL } from "./ksiAvoidedLabel.js";
import { noCandidatesText } from "./noCandidatesText.js";
import { programmeTimingTable, programmeYearsTable } from "./programmeYearsTable.js";
import { textTable } from "./textTable.js";

/** Projects the table lists unless asked for all: beyond this a terminal list stops being read. */
export const PLAN_TABLE_ROWS = 50;

/**
 * The funded list as a terminal table, with totals against the budget, any extra sections (before
 * the cautions) and the cautions. A list longer than PLAN_TABLE_ROWS shows its projects of most
 * objective value, largest first, unless `all`; the totals always cover the whole list.
 */
export function planTable(result: PlanResult, sections: readonly string[] = [], options: { readonly all?: boolean } = {}): string {
  const { prepared, solution, totals } = result;
  const currency = prepared.scenario.currency;
  const methodBySite = new Map(prepared.baselines.map((baseline) => [baseline.site, baseline.method === "empirical-bayes" ? "EB" : "observed"]));
  const noCandidates = noCandidatesText(sitesWithoutCandidates(prepared.scenario.sites));
  const years = prepared.scenario.programme !== undefined;
  const programmeSections = [programmeYearsTable(result), programmeTimingTable(result, options)].filter((section): section is string => section !== undefined);
  const cut = options.all !== true && result.funded.length > PLAN_TABLE_ROWS;
  const value = prepared.objective === "ksi" ? (project: (typeof result.funded)[number]) => project.alternative.ksiAvoided : (project: (typeof result.funded)[number]) => project.alternative.benefitPV;
  const listed = cut ? [...result.funded].sort((x, y) => value(y) - value(x)).slice(0, PLAN_TABLE_ROWS) : result.funded;
  const right = (heading: string) => ({ heading, align: "right" as const });
  // Figures are short, so their long headings wrap rather than widen the table.
  const narrow = (heading: string) => ({ heading, align: "right" as const, maxWidth: 14 });
  const table = textTable(
    [{ heading: "Site" }, { heading: "Name", maxWidth: 24 }, { heading: "District" }, { heading: "Baseline" }, { heading: "Treatments", maxWidth: 32 }, ...(years ? [{ heading: "Year" }] : []), narrow(`Cost (${currency})`), narrow(KSI_AVOIDED_LABEL), right("B/C"), narrow(`NPV (${currency})`), narrow(`Cost per K+A crash avoided (${currency})`)],
    [
      ...listed.map(({ entry, alternative }) => [
        entry.site.id + (entry.required ? " *" : ""),
        entry.site.name,
        entry.site.district,
        methodBySite.get(entry.site.id) ?? "",
        alternative.treatments.join(" + "),
        ...(years ? [String(alternative.buildYear)] : []),
        formatMoney(alternative.cost),
        formatFixed(alternative.ksiAvoided, 2),
        formatFixed(alternative.bcRatio, 2),
        formatMoney(alternative.npv),
        formatMoney(alternative.costPerKsi),
      ]),
      { lead: `Total: ${totals.projects} project(s)`, span: years ? 6 : 5, cells: [formatMoney(totals.cost), formatFixed(totals.ksiAvoided, 2), formatFixed(totals.bcRatio, 2), formatMoney(totals.npv), formatMoney(totals.costPerKsi)] },
    ],
  );
  const shownNote = `Showing the ${PLAN_TABLE_ROWS} of ${result.funded.length} funded projects with the most ${prepared.objective === "ksi" ? "K+A crashes avoided" : "benefit PV"}, largest first; the total covers all of them. --all lists every project; --format csv or json always carries them all.`;

  const lines = [
    `${prepared.scenario.name}`,
    `Objective: ${prepared.objective === "ksi" ? "K+A crashes avoided (KSI crashes, not people)" : "benefit PV"}   Baseline: ${prepared.scenario.baseline}   Status: ${solution.status}${solution.status === "optimal" ? " (proven)" : ""}`,
    `Budget ${formatMoney(result.budget)} ${currency}; spent ${formatMoney(totals.cost)} (${formatFixed(result.budget > 0 ? (100 * totals.cost) / result.budget : 0, 1)}%); left ${formatMoney(result.budget - totals.cost)}`,
    `K+A crashes avoided ${formatFixed(totals.ksiAvoided, 2)} over the analysis period (${formatFixed(totals.ksiAvoidedPerYear, 2)} a year at first); benefit PV ${formatMoney(totals.benefitPV)}; lifecycle cost PV ${formatMoney(totals.lifecycleCostPV)}`,
    ...(solution.diagnosis ? [`Why: ${solution.diagnosis}`] : []),
    ...(noCandidates !== undefined ? [`${noCandidates}.`] : []),
    "",
    hasList(result) ? table : "",
    ...(cut ? [shownNote] : []),
    result.funded.some((project) => project.entry.required) ? `* required by a must-fund rule${years ? " or committed by an earlier programme" : ""}` : "",
    hasList(result)
      ? `Optimality: upper bound ${formatFixed(solution.bound, 3)}, gap ${solution.gap.toExponential(1)} (engine: ${solution.engine}).`
      : `No list at this budget (status ${solution.status}, engine: ${solution.engine}).`,
    "",
    "Method notes:",
    ...planMethodNotes(result).notes.map((note) => `- ${note}`),
    ...methodLines(describeAssumptions(prepared.scenario)).map((line) => `- ${line}`),
    "",
    ...[...programmeSections, ...sections].flatMap((section) => [section, ""]),
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
