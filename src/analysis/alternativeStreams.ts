import { benefitSpans, type BenefitSpan } from "../model/benefitSpans.js";
import { renewalSchedule, yearsInService } from "../model/lifecycleCostPV.js";
import { BENEFIT_START_LAG_YEARS } from "../model/programmeTypes.js";
import type { SiteBaseline } from "../model/siteBaselines.js";
import { treatmentCapitalCost } from "../model/treatmentCapitalCost.js";
import { treatmentCmf } from "../model/treatmentCmf.js";
import type { Alternative, Scenario, Site } from "../model/types.js";

/** One treatment's costs within an alternative, in the terms a spreadsheet recomputes its lifecycle cost PV from. */
export interface TreatmentCostTerms {
  readonly treatment: string;
  /** Capital cost, escalated to the build year in a programme. */
  readonly capital: number;
  readonly upkeepPerYear: number;
  readonly serviceLifeYears: number;
  /** Years it is in service from the start of service, within the horizon. */
  readonly yearsInService: number;
  readonly renewals: number;
  /** Unexpired years of its last installation at the horizon, credited at straight-line value (0: none). */
  readonly unexpiredYears: number;
  /** When its capital is spent, in years from the programme's first year (0 in a one-year list), and the share each time. */
  readonly capitalPhases: readonly { readonly year: number; readonly share: number }[];
}

/**
 * An alternative's benefit and cost streams: its economics taken apart, so each figure can be
 * rebuilt from these terms and the scenario's discount rate and unit crash costs (the workbook's
 * formulas). In a programme a build in year d starts service `shiftYears` = d + lag − 1 after the
 * first year: its streams are those of a one-year list over `horizonYears` = H − shift, moved
 * there (see alternativeInBuildYear).
 */
export interface AlternativeStreams {
  readonly shiftYears: number;
  readonly horizonYears: number;
  readonly crashGrowthPerYear: number;
  readonly benefit: readonly BenefitSpan[];
  readonly costs: readonly TreatmentCostTerms[];
}

export function alternativeStreams(scenario: Scenario, site: Site, baseline: SiteBaseline, alternative: Alternative): AlternativeStreams {
  const byId = new Map(scenario.catalogue.treatments.map((t) => [t.id, t]));
  const treatments = alternative.treatments.map((id) => byId.get(id)!);
  const { economics, programme } = scenario;
  const buildOffset = programme === undefined || alternative.buildYear === undefined ? 0 : alternative.buildYear - programme.firstYear;
  const shiftYears = programme === undefined ? 0 : buildOffset + BENEFIT_START_LAG_YEARS - 1;
  const horizonYears = economics.horizonYears - shiftYears;
  const renewal = economics.renewal ?? "none";
  const escalation = programme === undefined ? 1 : Math.pow(1 + programme.costEscalationRate, buildOffset);
  const crashGrowthPerYear = baseline.crashGrowthPerYear ?? 1;
  const costs = treatments.map((treatment): TreatmentCostTerms => ({
    treatment: treatment.id,
    capital: treatmentCapitalCost(treatment, site) * escalation,
    upkeepPerYear: treatment.upkeepPerYear,
    serviceLifeYears: treatment.serviceLifeYears,
    yearsInService: yearsInService(treatment.serviceLifeYears, horizonYears, renewal),
    ...renewalSchedule(treatment.serviceLifeYears, horizonYears, renewal),
    capitalPhases: (programme === undefined ? undefined : treatment.phasing)?.map((phase) => ({ year: buildOffset - phase.yearsBeforeBuild, share: phase.share })) ?? [{ year: buildOffset, share: 1 }],
  }));
  const benefit = benefitSpans(treatments, baseline.expectedPerYear, economics, horizonYears, treatmentCmf, crashGrowthPerYear);
  return { shiftYears, horizonYears, crashGrowthPerYear, benefit, costs };
}
