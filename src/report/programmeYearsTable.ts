import type { PlanResult } from "../analysis/planProgramme.js";
import { BENEFIT_START_LAG_YEARS } from "../model/programmeTypes.js";
import { formatFixed, formatMoney } from "./formatNumber.js";
import { textTable } from "./textTable.js";

/** The programme year by year (spend against each budget, carry-over, what each year's projects achieve), for the terminal. */
export function programmeYearsTable(result: PlanResult): string | undefined {
  const programme = result.prepared.scenario.programme;
  if (programme === undefined || result.years === undefined) return undefined;
  const currency = result.prepared.scenario.currency;
  const right = (heading: string) => ({ heading, align: "right" as const, maxWidth: 14 });
  const table = textTable(
    [{ heading: "Year" }, right(`Budget (${currency})`), right("Carried in"), right("Spent"), right(programme.carryOver === "unspent" ? "Unspent (carried on)" : "Unspent (lapses)"), right("Projects built"), right("K+A avoided by them"), right("Benefit PV of them"), right("Cumulative K+A avoided")],
    result.years.map((year) => [
      String(year.year),
      formatMoney(year.budget),
      formatMoney(year.carriedIn),
      formatMoney(year.spend),
      formatMoney(year.unspent),
      String(year.projects),
      formatFixed(year.ksiAvoided, 2),
      formatMoney(year.benefitPV),
      formatFixed(year.cumulativeKsiAvoided, 2),
    ]),
  );
  const escalation = programme.costEscalationRate === 0 ? "no cost escalation" : `capital costs escalate ${formatFixed(programme.costEscalationRate * 100, 1)}% a year from ${programme.firstYear}`;
  return [
    `Programme ${programme.firstYear}–${programme.firstYear + programme.years - 1}, year by year (carry-over: ${programme.carryOver}; ${escalation}):`,
    table,
    `Benefits start ${BENEFIT_START_LAG_YEARS} year after the build year; every money figure is discounted to ${programme.firstYear}; the horizon counts from ${programme.firstYear}, so a later build has fewer years of benefit in it.`,
  ].join("\n");
}

/** Why each project is in its year and not earlier, and what a one-year delay of it alone would cost. */
export function programmeTimingTable(result: PlanResult, options: { readonly all?: boolean } = {}): string | undefined {
  if (result.timing === undefined || result.timing.length === 0) return undefined;
  const shown = options.all === true ? result.timing : result.timing.slice(0, 50);
  const table = textTable(
    [{ heading: "Site" }, { heading: "Year" }, { heading: "Why not earlier", maxWidth: 60 }, { heading: "K+A lost by a one-year delay", align: "right", maxWidth: 14 }],
    shown.map((timing) => [timing.site, String(timing.buildYear), timing.reason, timing.delayCostKsi === null ? "cannot move" : formatFixed(timing.delayCostKsi, 3)]),
  );
  const more = shown.length < result.timing.length ? [`Showing ${shown.length} of ${result.timing.length}; --all or --format json lists every project.`] : [];
  return ["Timing of each project (a delay moves that project alone a year later; the rest of the programme unchanged):", table, ...more].join("\n");
}
