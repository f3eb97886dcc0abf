/**
 * The core vocabulary of averta: plain, read-only data shared by every stage.
 * Money is in the scenario's currency units; years are whole years; rates are fractions.
 */
import type { PolicyRule } from "./policyRule.js";
import type { EffectEvidence } from "./effectEvidenceTypes.js";
import type { CapitalPhase, ProgrammeYears } from "./programmeTypes.js";
import type { SpfCalibration } from "./spfCalibration.js";

/** KABCO injury severity of a crash (its most severe injury). K+A are the KSI crashes. */
export type Severity = "K" | "A" | "B" | "C" | "O";
export const SEVERITIES: readonly Severity[] = ["K", "A", "B", "C", "O"];
export const KSI_SEVERITIES: readonly Severity[] = ["K", "A"];

/** Crash types by manner of collision or road user involved. */
export type CrashType =
  | "pedestrian"
  | "bicycle"
  | "motorcycle"
  | "angle"
  | "rear-end"
  | "head-on"
  | "run-off-road"
  | "other";
export const CRASH_TYPES: readonly CrashType[] = [
  "pedestrian",
  "bicycle",
  "motorcycle",
  "angle",
  "rear-end",
  "head-on",
  "run-off-road",
  "other",
];

/** Crashes (or crashes per year) for every crash type × severity cell; absent cells are zero. */
export type CrashMatrix = Readonly<Record<CrashType, Readonly<Record<Severity, number>>>>;

export type SiteKind = "intersection" | "segment" | "corridor";
export const SITE_KINDS: readonly SiteKind[] = ["intersection", "segment", "corridor"];

/** Urban or rural setting of a site; some treatments suit only one. */
export type AreaType = "urban" | "rural";
export const AREA_TYPES: readonly AreaType[] = ["urban", "rural"];

/** One crash-modification effect of a treatment on a set of crash cells. */
export interface Effect {
  readonly crashTypes: readonly CrashType[];
  readonly severities: readonly Severity[];
  /** Crash modification factor: expected crashes with / without the treatment. */
  readonly cmf: number;
  /** Standard error of the CMF, when the source publishes one. */
  readonly standardError?: number;
  /** Where the value comes from (study, handbook table). */
  readonly source: string;
  /** The published and local estimates behind the CMF, when a catalogue adds local evidence (absent: the published value as is). */
  readonly evidence?: EffectEvidence;
}

/** How a treatment's capital cost is computed. */
export type CostModel =
  | { readonly basis: "per-site"; readonly amount: number }
  | { readonly basis: "per-km"; readonly amount: number };

/** A countermeasure from a catalogue. */
export interface Treatment {
  readonly id: string;
  readonly name: string;
  readonly appliesTo: readonly SiteKind[];
  /** Settings the treatment suits (absent: any); a site with a different `area` may not list it. */
  readonly appliesToAreas?: readonly AreaType[];
  readonly cost: CostModel;
  readonly upkeepPerYear: number;
  readonly serviceLifeYears: number;
  /** Treatments that share an exclusivity group never share a site. */
  readonly exclusiveGroup?: string;
  readonly effects: readonly Effect[];
  readonly costSource?: string;
  /** In a programme: how the capital is spread over the build year and the years before it (absent: all in the build year). */
  readonly phasing?: readonly CapitalPhase[];
}

/** A safety performance function: predicted crashes per year = exp(a) × AADT^b × lengthKm^c (segments). */
export interface SafetyPerformanceFunction {
  readonly id: string;
  readonly appliesTo: readonly SiteKind[];
  /** Intercept a of ln(N) = a + b ln(AADT) + c ln(L). */
  readonly intercept: number;
  readonly aadtExponent: number;
  /** Exponent on length in km; 1 (proportional to length) for most segment SPFs. */
  readonly lengthExponent: number;
  /** Negative binomial overdispersion k; per km of length when `overdispersionPerKm` is set. */
  readonly overdispersion: number;
  readonly overdispersionPerKm: boolean;
  /** Local calibration factor C (HSM Part C): predictions are multiplied by it; 1 when uncalibrated. */
  readonly calibrationFactor?: number;
  /** Share of predicted crashes in each crash type × severity cell (sums to 1). */
  readonly shares: CrashMatrix;
  readonly source: string;
}

export interface Catalogue {
  readonly treatments: readonly Treatment[];
  readonly performanceFunctions: readonly SafetyPerformanceFunction[];
}

export interface GeoPoint {
  readonly lon: number;
  readonly lat: number;
}

/** A candidate site with its crash history and candidate treatments. */
export interface Site {
  readonly id: string;
  readonly name: string;
  readonly kind: SiteKind;
  readonly district: string;
  readonly tags: readonly string[];
  readonly area?: AreaType;
  readonly location?: GeoPoint;
  readonly lengthKm?: number;
  /** Annual average daily traffic, used by Empirical Bayes. */
  readonly aadt?: number;
  /** Which SPF predicts this site's crashes (Empirical Bayes baseline). */
  readonly performanceFunction?: string;
  /** Observed crashes over the scenario's crash window. */
  readonly crashes: CrashMatrix;
  readonly candidates: readonly string[];
  /** Capital cost overrides by treatment id. */
  readonly costOverrides: Readonly<Record<string, number>>;
  /** In a programme: the first and last years the site may be built in. */
  readonly earliestYear?: number;
  readonly latestYear?: number;
}

