import type { WorkbookAlternative } from "../../analysis/workbookAlternatives.js";
import { SEVERITIES } from "../../model/types.js";
import type { LiveAssumptions } from "./assumptionsSheet.js";
import { cellAddress } from "./cellAddress.js";
import { growingSeriesFormula, type Term } from "./discountFormulas.js";
import type { Cell, NumberFormat, SheetSpec } from "./workbookTypes.js";

export const BENEFIT_STREAMS_SHEET = "Benefit streams";

/** Where an alternative's rows sit on a streams sheet, and what the column sums come to (the cached values of SUM formulas over them). */
export interface StreamRows {
  readonly firstRow: number;
  readonly lastRow: number;
  readonly sum: number;
}

/** An alternative's benefit rows: their benefit PV and K+A sums. */
export interface BenefitRows {
  readonly benefit: StreamRows;
  readonly ksi: StreamRows;
}

const HEADERS = [
  "Alternative no.", "Site", "Treatments", "From year", "To year", "Crash growth a year", "Years to start of service",
  "K avoided a year", "A avoided a year", "B avoided a year", "C avoided a year", "O avoided a year",
  "Present worth factor", "Crash-years", "K+A crashes avoided", "Benefit PV",
] as const;
const FORMATS: (NumberFormat | undefined)[] = [
  "count", undefined, undefined, "year", "year", "factor", "year", "crashes", "crashes", "crashes", "crashes", "crashes", "factor", "factor", "crashes", "money",
];
export const BENEFIT_COLUMN = HEADERS.indexOf("Benefit PV") + 1;
export const KSI_COLUMN = HEADERS.indexOf("K+A crashes avoided") + 1;
const HEADER_ROW = 3;

/**
 * One row per alternative and service span (years from the start of its service): the crashes
 * avoided per year by severity at the baseline, the span's present-worth factor at the live
 * discount rate and its crash-years, then K+A avoided = (K + A) × crash-years × G^shift and
 * benefit PV = Σ severities avoided × unit cost × present-worth factor × (G ÷ (1 + i))^shift,
 * where a programme build starts service `shift` years after the first year (0 in a one-year list).
 */
export function benefitStreamsSheet(alternatives: readonly WorkbookAlternative[], live: LiveAssumptions): { sheet: SheetSpec; rows: BenefitRows[] } {
  const rows: Cell[][] = [[{ value: BENEFIT_STREAMS_SHEET, bold: true }], ["Each row: one span of years over which the same treatments of an alternative act. Formulas read the Assumptions sheet."], [...HEADERS]];
  const ranges: BenefitRows[] = [];
  for (const entry of alternatives) {
    const firstRow = rows.length + 1;
    const { streams } = entry;
    let benefitSum = 0;
    let ksiSum = 0;
    for (const span of streams.benefit) {
      const r = rows.length + 1;
      const at = (column: number, value: number): Term => ({ ref: cellAddress(r, column), value });
      const growth = at(6, streams.crashGrowthPerYear);
      const shift = at(7, streams.shiftYears);
      const start = at(4, span.startYear);
      const end = at(5, span.endYear);
      const avoided = SEVERITIES.map((severity, s) => at(8 + s, span.avoidedPerYear[severity]));
      const presentWorth = growingSeriesFormula(live.discountRate, growth, start, end);
      const crashYears = growingSeriesFormula(0, growth, start, end);
      const pw = at(13, Number(presentWorth.result));
      const cy = at(14, Number(crashYears.result));
      const moved = streams.shiftYears === 0
        ? { ksi: "", ksiFactor: 1, money: "", moneyFactor: 1 }
        : {
            ksi: `*${growth.ref}^${shift.ref}`,
            ksiFactor: Math.pow(growth.value, shift.value),
            money: `*(${growth.ref}/(1+${live.discountRate.ref}))^${shift.ref}`,
            moneyFactor: Math.pow(growth.value, shift.value) * Math.pow(1 + live.discountRate.value, -shift.value),
          };
      const perYear = SEVERITIES.map((severity, s) => `${avoided[s]!.ref}*${live.unitCost[severity].ref}`).join("+");
      const perYearValue = SEVERITIES.reduce((total, severity, s) => total + avoided[s]!.value * live.unitCost[severity].value, 0);
      const ksi = (avoided[0]!.value + avoided[1]!.value) * cy.value * moved.ksiFactor;
      const benefit = perYearValue * pw.value * moved.moneyFactor;
      ksiSum += ksi;
      benefitSum += benefit;
      rows.push([
        entry.number, entry.site.id, entry.alternative.treatments.join(" + "), start.value, end.value, growth.value, shift.value,
        ...avoided.map((term) => term.value),
        presentWorth, crashYears,
        { formula: `(${avoided[0]!.ref}+${avoided[1]!.ref})*${cy.ref}${moved.ksi}`, result: ksi },
        { formula: `(${perYear})*${pw.ref}${moved.money}`, result: benefit },
      ]);
    }
    ranges.push({ benefit: { firstRow, lastRow: rows.length, sum: benefitSum }, ksi: { firstRow, lastRow: rows.length, sum: ksiSum } });
  }
  return { sheet: { name: BENEFIT_STREAMS_SHEET, rows, frozenRows: HEADER_ROW, frozenColumns: 2, boldRows: [HEADER_ROW], columnFormats: FORMATS }, rows: ranges };
}
