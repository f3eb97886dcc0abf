import { describeCmfCombination } from "../model/combineCmfs.js";
import { effectEvidenceLines } from "../model/effectEvidenceLines.js";
import { describeServiceLives } from "../model/evaluateAlternative.js";
import { describeTrafficGrowth, type SiteBaseline } from "../model/siteBaselines.js";
import type { Scenario } from "../model/types.js";
import { KSI_AVOIDED_DEFINITION } from "./ksiAvoidedLabel.js";

/** How many sites used each baseline method. */
export interface BaselineCounts {
  readonly empiricalBayes: number;
  readonly observed: number;
}

/** The assumptions behind every figure, as the JSON and reports state them. */
export interface Assumptions {
  readonly currency: string;
  readonly discountRate: number;
  readonly horizonYears: number;
  readonly crashWindow: { readonly firstYear: number; readonly lastYear: number };
  readonly baseline: string;
  /** Sites by the baseline method actually used (present when the baselines are known). */
  readonly baselineCounts: BaselineCounts | null;
  /** Unit costs used for benefits (escalated, K and A combined when so valued). */
  readonly crashCosts: Readonly<Record<string, number>>;
  /** Unit costs as the scenario states them, in their own price year. */
  readonly statedCrashCosts: Readonly<Record<string, number>>;
  readonly crashCostSource: string;
  readonly crashCostPriceYear: number | null;
  readonly programmePriceYear: number | null;
  readonly crashCostEscalation: string;
  readonly ksiCosting: string;
  readonly cmfCombination: string;
  readonly serviceLives: string;
  readonly trafficGrowth: string;
  readonly calibration: string;
  readonly ksiDefinition: string;
  /** One line per effect whose CMF rests on local before-after evidence: the result, both inputs and the rule (absent: none, so outputs without it keep their bytes). */
  readonly localEvidence?: readonly string[];
}

/** Collects the scenario's economic and method assumptions in one plain object. */
export function describeAssumptions(scenario: Scenario, baselines?: readonly SiteBaseline[]): Assumptions {
  const { economics } = scenario;
  const costs = economics.crashCosts;
  const ksiCosting = costs.ksiCosting;
  const localEvidence = effectEvidenceLines(scenario.catalogue.treatments);
  return {
    currency: scenario.currency,
    discountRate: economics.discountRate,
    horizonYears: economics.horizonYears,
    crashWindow: scenario.crashWindow,
    baseline: scenario.baseline,
    baselineCounts: baselines === undefined ? null : countBaselines(baselines),
    crashCosts: costs.perCrash,
    statedCrashCosts: costs.statedPerCrash ?? costs.perCrash,
    crashCostSource: costs.source,
    crashCostPriceYear: costs.priceYear ?? null,
    programmePriceYear: economics.priceYear ?? null,
    crashCostEscalation: costs.escalation ?? "none: unit costs are used in their own price year",
    ksiCosting:
      ksiCosting === undefined || ksiCosting.method === "by-severity"
        ? "by severity: K and A crashes each at their own unit cost"
        : `combined: K and A crashes both at one K+A unit cost of ${Math.round(ksiCosting.unitCost)} (${ksiCosting.basis})`,
    cmfCombination: describeCmfCombination(economics.cmfCombination ?? { rule: "multiplicative" }),
    serviceLives: describeServiceLives(economics.renewal ?? "none"),
    trafficGrowth: describeTrafficGrowth(economics.trafficGrowthRate ?? 0),
    calibration: describeCalibration(scenario),
    ksiDefinition: KSI_AVOIDED_DEFINITION,
    ...(localEvidence.length > 0 && { localEvidence }),
  };
}

/** Sites by the baseline method actually used. */
export function countBaselines(baselines: readonly SiteBaseline[]): BaselineCounts {
  const empiricalBayes = baselines.filter((baseline) => baseline.method === "empirical-bayes").length;
  return { empiricalBayes, observed: baselines.length - empiricalBayes };
}

function describeCalibration(scenario: Scenario): string {
  const calibrations = scenario.calibrations ?? [];
  if (calibrations.length === 0) return "none: SPF predictions are used as published (calibration factor 1)";
  return calibrations
    .map((c) =>
      c.method === "given"
        ? `${c.performanceFunction}: C = ${c.factor} (given)`
        : `${c.performanceFunction}: C = ${c.factor.toFixed(3)} estimated as Σ observed ÷ Σ predicted = ${c.observedCrashes} ÷ ${(c.predictedCrashes ?? 0).toFixed(1)} over ${c.sites} sites (Highway Safety Manual 2010, Part C, Appendix A)`,
    )
    .join("; ");
}
