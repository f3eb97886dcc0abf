import { completeCrashMatrix } from "../model/crashMatrix.js";
import { resolveCrashCosts, type StatedCrashCosts } from "../model/resolveCrashCosts.js";
import type { AreaType, BaselineMethod, Catalogue, CmfCombinationRule, CrashType, Objective, RenewalRule, Scenario, Severity, Site, SiteKind, UncertaintySettings } from "../model/types.js";
import type { PolicyRule } from "../model/policyRule.js";
import type { CarryOverRule, ProgrammeYears } from "../model/programmeTypes.js";
import { applyLocalEvidence } from "./applyLocalEvidence.js";
import { calibrateCatalogue } from "./calibrateCatalogue.js";
import { checkAlternativeCounts } from "./checkAlternativeCounts.js";
import { checkScenarioReferences } from "./checkScenarioReferences.js";
import { InputError, type InputProblem } from "./InputError.js";
import type { LoadedCatalogue } from "./loadCatalogue.js";
import { loadListedCatalogues } from "./loadListedCatalogues.js";
import { loadScenarioSites } from "./loadScenarioSites.js";
import { parseAmount } from "./parseAmount.js";
import { readYamlFile, type YamlSource } from "./readYamlFile.js";
import { scenarioNotes } from "./scenarioNotes.js";
import { scenarioWarnings } from "./scenarioWarnings.js";
import { validateWithSchema } from "./validateWithSchema.js";

type Amount = number | string;
interface RawSite {
  id: string;
  name: string;
  kind: SiteKind;
  district: string;
  tags?: string[];
  area?: AreaType;
  location?: { lon: number; lat: number };
  lengthKm?: number;
  aadt?: number;
  performanceFunction?: string;
  crashes: Partial<Record<CrashType, Partial<Record<Severity, number>>>>;
  /** Treatment ids to consider; empty when the site has none (it is screened, never funded). */
  candidates: string[];
  costOverrides?: Record<string, Amount>;
  earliestYear?: number;
  latestYear?: number;
}
interface Selector {
  district?: string;
  tag?: string;
}
/** The scenario after schema validation, with its sites read in (from a sites file, if it names one) and siteCandidates applied. */
export interface RawScenario {
  name: string;
  catalogues: string[];
  currency: string;
  /** Absent in a programme, which gives its budgets by year. */
  budget?: Amount;
  programme?: {
    firstYear: number;
    years: number;
    budgets: Amount | Amount[];
    carryOver?: CarryOverRule;
    costEscalationRate?: number;
    committed?: { site: string; treatments: string[]; year: number }[];
  };
  crashWindow: { firstYear: number; lastYear: number };
  economics: {
    discountRate: number;
    horizonYears: number;
    priceYear?: number;
    crashCosts: Record<Severity, Amount> & { source: string; priceYear?: number; escalation?: StatedCrashCosts["escalation"] };
    ksiCosting?: { method: "combined" | "by-severity"; unitCost?: Amount; fatalShare?: number };
    trafficGrowthRate?: number;
    renewal?: RenewalRule;
  };
  objective?: Objective;
  baseline?: BaselineMethod;
  calibration?: Record<string, number | "estimate">;
  cmfCombination?: { rule: CmfCombinationRule; floor?: number };
  maxTreatmentsPerSite?: number;
  uncertainty?: UncertaintySettings;
  rules?: {
    mustFund?: { site: string; treatments?: string[] }[];
    neverFund?: { site: string; treatments?: string[] }[];
    spendCaps?: (Selector & { amount?: Amount; share?: number; year?: number })[];
    spendFloors?: (Selector & { amount?: Amount; share?: number; year?: number })[];
    ksiShareFloors?: (Selector & { share: number })[];
    maxProjects?: (Selector & { count: number })[];
  };
  sites: RawSite[];
  /** Candidate lists by site id that replace the sites' own (see loadScenarioSites). */
  siteCandidates?: Record<string, string[]>;
}

