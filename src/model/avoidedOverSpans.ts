import { combineCmfValues } from "./combineCmfs.js";
import type { ServiceSpans } from "./serviceSpans.js";
import type { CmfCombination } from "./types.js";

// Crashes avoided per year by severity in one span; the function is synchronous, so one buffer serves every call.
const avoided = new Float64Array(5);

/** K+A crashes avoided and benefit PV of one alternative, written by avoidedOverSpans. */
export interface AvoidedFigures {
  ksiAvoided: number;
  benefitPV: number;
}

/**
 * The crashes one alternative avoids over its service spans. `cellCount` crash cells, cell c
 * with `cellExpected[c]` expected crashes per year, severity index `cellSeverity[c]` (KABCO order,
 * K and A first) and the CMF of the alternative's treatment i in `cmfs[c * n + i]`. In each span
 * only the treatments in service act, combined by `combination`; the crashes avoided per year by
 * severity are multiplied by the span's crash-years (K+A) and by its present worth of
 * `costPerCrash` (benefit). `avoidedFirstYear`, when given, receives the first span's crashes
 * avoided per year by severity. Typed arrays throughout keep this hot loop monomorphic. `active` is scratch space of at least n entries. Plan and draws
 * both evaluate through here, so a draw with the plan's inputs gives the plan's figures exactly.
 */
export function avoidedOverSpans(
  spans: ServiceSpans,
  cellCount: number,
  cellExpected: Float64Array,
  cellSeverity: Int32Array,
  cmfs: Float64Array,
  combination: CmfCombination | undefined,
  costPerCrash: Float64Array,
  active: Float64Array,
  out: AvoidedFigures,
  avoidedFirstYear?: Float64Array,
): void {
  const n = spans.inService.length;
  let ksiAvoided = 0;
  let benefitPV = 0;
  for (let k = 0; k < spans.ends.length; k += 1) {
    const end = spans.ends[k]!;
    avoided.fill(0);
    let allInService = true;
    for (let i = 0; i < n; i += 1) if (spans.inService[i]! < end) allInService = false;
    for (let c = 0; c < cellCount; c += 1) {
      let combined: number;
      if (allInService) combined = combineCmfValues(cmfs, n, combination, c * n);
      else {
        let count = 0;
        for (let i = 0; i < n; i += 1) if (spans.inService[i]! >= end) active[count++] = cmfs[c * n + i]!;
        combined = combineCmfValues(active, count, combination);
      }
      avoided[cellSeverity[c]!]! += cellExpected[c]! * (1 - combined);
    }
    if (k === 0 && avoidedFirstYear !== undefined) avoidedFirstYear.set(avoided);
    ksiAvoided += (0 + avoided[0]! + avoided[1]!) * spans.crashYears[k]!;
    let benefitPerYear = 0;
    for (let s = 0; s < 5; s += 1) benefitPerYear += avoided[s]! * costPerCrash[s]!;
    benefitPV += benefitPerYear * spans.presentWorth[k]!;
  }
  out.ksiAvoided = ksiAvoided;
  out.benefitPV = benefitPV;
}
