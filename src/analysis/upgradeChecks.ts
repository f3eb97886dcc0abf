import { incrementalBenefitCost } from "./incrementalBenefitCost.js";
import type { PlanResult } from "./planProgramme.js";

/** A funded site with several alternatives, read by incremental B/C. */
export interface UpgradeCheck {
  readonly site: string;
  readonly name: string;
  readonly chosen: readonly string[];
  /** The alternative just below the chosen one on the site's cost ladder, if any. */
  readonly stepFrom: readonly string[] | null;
  /** ΔB/ΔC from `stepFrom` to the chosen alternative; null when the chosen one is the cheapest. */
  readonly incrementalBcRatio: number | null;
  /** The chosen upgrade does not pay for its extra cost (ΔB/ΔC < 1, or no extra benefit at all): chosen for K+A crashes avoided, not money. */
  readonly forKsiNotMoney: boolean;
  /** The alternative the HSM challenger–defender procedure prefers on money alone, or null if none has B/C ≥ 1. */
  readonly preferredOnMoney: readonly string[] | null;
}

/**
 * For every funded site with more than one alternative: the incremental B/C of the chosen
 * alternative over the next cheaper one that benefits less (its step on the cost ladder, or, when
 * the chosen one is dominated, over the cheaper one that benefits as much), and a flag when that
 * ratio is below 1 — an upgrade chosen for the KSI it avoids, not for the money it returns.
 */
export function upgradeChecks(result: PlanResult): UpgradeCheck[] {
  const checks: UpgradeCheck[] = [];
  for (const { entry, alternative: chosen } of result.funded) {
    // In a programme the ladder is the site's alternatives in the chosen build year.
    const alternatives = entry.alternatives.filter((alternative) => alternative.buildYear === chosen.buildYear);
    const index = alternatives.indexOf(chosen);
    if (alternatives.length < 2) continue;
    const analysis = incrementalBenefitCost(alternatives);
    // The best-benefit alternative among the strictly cheaper ones: the ladder rung just below.
    let below: number | null = null;
    alternatives.forEach((alternative, other) => {
      if (other === index || alternative.lifecycleCostPV >= chosen.lifecycleCostPV) return;
      if (below === null || alternative.benefitPV > alternatives[below]!.benefitPV) below = other;
    });
    let ratio: number | null = null;
    if (below !== null) {
      const lower = alternatives[below]!;
      ratio = (chosen.benefitPV - lower.benefitPV) / (chosen.lifecycleCostPV - lower.lifecycleCostPV);
    }
    checks.push({
      site: entry.site.id,
      name: entry.site.name,
      chosen: chosen.treatments,
      stepFrom: below === null ? null : alternatives[below]!.treatments,
      incrementalBcRatio: ratio,
      forKsiNotMoney: ratio !== null && ratio < 1,
      preferredOnMoney: analysis.preferred === null ? null : alternatives[analysis.preferred]!.treatments,
    });
  }
  return checks;
}
