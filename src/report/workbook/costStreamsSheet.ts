import type { WorkbookAlternative } from "../../analysis/workbookAlternatives.js";
import type { LiveAssumptions } from "./assumptionsSheet.js";
import type { StreamRows } from "./benefitStreamsSheet.js";
import { cellAddress, columnLetters } from "./cellAddress.js";
import { renewalsFormula, singlePaymentFormula, uniformSeriesFormula, type Term } from "./discountFormulas.js";
import type { Cell, FormulaCell, NumberFormat, SheetSpec } from "./workbookTypes.js";

export const COST_STREAMS_SHEET = "Cost streams";

const HEADERS = [
  "Alternative no.", "Site", "Treatment", "Capital cost", "Upkeep a year", "Service life (years)", "Years in service", "Renewals",
  "Unexpired years at horizon", "Horizon from start of service", "P/A factor", "Upkeep PV", "Renewals PV", "Residual value credit",
  "Lifecycle cost PV at start of service",
] as const;
const PROGRAMME_HEADERS = ["Years to start of service", "Start-of-service discount factor", "Capital phases (year: share)", "Capital discount factor", "Lifecycle cost PV"] as const;
const FORMATS: (NumberFormat | undefined)[] = ["count", undefined, undefined, "money", "money", "year", "year", "count", "year", "year", "factor", "money", "money", "money", "money", "year", "factor", undefined, "factor", "money"];
const HEADER_ROW = 3;

/** The column holding each row's lifecycle cost PV (at the programme's start in a programme). */
export function lifecycleColumn(programme: boolean): number {
  return HEADERS.length + (programme ? PROGRAMME_HEADERS.length : 0);
}

/**
 * One row per alternative and treatment: lifecycle cost PV = capital + upkeep × (P/A, i, years
 * in service) + renewals at the capital cost + ... − the straight-line residual value of the
 * unexpired life, discounted from the horizon (lifecycleCostPV). In a programme the capital is
 * discounted from the years it is spent and the rest from the start of service
 * (alternativeInBuildYear): lifecycle = capital × (capital factor − shares × service factor)
 * + lifecycle at start of service × service factor.
 */
export function costStreamsSheet(alternatives: readonly WorkbookAlternative[], live: LiveAssumptions, programme: boolean): { sheet: SheetSpec; rows: StreamRows[] } {
  const headers: string[] = [...HEADERS, ...(programme ? PROGRAMME_HEADERS : [])];
  const rows: Cell[][] = [[{ value: COST_STREAMS_SHEET, bold: true }], ["Each row: one treatment of an alternative. Formulas read the Assumptions sheet."], headers];
  const ranges: StreamRows[] = [];
  const rate = live.discountRate;
  for (const entry of alternatives) {
    const firstRow = rows.length + 1;
    let sum = 0;
    for (const terms of entry.streams.costs) {
      const r = rows.length + 1;
      const at = (column: number, value: number): Term => ({ ref: cellAddress(r, column), value });
      const capital = at(4, terms.capital);
      const upkeep = at(5, terms.upkeepPerYear);
      const life = at(6, terms.serviceLifeYears);
      const years = at(7, terms.yearsInService);
      const renewals = at(8, terms.renewals);
      const unexpired = at(9, terms.unexpiredYears);
      const horizon = at(10, entry.streams.horizonYears);
      const factor = uniformSeriesFormula(rate, years);
      const upkeepPV = { formula: `${upkeep.ref}*${cellAddress(r, 11)}`, result: upkeep.value * Number(factor.result), format: "money" as const };
      const renewalsPV = renewalsFormula(rate, capital, life, renewals);
      const residualDiscount = singlePaymentFormula(rate, horizon);
      const residual = {
        formula: `${capital.ref}*(${unexpired.ref}/${life.ref})*${residualDiscount.formula}`,
        result: capital.value * (unexpired.value / life.value) * Number(residualDiscount.result),
        format: "money" as const,
      };
      const atService = {
        formula: `${capital.ref}+${cellAddress(r, 12)}+${cellAddress(r, 13)}-${cellAddress(r, 14)}`,
        result: capital.value + upkeepPV.result + Number(renewalsPV.result) - residual.result,
        format: "money" as const,
      };
      const row: Cell[] = [entry.number, entry.site.id, terms.treatment, capital.value, upkeep.value, life.value, years.value, renewals.value, unexpired.value, horizon.value, factor, upkeepPV, renewalsPV, residual, atService];
      if (programme) row.push(...programmeColumns(r, rate, capital, entry.streams.shiftYears, terms.capitalPhases, atService.result));
      sum += programme ? Number((row[row.length - 1] as FormulaCell).result) : atService.result;
      rows.push(row);
    }
    ranges.push({ firstRow, lastRow: rows.length, sum });
  }
  return { sheet: { name: COST_STREAMS_SHEET, rows, frozenRows: HEADER_ROW, frozenColumns: 2, boldRows: [HEADER_ROW], columnFormats: FORMATS }, rows: ranges };
}

function programmeColumns(r: number, rate: Term, capital: Term, shiftYears: number, phases: readonly { readonly year: number; readonly share: number }[], atService: number): Cell[] {
  const shift: Term = { ref: cellAddress(r, 16), value: shiftYears };
  const serviceFactor = singlePaymentFormula(rate, shift);
  const capitalFactor: FormulaCell = {
    formula: phases.map((phase) => `${phase.share}*(1+${rate.ref})^(${-phase.year})`).join("+"),
    result: phases.reduce((total, phase) => total + phase.share * Math.pow(1 + rate.value, -phase.year), 0),
    format: "factor",
  };
  const shares = phases.reduce((total, phase) => total + phase.share, 0);
  const column = (c: number) => `${columnLetters(c)}${r}`;
  const lifecycle: FormulaCell = {
    formula: `${capital.ref}*(${column(19)}-${shares}*${column(17)})+${column(15)}*${column(17)}`,
    result: capital.value * (Number(capitalFactor.result) - shares * Number(serviceFactor.result)) + atService * Number(serviceFactor.result),
    format: "money",
  };
  return [shiftYears, serviceFactor, phases.map((phase) => `${phase.year}: ${phase.share}`).join("; "), capitalFactor, lifecycle];
}
