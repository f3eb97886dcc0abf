import type { SiteBaseline } from "../../model/siteBaselines.js";
import { SEVERITIES, type Scenario, type Severity } from "../../model/types.js";
import { describeAssumptions } from "../describeAssumptions.js";
import type { Term } from "./discountFormulas.js";
import type { Cell, DefinedName, SheetSpec } from "./workbookTypes.js";

export const ASSUMPTIONS_SHEET = "Assumptions";

/** The live inputs every money formula reads, by their workbook names and the values they hold. */
export interface LiveAssumptions {
  readonly discountRate: Term;
  /** The unit cost each severity's avoided crash is valued at. */
  readonly unitCost: Readonly<Record<Severity, Term>>;
}

export const ASSUMPTIONS_NOTE =
  "Changing the discount rate, the stated unit crash costs, the escalation factor or the fatal share on this sheet recomputes every money figure of the lists shown " +
  "(benefit PV, lifecycle cost PV, B/C, NPV, cost per K+A crash). It does not re-optimise the list: the projects funded stay those averta chose. Rerun averta for that. " +
  "The horizon, service lives, CMFs and crash estimates are written as values, fixed for this workbook.";

const HEADER_ROW = 4;

/**
 * The Assumptions sheet: one row per assumption (label, value, name, source or note). The
 * discount rate, stated unit costs, escalation factor and fatal share are named input cells;
 * the unit costs used are formulas over them, as resolveCrashCosts computes them.
 */
export function assumptionsSheet(scenario: Scenario, baselines: readonly SiteBaseline[]): { sheet: SheetSpec; names: DefinedName[]; live: LiveAssumptions } {
  const { economics } = scenario;
  const costs = economics.crashCosts;
  const described = describeAssumptions(scenario, baselines);
  const rows: Cell[][] = [[{ value: "Assumptions", bold: true }], [ASSUMPTIONS_NOTE], [], ["Assumption", "Value", "Name", "Source or note"]];
  const names: DefinedName[] = [];
  const add = (label: string, value: Cell, note: string, name?: string): Term => {
    rows.push([label, value, name ?? null, note]);
    if (name !== undefined) names.push({ name, sheet: ASSUMPTIONS_SHEET, row: rows.length, column: 2 });
    return { ref: name ?? `B${rows.length}`, value: heldNumber(value) };
  };

  const discountRate = add("Discount rate (a year)", { value: economics.discountRate, format: "rate" }, "real rate used in every present-worth factor (live)", "DiscountRate");
  add("Analysis horizon (years)", { value: economics.horizonYears, format: "year" }, "fixed for this workbook: service spans are written as values", "HorizonYears");
  add("Currency", scenario.currency, "ISO 4217 code");
  add("Price year of capital costs and budget", economics.priceYear ?? "not stated", "");
  add("Crash cost source", costs.source, "");
  add("Crash cost price year", costs.priceYear ?? "not stated", "");
  const escalation = add("Crash cost escalation factor", { value: costs.escalationFactor ?? 1, format: "factor" }, `${described.crashCostEscalation} (live)`, "CrashCostEscalation");
  const stated = costs.statedPerCrash ?? costs.perCrash;
  const statedTerms = {} as Record<Severity, Term>;
  for (const severity of SEVERITIES) {
    statedTerms[severity] = add(`Stated unit cost of a ${severity} crash`, { value: stated[severity], format: "money" }, "per crash, in the crash cost price year (live)", `StatedCost${severity}`);
  }
  const escalated = (severity: Severity): { formula: string; result: number } => ({
    formula: `${statedTerms[severity].ref}*${escalation.ref}`,
    result: statedTerms[severity].value * escalation.value,
  });
  const ksiCosting = costs.ksiCosting ?? { method: "by-severity" as const };
  const unitCost = {} as Record<Severity, Term>;
  const used = (severity: Severity, formula: string, result: number, note: string) => {
    unitCost[severity] = add(`Unit cost used for a ${severity} crash`, { formula, result, format: "money" }, note, `CrashCost${severity}`);
  };
  if (ksiCosting.method === "combined" && ksiCosting.fatalShare !== undefined) {
    const share = add("Fatal share K ÷ (K + A)", { value: ksiCosting.fatalShare, format: "factor" }, `${ksiCosting.basis} (live)`, "FatalShare");
    const k = escalated("K");
    const a = escalated("A");
    const combined = { formula: `${share.ref}*${k.formula}+(1-${share.ref})*${a.formula}`, result: share.value * k.result + (1 - share.value) * a.result };
    for (const severity of ["K", "A"] as const) used(severity, combined.formula, combined.result, "one combined K+A unit cost: fatal share × K + (1 − fatal share) × A, both escalated");
  } else if (ksiCosting.method === "combined") {
    const statedCombined = add("Stated combined K+A unit cost", { value: ksiCosting.unitCost / escalation.value, format: "money" }, `${ksiCosting.basis}, in the crash cost price year (live)`, "StatedCostKA");
    for (const severity of ["K", "A"] as const) used(severity, `${statedCombined.ref}*${escalation.ref}`, statedCombined.value * escalation.value, "the combined K+A unit cost, escalated");
  }
  for (const severity of SEVERITIES) if (unitCost[severity] === undefined) used(severity, escalated(severity).formula, escalated(severity).result, "stated unit cost × escalation factor");

  add("K+A costing", described.ksiCosting, "");
  add("CMF combination rule", described.cmfCombination, "fixed for this workbook: the crashes avoided per year are written as values");
  add("Service lives and renewal", described.serviceLives, "fixed for this workbook");
  add("Traffic growth", described.trafficGrowth, "each stream row carries its site's crash growth a year");
  add("Expected crashes (baseline)", `${scenario.baseline}: ${described.baselineCounts?.empiricalBayes ?? 0} site(s) by Empirical Bayes, ${described.baselineCounts?.observed ?? 0} by observed counts`, "");
  add("SPF calibration", described.calibration, "");
  add("Crash window", `${scenario.crashWindow.firstYear}–${scenario.crashWindow.lastYear}`, "");
  add("K+A crashes avoided", described.ksiDefinition, "");
  for (const line of described.localEvidence ?? []) add("CMF with local evidence", line, "fixed for this workbook: the crashes avoided per year are written as values");
  if (scenario.programme !== undefined) {
    const p = scenario.programme;
    add("Programme years", `${p.firstYear}–${p.firstYear + p.years - 1}`, "figures are discounted to the start of the first year");
    add("Capital cost escalation (a year)", { value: p.costEscalationRate, format: "rate" }, "applied to each build's capital, written as values");
  }
  return { sheet: { name: ASSUMPTIONS_SHEET, rows, frozenRows: HEADER_ROW, boldRows: [HEADER_ROW] }, names, live: { discountRate, unitCost } };
}

// The number a cell holds, for the cached results of the formulas that refer to it.
function heldNumber(cell: Cell): number {
  if (typeof cell === "number") return cell;
  if (typeof cell !== "object" || cell === null) return Number.NaN;
  const held = "formula" in cell ? cell.result : cell.value;
  return typeof held === "number" ? held : Number.NaN;
}
