import type { NotFundedCase } from "../../analysis/justifyPlan.js";
import type { WorkbookAlternative } from "../../analysis/workbookAlternatives.js";
import { byBcRatioDescending } from "../../model/benefitCostRatio.js";
import { ALTERNATIVE_FORMATS, ALTERNATIVE_HEADERS, alternativeRowCells } from "./alternativeRowCells.js";
import type { LiveAssumptions } from "./assumptionsSheet.js";
import type { BenefitRows, StreamRows } from "./benefitStreamsSheet.js";
import type { Cell, NumberFormat, SheetSpec } from "./workbookTypes.js";

export const NOT_FUNDED_SHEET = "Not funded";
const HEADER_ROW = 3;

/** A site left out, as the sheet shows it: the plan's justification, or one stated reason when there is no list. */
export type NotFundedRow = Omit<NotFundedCase, "reason"> & { readonly reason: string };

/** One alternative's rows on the stream sheets. */
export interface AlternativeSources {
  readonly entry: WorkbookAlternative;
  readonly benefit: BenefitRows;
  readonly lifecycle: StreamRows;
}

/**
 * Each site not funded, with the reason and entry threshold from the plan's justification and
 * the figures of one alternative as formulas: the one closest to entering (the threshold's),
 * or else the one with the highest B/C. A site with no alternative has no figures.
 */
export function notFundedSheet(cases: readonly NotFundedRow[], bySite: ReadonlyMap<string, readonly AlternativeSources[]>, live: LiveAssumptions, lifecycleStreamColumn: number, value: { readonly unit: string; readonly format: NumberFormat }): SheetSpec {
  const leading = ["Site", "Name", "Reason", "Explanation", "Alternative shown", "Alternative no.", "Build year"];
  const trailing = ["Cost threshold", "Cost cut needed", `Extra value needed (${value.unit})`];
  const rows: Cell[][] = [
    [{ value: NOT_FUNDED_SHEET, bold: true }],
    ["Why each site is not on the list (LP reduced-cost argument: a threshold is about the least change needed), with one alternative's figures as formulas."],
    [...leading, ...ALTERNATIVE_HEADERS, ...trailing],
  ];
  for (const notFunded of cases) {
    const row = rows.length + 1;
    const options = bySite.get(notFunded.site) ?? [];
    const threshold = notFunded.threshold;
    const closest = threshold === null ? undefined : options.find((option) => sameTreatments(option.entry.alternative.treatments, threshold.treatments) && option.entry.alternative.cost === threshold.cost);
    const shown = closest ?? [...options].sort((a, b) => byBcRatioDescending(a.entry.alternative.bcRatio, b.entry.alternative.bcRatio))[0];
    const head: Cell[] = [notFunded.site, notFunded.name, notFunded.reason, notFunded.explanation];
    if (shown === undefined) {
      rows.push([...head, "none: the site has no alternative"]);
      continue;
    }
    const { cells } = alternativeRowCells(shown.entry, row, leading.length + 1, live.discountRate, { yearsInService: shown.entry.alternative.effectiveYears, benefit: shown.benefit, lifecycle: shown.lifecycle }, lifecycleStreamColumn);
    rows.push([
      ...head,
      closest !== undefined ? "closest to entering" : "highest B/C",
      shown.entry.number,
      shown.entry.alternative.buildYear ?? null,
      ...cells,
      threshold?.costThreshold ?? null,
      threshold?.costCut ?? null,
      threshold?.extraValueNeeded ?? null,
    ]);
  }
  const columnFormats: (NumberFormat | undefined)[] = [undefined, undefined, undefined, undefined, undefined, "count", "year", ...ALTERNATIVE_FORMATS, "money", "money", value.format];
  return { name: NOT_FUNDED_SHEET, rows, frozenRows: HEADER_ROW, frozenColumns: 2, boldRows: [HEADER_ROW], columnFormats };
}

function sameTreatments(a: readonly string[], b: readonly string[]): boolean {
  return a.length === b.length && a.every((id, index) => id === b[index]);
}
