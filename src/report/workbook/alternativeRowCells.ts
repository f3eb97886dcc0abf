import type { WorkbookAlternative } from "../../analysis/workbookAlternatives.js";
import { SEVERITIES } from "../../model/types.js";
import { figureCells, FIGURE_FORMATS, FIGURE_HEADERS, type FigureSources, type RowFigures } from "./figureCells.js";
import type { Term } from "./discountFormulas.js";
import type { Cell, NumberFormat } from "./workbookTypes.js";

/** The columns every list of alternatives shares, from the treatments on. */
export const ALTERNATIVE_HEADERS = [
  "Treatments", "Capital cost", "Upkeep a year", "Service lives (years)",
  ...SEVERITIES.map((severity) => `${severity} avoided a year`),
  ...FIGURE_HEADERS,
];
export const ALTERNATIVE_FORMATS: readonly (NumberFormat | undefined)[] = [undefined, "money", "money", undefined, ...SEVERITIES.map(() => "crashes" as const), ...FIGURE_FORMATS];

/**
 * The shared cells of one alternative on row `row` from column `first`: its treatments, capital
 * (charged to the budget), upkeep, service lives and crashes avoided a year by severity in its
 * first year of service (values), then its figures as formulas (figureCells).
 */
export function alternativeRowCells(entry: WorkbookAlternative, row: number, first: number, rate: Term, sources: FigureSources, lifecycleStreamColumn: number): { cells: Cell[]; figures: RowFigures } {
  const { alternative, streams } = entry;
  const leading: Cell[] = [
    alternative.treatments.join(" + "),
    alternative.cost,
    streams.costs.reduce((total, terms) => total + terms.upkeepPerYear, 0),
    streams.costs.map((terms) => terms.serviceLifeYears).join("; "),
    ...SEVERITIES.map((severity) => alternative.crashesAvoidedPerYear[severity]),
  ];
  const { cells, figures } = figureCells(row, first + leading.length, rate, sources, lifecycleStreamColumn);
  return { cells: [...leading, ...cells], figures };
}

/** A site's descriptive cells: id, name, district, and the build year in a programme. */
export function siteCells(entry: WorkbookAlternative, programme: boolean): Cell[] {
  return [entry.site.id, entry.site.name, entry.site.district, ...(programme ? [entry.alternative.buildYear ?? null] : [])];
}

export function siteHeaders(programme: boolean): string[] {
  return ["Site", "Name", "District", ...(programme ? ["Build year"] : [])];
}
