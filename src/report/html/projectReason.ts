import type { FundedProject } from "../../analysis/planProgramme.js";
import { formatFixed, formatMoney } from "../formatNumber.js";

/**
 * A plain one-line reason for funding a project, read straight from its numbers, e.g.
 * "Avoids 4.5 KSI crashes over 10 years for 120,000 capital; B/C 12.3; 26,667 lifecycle cost per KSI."
 */
export function projectReason(project: FundedProject): string {
  const { alternative, entry } = project;
  const rule = entry.required ? "Required by a must-fund rule. " : "";
  const years = alternative.effectiveYears;
  return (
    `${rule}Avoids ${formatFixed(alternative.ksiAvoided, 1)} KSI crashes over ${years} year${years === 1 ? "" : "s"} ` +
    `for ${formatMoney(alternative.cost)} capital; B/C ${formatFixed(alternative.bcRatio, 1)}; ` +
    `${formatMoney(alternative.costPerKsi)} lifecycle cost per KSI.`
  );
}