/** A scenario ready for the model, with the problems worth a warning and the files it read. */
export interface LoadedScenario {
  readonly scenario: Scenario;
  readonly warnings: readonly InputProblem[];
  readonly source: YamlSource;
  /** Where the sites are written: `source`, or the sites file the scenario names. */
  readonly sitesSource: YamlSource;
  readonly catalogues: readonly LoadedCatalogue[];
  /** Facts worth telling that need no fixing, e.g. sites without candidates. */
  readonly notes: readonly InputProblem[];
}

export const DEFAULT_MAX_TREATMENTS_PER_SITE = 3;

/**
 * Reads a scenario, the catalogues it names and the sites file it names (if its `sites:` is a
 * path), validates them against their schemas and against each other, and converts them to the
 * model's types. Throws InputError on bad input.
 */
export function loadScenario(file: string): LoadedScenario {
  return loadScenarioSource(readYamlFile(file), file);
}

/** loadScenario for a scenario already parsed; `file` is where it is (or will be) written, for its relative paths. */
export function loadScenarioSource(source: YamlSource, file: string): LoadedScenario {
  const schemaProblems = validateWithSchema(source, "scenario");
  if (schemaProblems.length > 0) throw new InputError(schemaProblems);
  const located = loadScenarioSites(file, source);
  const raw: RawScenario = { ...(source.data as RawScenario), crashWindow: located.crashWindow, sites: located.sites };

  const catalogues = loadListedCatalogues(raw.catalogues, source, file);
  // Local evidence pools with the published CMFs once every catalogue is in.
  const evidence = applyLocalEvidence(catalogues);

  const sitesSource = located.source;
  const problems = [...checkScenarioReferences(raw, source, catalogues, sitesSource), ...evidence.problems];
  if (problems.length > 0) throw new InputError(problems);

  const scenario = toScenario(raw, evidence.catalogue);
  const tooMany = checkAlternativeCounts(scenario, raw, source, sitesSource);
  if (tooMany.length > 0) throw new InputError(tooMany);
  return { scenario, source, sitesSource, catalogues, warnings: [...scenarioWarnings(scenario, raw, source, catalogues, sitesSource), ...evidence.warnings], notes: scenarioNotes(raw, source, sitesSource) };
}

function amount(value: Amount): number {
  // The schema and reference checks have already rejected anything parseAmount refuses.
  return parseAmount(value)!;
}

function toScenario(raw: RawScenario, uncalibrated: Catalogue): Scenario {
  const costs = raw.economics.crashCosts;
  const ksiCosting = raw.economics.ksiCosting;
  const sites = raw.sites.map(toSite);
  const windowYears = raw.crashWindow.lastYear - raw.crashWindow.firstYear + 1;
  const { catalogue, calibrations } = calibrateCatalogue(uncalibrated, raw.calibration ?? {}, sites, windowYears);
  const stated: StatedCrashCosts = {
    perCrash: { K: amount(costs.K), A: amount(costs.A), B: amount(costs.B), C: amount(costs.C), O: amount(costs.O) },
    source: costs.source,
    ...(costs.priceYear !== undefined && { priceYear: costs.priceYear }),
    ...(costs.escalation !== undefined && { escalation: costs.escalation }),
    ...(ksiCosting !== undefined && {
      ksiCosting: {
        method: ksiCosting.method,
        ...(ksiCosting.unitCost !== undefined && { unitCost: amount(ksiCosting.unitCost) }),
        ...(ksiCosting.fatalShare !== undefined && { fatalShare: ksiCosting.fatalShare }),
      },
    }),
  };
  const programme = raw.programme === undefined ? undefined : toProgramme(raw.programme);
  return {
    name: raw.name,
    currency: raw.currency,
    // A programme's budget is the sum of its years' (each year's row keeps its own share of it).
    budget: programme === undefined ? amount(raw.budget!) : programme.budgets.reduce((total, value) => total + value, 0),
    ...(programme !== undefined && { programme }),
    crashWindow: raw.crashWindow,
    economics: {
      discountRate: raw.economics.discountRate,
      horizonYears: raw.economics.horizonYears,
      crashCosts: resolveCrashCosts(stated, raw.economics.priceYear, sites),
      ...(raw.economics.priceYear !== undefined && { priceYear: raw.economics.priceYear }),
      trafficGrowthRate: raw.economics.trafficGrowthRate ?? 0,
      renewal: raw.economics.renewal ?? "none",
      cmfCombination: raw.cmfCombination ?? { rule: "multiplicative" },
    },
    objective: raw.objective ?? "ksi",
    baseline: raw.baseline ?? "auto",
    maxTreatmentsPerSite: raw.maxTreatmentsPerSite ?? DEFAULT_MAX_TREATMENTS_PER_SITE,
    catalogue,
    sites,
    rules: toRules(raw.rules ?? {}),
    calibrations,
    ...(raw.uncertainty !== undefined && { uncertainty: raw.uncertainty }),
  };
}