/**
 * How fatal (K) and serious-injury (A) crashes are valued: each at its own unit cost, or both at
 * one combined K+A unit cost (so a chance fatal crash does not outweigh many serious ones).
 */
export type KsiCosting =
  | { readonly method: "by-severity" }
  | {
      readonly method: "combined";
      /** The combined K+A unit cost, in the programme's price year. */
      readonly unitCost: number;
      /** How the unit cost was found, in words (given, or weighted by which fatal share). */
      readonly basis: string;
      /** K ÷ (K + A) used for the weighting; absent when the user gave the unit cost. */
      readonly fatalShare?: number;
    };

/** Unit cost of one crash by severity, for monetising benefits. */
export interface CrashCosts {
  /** Unit costs used for benefits: escalated to the programme's price year, K and A combined when asked. */
  readonly perCrash: Readonly<Record<Severity, number>>;
  /** Unit costs as the scenario states them, in their own price year. */
  readonly statedPerCrash?: Readonly<Record<Severity, number>>;
  readonly source: string;
  readonly priceYear?: number;
  /** Factor applied to the stated costs to bring them to the programme's price year (absent: 1, none). */
  readonly escalationFactor?: number;
  /** How the escalation factor was found, when there is one. */
  readonly escalation?: string;
  readonly ksiCosting?: KsiCosting;
}

/** What happens when a treatment's service life ends inside the analysis horizon. */
export type RenewalRule = "none" | "renew" | "residual-value";
export const RENEWAL_RULES: readonly RenewalRule[] = ["none", "renew", "residual-value"];

/** How the CMFs of treatments that act on the same crash cell are combined. */
export type CmfCombinationRule = "multiplicative" | "dominant-effect" | "dominant-common-residuals";
export const CMF_COMBINATION_RULES: readonly CmfCombinationRule[] = ["multiplicative", "dominant-effect", "dominant-common-residuals"];

export interface CmfCombination {
  readonly rule: CmfCombinationRule;
  /** Lowest combined CMF allowed in any one cell (absent: no floor). */
  readonly floor?: number;
}

export interface Economics {
  readonly discountRate: number;
  readonly horizonYears: number;
  readonly crashCosts: CrashCosts;
  /** Price year of capital costs and the budget (the programme's money), when stated. */
  readonly priceYear?: number;
  /** Annual AADT growth, a fraction; expected crashes grow with it (see siteBaselines). Absent: 0. */
  readonly trafficGrowthRate?: number;
  /** Absent: none. */
  readonly renewal?: RenewalRule;
  /** Absent: multiplicative, no floor. */
  readonly cmfCombination?: CmfCombination;
}

export type Objective = "ksi" | "benefit";
/** How the uncertainty draws treat CMFs; every field optional, its default stated where it is read. */
export interface UncertaintySettings {
  /** Coefficient of variation given to a CMF that publishes no standard error (SE = cv × CMF), or "off" to hold such CMFs exact. */
  readonly assumedCmfCv?: number | "off";
}
/** How a site's expected crashes are estimated; `auto` is Empirical Bayes where the site allows it, observed otherwise. */
export type BaselineMethod = "auto" | "observed" | "empirical-bayes";
/** The method actually used at one site. */
export type SiteBaselineMethod = "observed" | "empirical-bayes";

export interface Scenario {
  readonly name: string;
  readonly currency: string;
  readonly budget: number;
  readonly crashWindow: { readonly firstYear: number; readonly lastYear: number };
  readonly economics: Economics;
  readonly objective: Objective;
  readonly baseline: BaselineMethod;
  readonly maxTreatmentsPerSite: number;
  readonly catalogue: Catalogue;
  readonly sites: readonly Site[];
  readonly rules: readonly PolicyRule[];
  /** Local calibration of SPFs the scenario asked for (the catalogue's SPFs carry the factors). */
  readonly calibrations?: readonly SpfCalibration[];
  readonly uncertainty?: UncertaintySettings;
  /** A multi-year programme; absent: a one-year list under `budget`. */
  readonly programme?: ProgrammeYears;
}

/** One allowed combination of treatments at one site, with its effects and economics. */
export interface Alternative {
  readonly site: string;
  readonly treatments: readonly string[];
  /** Capital cost, charged to the budget. */
  readonly cost: number;
  /** Capital plus present worth of upkeep over each treatment's life within the horizon. */
  readonly lifecycleCostPV: number;
  /** Crashes avoided per year in the first year, by severity. */
  readonly crashesAvoidedPerYear: Readonly<Record<Severity, number>>;
  /** KSI crashes (K + A) avoided over the service life within the horizon. */
  readonly ksiAvoided: number;
  /** Present value of crash costs avoided over the service life within the horizon. */
  readonly benefitPV: number;
  readonly bcRatio: number;
  readonly npv: number;
  /** Lifecycle cost per KSI crash avoided (Infinity when none is avoided). */
  readonly costPerKsi: number;
  /** Years the alternative acts, within the horizon (the longest treatment life, capped; the horizon when renewed). */
  readonly effectiveYears: number;
  /** Crash cells with expected crashes on which two or more of its treatments act (their combined CMF is a modelling assumption). */
  readonly sharedCells: number;
  /** In a programme: the build year, and the capital spent in each programme year (first year first). */
  readonly buildYear?: number;
  readonly spendByYear?: readonly number[];
}
