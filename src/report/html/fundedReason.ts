import type { FundedCase } from "../../analysis/justifyPlan.js";
import type { FundedProject } from "../../analysis/fundedProject.js";
import type { UpgradeCheck } from "../../analysis/upgradeChecks.js";
import type { Scenario } from "../../model/types.js";
import { formatFixed, formatMoney } from "../formatNumber.js";
import { treatmentNames } from "./treatmentNames.js";

/**
 * A funded project's one-line reason from its justification: rank by B/C among the funded, cost
 * per K+A crash avoided, what it buys, and, for an upgrade whose incremental B/C over the next
 * cheaper alternative at the site is below 1, the flag "chosen for K+A crashes avoided, not money", e.g.
 * "B/C 12.3, 3rd of 38 by B/C; 26,667 lifecycle cost per K+A crash avoided; avoids 4.5 K+A crashes over 10 years for 120,000 capital."
 */
export function fundedReason(scenario: Scenario, project: FundedProject, justification: FundedCase, fundedCount: number, upgrade: UpgradeCheck | undefined): string {
  const { alternative, entry } = project;
  const years = alternative.effectiveYears;
  const parts = [
    entry.required ? "Required by a must-fund rule. " : "",
    `B/C ${formatFixed(justification.bcRatio, 1)}, ${ordinal(justification.bcRank)} of ${fundedCount} by B/C; `,
    `${formatMoney(justification.costPerKsi)} lifecycle cost per K+A crash avoided; `,
    `avoids ${formatFixed(alternative.ksiAvoided, 1)} K+A crashes over ${years} year${years === 1 ? "" : "s"} for ${formatMoney(alternative.cost)} capital.`,
  ];
  if (justification.alternativesNotChosen > 0) {
    parts.push(` Chosen over ${justification.alternativesNotChosen} other option${justification.alternativesNotChosen === 1 ? "" : "s"} at this site.`);
  }
  if (justification.sharedCrashCells > 0) {
    const rule = scenario.economics.cmfCombination?.rule ?? "multiplicative";
    parts.push(
      ` Its treatments act together on ${justification.sharedCrashCells} crash type × severity cell${justification.sharedCrashCells === 1 ? "" : "s"}; their combined effect there follows the ${rule} rule, an assumption rather than a measured effect.`,
    );
  }
  // Only an upgrade that does not pay its way needs saying; the rest are read from the B/C.
  if (upgrade?.forKsiNotMoney === true && upgrade.stepFrom !== null && upgrade.incrementalBcRatio !== null) {
    const onMoney = upgrade.preferredOnMoney === null ? "" : `; on money alone the site would get ${treatmentNames(scenario, upgrade.preferredOnMoney)}`;
    parts.push(` Chosen for K+A crashes avoided, not money: the step up from ${treatmentNames(scenario, upgrade.stepFrom)} has incremental B/C ${formatFixed(upgrade.incrementalBcRatio, 2)}, below 1${onMoney}.`);
  }
  return parts.join("");
}

function ordinal(n: number): string {
  const tens = n % 100;
  const suffix = tens >= 11 && tens <= 13 ? "th" : (["th", "st", "nd", "rd"][n % 10] ?? "th");
  return `${n}${suffix}`;
}
