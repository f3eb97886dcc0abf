import type { PlanComparison } from "../analysis/comparePlans.js";
import type { ProgrammeTotals } from "../analysis/summariseSelection.js";
import { CAUTIONS } from "./cautions.js";
import type { CompareLabels } from "./compareTable.js";
import { jsonNumber } from "./formatNumber.js";
import { KSI_AVOIDED_DEFINITION } from "./ksiAvoidedLabel.js";

/** A what-if comparison as a JSON document; deltas are B − A; undefined or infinite ratios are null. */
export function compareJson(comparison: PlanComparison, labels: CompareLabels): object {
  const totals = (t: ProgrammeTotals) => ({ projects: t.projects, spend: t.cost, ksiAvoided: t.ksiAvoided, benefitPV: t.benefitPV, bcRatio: jsonNumber(t.bcRatio) });
  return {
    a: labels.a,
    b: labels.b,
    currency: labels.currency,
    statusA: comparison.sideA.status,
    statusB: comparison.sideB.status,
    ...(comparison.sideA.diagnosis !== null && { diagnosisA: comparison.sideA.diagnosis }),
    ...(comparison.sideB.diagnosis !== null && { diagnosisB: comparison.sideB.diagnosis }),
    totalsA: totals(comparison.totalsA),
    totalsB: totals(comparison.totalsB),
    change: { ...comparison.delta, bcRatio: jsonNumber(comparison.delta.bcRatio) },
    entering: comparison.entering,
    leaving: comparison.leaving,
    changedTreatment: comparison.changed,
    ...(comparison.moved.length > 0 && { movedYear: comparison.moved }),
    definitions: { ksiAvoided: KSI_AVOIDED_DEFINITION, spend: `capital cost of the list, in ${labels.currency}`, change: "B − A" },
    cautions: CAUTIONS,
  };
}
