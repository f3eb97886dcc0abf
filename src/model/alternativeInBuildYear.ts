import { benefitCostRatio } from "./benefitCostRatio.js";
import type { CellCmf } from "./combineCmfs.js";
import { evaluateAlternative } from "./evaluateAlternative.js";
import { lifecycleCostPV } from "./lifecycleCostPV.js";
import { BENEFIT_START_LAG_YEARS, type CapitalPhase, type ProgrammeYears } from "./programmeTypes.js";
import { singlePaymentPresentWorth } from "./singlePaymentPresentWorth.js";
import { treatmentCapitalCost } from "./treatmentCapitalCost.js";
import type { Alternative, CrashMatrix, Economics, Severity, Site, Treatment } from "./types.js";

const ALL_IN_BUILD_YEAR: readonly CapitalPhase[] = [{ yearsBeforeBuild: 0, share: 1 }];

/** Where a treatment set cannot be built in a year: its phasing needs capital before the programme starts. */
export function phasingLeadYears(treatments: readonly Treatment[]): number {
  return Math.max(0, ...treatments.flatMap((t) => (t.phasing ?? ALL_IN_BUILD_YEAR).map((phase) => phase.yearsBeforeBuild)));
}

/**
 * One alternative built in `buildYear` of a programme, every figure discounted to the
 * programme's first year (year offset 0, undiscounted, as a one-year list's present).
 *
 * A year m years after the first is discounted by (P/F, i, m). The capital of a treatment is
 * spent by its phasing in the build year d and the years before it, escalated by (1 + e)^d; the
 * treatments act from the year after the build year (BENEFIT_START_LAG_YEARS) to the horizon,
 * which counts from the first year, so a later build buys fewer years of benefit. The crashes of
 * year m grow as G^m. So the benefit, K+A and upkeep of a build in year d are those of a
 * one-year list with horizon H − d, scaled by G^d (crashes) and (P/F, i, d) (money): in d = 0
 * with no phasing or escalation the figures are the one-year list's exactly.
 *
 * `allowSpendBeforeStart` (committed projects): capital phased before the first year is sunk; it
 * is counted in the lifecycle cost (compounded to the first year) but charged to no budget.
 * Without it, such a build year has no alternative (undefined), nor has one with no benefit year.
 */
export function alternativeInBuildYear(
  site: Site,
  treatments: readonly Treatment[],
  expectedPerYear: CrashMatrix,
  economics: Economics,
  programme: ProgrammeYears,
  buildYear: number,
  cellCmf: CellCmf,
  crashGrowthPerYear: number,
  allowSpendBeforeStart = false,
): Alternative | undefined {
  const d = buildYear - programme.firstYear;
  const shift = d + BENEFIT_START_LAG_YEARS - 1;
  const horizon = economics.horizonYears - shift;
  if (horizon < 1) return undefined;
  if (!allowSpendBeforeStart && phasingLeadYears(treatments) > d) return undefined;
  const { discountRate } = economics;
  const renewal = economics.renewal ?? "none";
  const escalation = Math.pow(1 + programme.costEscalationRate, d);
  const atBuild = singlePaymentPresentWorth(discountRate, shift);
  const growth = Math.pow(crashGrowthPerYear, shift);

  const shifted = evaluateAlternative(site, treatments, expectedPerYear, { ...economics, horizonYears: horizon }, cellCmf, crashGrowthPerYear);
  const spendByYear = new Array<number>(programme.years).fill(0);
  let lifecycle = 0;
  treatments.forEach((treatment) => {
    const capital = treatmentCapitalCost(treatment, site) * escalation;
    // Upkeep, renewals and residual value as in a one-year list from the start of service, moved there;
    // the initial capital is then moved from the start of service to the years it is spent.
    lifecycle += lifecycleCostPV(capital, treatment.upkeepPerYear, treatment.serviceLifeYears, discountRate, horizon, renewal) * atBuild;
    for (const phase of treatment.phasing ?? ALL_IN_BUILD_YEAR) {
      const year = d - phase.yearsBeforeBuild;
      const amount = capital * phase.share;
      lifecycle += amount * (singlePaymentPresentWorth(discountRate, year) - atBuild);
      if (year >= 0) spendByYear[year]! += amount;
    }
  });
  const cost = spendByYear.reduce((total, amount) => total + amount, 0);
  const ksiAvoided = shifted.ksiAvoided * growth;
  const benefitPV = shifted.benefitPV * growth * atBuild;
  return {
    ...shifted,
    cost,
    lifecycleCostPV: lifecycle,
    crashesAvoidedPerYear: scale(shifted.crashesAvoidedPerYear, growth),
    ksiAvoided,
    benefitPV,
    bcRatio: benefitCostRatio(benefitPV, lifecycle),
    npv: benefitPV - lifecycle,
    costPerKsi: ksiAvoided > 0 ? lifecycle / ksiAvoided : Infinity,
    buildYear,
    spendByYear,
  };
}

function scale(values: Readonly<Record<Severity, number>>, factor: number): Record<Severity, number> {
  if (factor === 1) return { ...values };
  return { K: values.K * factor, A: values.A * factor, B: values.B * factor, C: values.C * factor, O: values.O * factor };
}