function toSite(raw: RawSite): Site {
  return {
    id: raw.id,
    name: raw.name,
    kind: raw.kind,
    district: raw.district,
    tags: raw.tags ?? [],
    ...(raw.area !== undefined && { area: raw.area }),
    ...(raw.location !== undefined && { location: raw.location }),
    ...(raw.lengthKm !== undefined && { lengthKm: raw.lengthKm }),
    ...(raw.aadt !== undefined && { aadt: raw.aadt }),
    ...(raw.performanceFunction !== undefined && { performanceFunction: raw.performanceFunction }),
    crashes: completeCrashMatrix(raw.crashes),
    candidates: raw.candidates,
    costOverrides: Object.fromEntries(Object.entries(raw.costOverrides ?? {}).map(([id, value]) => [id, amount(value)])),
    ...(raw.earliestYear !== undefined && { earliestYear: raw.earliestYear }),
    ...(raw.latestYear !== undefined && { latestYear: raw.latestYear }),
  };
}

function toProgramme(raw: NonNullable<RawScenario["programme"]>): ProgrammeYears {
  const budgets = Array.isArray(raw.budgets) ? raw.budgets.map(amount) : new Array<number>(raw.years).fill(amount(raw.budgets));
  return {
    firstYear: raw.firstYear,
    years: raw.years,
    budgets,
    carryOver: raw.carryOver ?? "none",
    costEscalationRate: raw.costEscalationRate ?? 0,
    committed: raw.committed ?? [],
  };
}

function selector(raw: Selector): Selector {
  return { ...(raw.district !== undefined && { district: raw.district }), ...(raw.tag !== undefined && { tag: raw.tag }) };
}

function toRules(raw: NonNullable<RawScenario["rules"]>): PolicyRule[] {
  const spend = (kind: "spend-cap" | "spend-floor") => (rule: Selector & { amount?: Amount; share?: number; year?: number }): PolicyRule => ({
    kind,
    ...selector(rule),
    ...(rule.year !== undefined && { year: rule.year }),
    ...(rule.amount !== undefined && { amount: amount(rule.amount) }),
    ...(rule.share !== undefined && { share: rule.share }),
  });
  return [
    ...(raw.mustFund ?? []).map((rule): PolicyRule => ({ kind: "must-fund", site: rule.site, treatments: rule.treatments ?? [] })),
    ...(raw.neverFund ?? []).map((rule): PolicyRule => ({ kind: "never-fund", site: rule.site, treatments: rule.treatments ?? [] })),
    ...(raw.spendCaps ?? []).map(spend("spend-cap")),
    ...(raw.spendFloors ?? []).map(spend("spend-floor")),
    ...(raw.ksiShareFloors ?? []).map((rule): PolicyRule => ({ kind: "ksi-share-floor", ...selector(rule), share: rule.share })),
    ...(raw.maxProjects ?? []).map((rule): PolicyRule => ({ kind: "max-projects", ...selector(rule), count: rule.count })),
  ];
}
