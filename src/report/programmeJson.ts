import type { PlanResult } from "../analysis/planProgramme.js";
import { BENEFIT_START_LAG_YEARS } from "../model/programmeTypes.js";

/** What `plan --format json` adds for a multi-year programme: its settings, a `years` array, and each project's year and timing. */
export function programmeJson(result: PlanResult): object {
  const programme = result.prepared.scenario.programme;
  if (programme === undefined || result.years === undefined) return {};
  return {
    programme: {
      firstYear: programme.firstYear,
      years: programme.years,
      carryOver: programme.carryOver,
      costEscalationRate: programme.costEscalationRate,
      committed: programme.committed,
      benefitStartsYearsAfterBuild: BENEFIT_START_LAG_YEARS,
      discountedTo: programme.firstYear,
    },
    years: result.years,
  };
}

/** The programme fields of one selected project (none in a one-year list). */
export function projectYearJson(result: PlanResult, index: number): object {
  const alternative = result.funded[index]!.alternative;
  if (alternative.buildYear === undefined) return {};
  const timing = result.timing?.[index];
  return {
    buildYear: alternative.buildYear,
    spendByYear: alternative.spendByYear,
    ...(timing !== undefined && {
      timing: { notEarlier: timing.notEarlier, reason: timing.reason, delayCostKsi: timing.delayCostKsi, delayCostBenefitPV: timing.delayCostBenefitPV },
    }),
  };
}
