import { alternativeCells } from "./alternativeCells.js";
import { avoidedOverSpans } from "./avoidedOverSpans.js";
import type { CellCmf } from "./combineCmfs.js";
import { serviceSpans } from "./serviceSpans.js";
import { SEVERITIES, type CrashMatrix, type Economics, type Severity, type Treatment } from "./types.js";

/** Years (start, end] of an alternative's service over which the same treatments act, and what they avoid each year. */
export interface BenefitSpan {
  readonly startYear: number;
  readonly endYear: number;
  /** Crashes avoided per year by severity at the baseline (before growth, which the span's present worth carries). */
  readonly avoidedPerYear: Readonly<Record<Severity, number>>;
}

/**
 * An alternative's benefit stream, span by span, counted from the start of its service: the
 * figures evaluateAlternative sums, laid out so a spreadsheet can redo the sum. Years count from
 * the start of service over `horizonYears` (the scenario's horizon less a programme build's
 * shift). Benefit PV = Σ spans Σ severities avoided × unit cost × (growing-series present
 * worth of the span); K+A = Σ spans (K + A) × (growing crash-years of the span).
 */
export function benefitSpans(
  treatments: readonly Treatment[],
  expectedPerYear: CrashMatrix,
  economics: Economics,
  horizonYears: number,
  cellCmf: CellCmf,
  crashGrowthPerYear: number,
): BenefitSpan[] {
  const cells = alternativeCells(treatments, expectedPerYear, cellCmf);
  const spans = serviceSpans(treatments.map((t) => t.serviceLifeYears), { ...economics, horizonYears }, crashGrowthPerYear);
  const zeroCosts = new Float64Array(SEVERITIES.length);
  const scratch = new Float64Array(treatments.length);
  const avoided = new Float64Array(SEVERITIES.length);
  const figures = { ksiAvoided: 0, benefitPV: 0 };
  const result: BenefitSpan[] = [];
  let start = 0;
  spans.ends.forEach((end, k) => {
    // One span at a time: avoidedOverSpans reports the first span's crashes avoided per year.
    const one = { inService: spans.inService, ends: spans.ends.subarray(k, k + 1), crashYears: spans.crashYears.subarray(k, k + 1), presentWorth: spans.presentWorth.subarray(k, k + 1) };
    avoidedOverSpans(one, cells.count, cells.expected, cells.severity, cells.cmfs, economics.cmfCombination, zeroCosts, scratch, figures, avoided);
    const [K, A, B, C, O] = avoided;
    result.push({ startYear: start, endYear: end, avoidedPerYear: { K: K!, A: A!, B: B!, C: C!, O: O! } });
    start = end;
  });
  return result;
}
