import { existsSync, realpathSync } from "node:fs";
import { dirname, isAbsolute, join, relative, resolve, sep } from "node:path";
import { completeCrashMatrix } from "../model/crashMatrix.js";
import type {
  BaselineMethod,
  Catalogue,
  CrashType,
  Objective,
  PolicyRule,
  Scenario,
  Severity,
  Site,
  SiteKind,
  UncertaintySettings,
} from "../model/types.js";
import { checkScenarioReferences } from "./checkScenarioReferences.js";
import { InputError, type InputProblem } from "./InputError.js";
import { loadCatalogue, type LoadedCatalogue } from "./loadCatalogue.js";
import { parseAmount } from "./parseAmount.js";
import { readYamlFile, type YamlSource } from "./readYamlFile.js";
import { scenarioWarnings } from "./scenarioWarnings.js";
import { validateWithSchema } from "./validateWithSchema.js";

type Amount = number | string;
interface RawSite {
  id: string;
  name: string;
  kind: SiteKind;
  district: string;
  tags?: string[];
  location?: { lon: number; lat: number };
  lengthKm?: number;
  aadt?: number;
  performanceFunction?: string;
  crashes: Partial<Record<CrashType, Partial<Record<Severity, number>>>>;
  candidates: string[];
  costOverrides?: Record<string, Amount>;
}
interface Selector {
  district?: string;
  tag?: string;
}
/** The scenario file as written, after schema validation. */
export interface RawScenario {
  name: string;
  catalogues: string[];
  currency: string;
  budget: Amount;
  crashWindow: { firstYear: number; lastYear: number };
  economics: {
    discountRate: number;
    horizonYears: number;
    crashCosts: Record<Severity, Amount> & { source: string; priceYear?: number };
  };
  objective?: Objective;
  baseline?: BaselineMethod;
  maxTreatmentsPerSite?: number;
  uncertainty?: UncertaintySettings;
  rules?: {
    mustFund?: { site: string; treatments?: string[] }[];
    neverFund?: { site: string; treatments?: string[] }[];
    spendCaps?: (Selector & { amount?: Amount; share?: number })[];
    spendFloors?: (Selector & { amount?: Amount; share?: number })[];
    ksiShareFloors?: (Selector & { share: number })[];
    maxProjects?: (Selector & { count: number })[];
  };
  sites: RawSite[];
}

/** A scenario ready for the model, with the problems worth a warning and the files it read. */
export interface LoadedScenario {
  readonly scenario: Scenario;
  readonly warnings: readonly InputProblem[];
  readonly source: YamlSource;
  readonly catalogues: readonly LoadedCatalogue[];
}

export const DEFAULT_MAX_TREATMENTS_PER_SITE = 3;

/**
 * Reads a scenario and the catalogues it names, validates both against their schemas and
 * against each other, and converts them to the model's types. Throws InputError on bad input.
 */
export function loadScenario(file: string): LoadedScenario {
  const source = readYamlFile(file);
  const schemaProblems = validateWithSchema(source, "scenario");
  if (schemaProblems.length > 0) throw new InputError(schemaProblems);
  const raw = source.data as RawScenario;

  const seen = new Map<string, number>();
  const catalogues = raw.catalogues.map((path, index) => {
    const at = { file: source.file, ...source.positionOf(["catalogues", index]), path: `catalogues[${index}]` };
    const resolved = resolve(dirname(file), path);
    const outside = !isAbsolute(path) && !catalogueAllowed(file, resolved);
    if (outside) {
      throw new InputError([{ code: "catalogue-outside", ...at, message: `catalogue '${path}' lies outside the scenario's folder and every 'catalogs' folder above it (${resolved})`, hint: CATALOGUE_PLACES }]);
    }
    const earlier = seen.get(resolved);
    if (earlier !== undefined) {
      throw new InputError([{ code: "duplicate-id", ...at, message: `catalogue '${path}' is already listed at catalogues[${earlier}]`, hint: "list each catalogue once" }]);
    }
    seen.set(resolved, index);
    try {
      return loadCatalogue(resolved, relative(process.cwd(), resolved) || resolved);
    } catch (error) {
      // A catalogue that cannot be opened is a mistake in the scenario's list: point there.
      if (error instanceof InputError && (error.code === "missing-file" || error.code === "not-a-file")) {
        const missing = error.code === "missing-file";
        throw new InputError([
          {
            ...error.problems[0]!,
            ...at,
            message: missing ? `catalogue '${path}' was not found (looked in ${resolved})` : `catalogue '${path}' is a folder, not a file`,
            hint: missing ? "catalogue paths are relative to the scenario file" : "name the catalogue's .yaml file",
          },
        ]);
      }
      throw error;
    }
  });
  const catalogue: Catalogue = {
    treatments: catalogues.flatMap((loaded) => loaded.catalogue.treatments),
    performanceFunctions: catalogues.flatMap((loaded) => loaded.catalogue.performanceFunctions),
  };

  const problems = checkScenarioReferences(raw, source, catalogues);
  if (problems.length > 0) throw new InputError(problems);

  const scenario = toScenario(raw, catalogue);
  return { scenario, source, catalogues, warnings: scenarioWarnings(scenario, raw, source, catalogues) };
}

const CATALOGUE_PLACES =
  "a relative catalogue path must stay inside the scenario's folder or a 'catalogs' folder in it or above it (e.g. ../catalogs/x.yaml); give an absolute path to use a catalogue elsewhere";

/**
 * The catalogue path policy: a relative path may only reach the scenario's own folder tree or a
 * folder named `catalogs` directly inside the scenario's folder or one of its ancestors, judged
 * after symbolic links are followed. A scenario shared with others then cannot quietly read
 * files from elsewhere on their disk; an absolute path is an explicit choice and is accepted.
 */
function catalogueAllowed(scenarioFile: string, resolved: string): boolean {
  const real = (path: string) => (existsSync(path) ? realpathSync(path) : path);
  const inside = (path: string, folder: string) => path === folder || path.startsWith(folder.endsWith(sep) ? folder : folder + sep);
  const folder = real(dirname(resolve(scenarioFile)));
  const target = real(resolved);
  if (inside(target, folder)) return true;
  for (let ancestor = folder; ; ancestor = dirname(ancestor)) {
    if (inside(target, real(join(ancestor, "catalogs")))) return true;
    if (dirname(ancestor) === ancestor) return false;
  }
}

function amount(value: Amount): number {
  // The schema and reference checks have already rejected anything parseAmount refuses.
  return parseAmount(value)!;
}

function toScenario(raw: RawScenario, catalogue: Catalogue): Scenario {
  const costs = raw.economics.crashCosts;
  return {
    name: raw.name,
    currency: raw.currency,
    budget: amount(raw.budget),
    crashWindow: raw.crashWindow,
    economics: {
      discountRate: raw.economics.discountRate,
      horizonYears: raw.economics.horizonYears,
      crashCosts: {
        perCrash: { K: amount(costs.K), A: amount(costs.A), B: amount(costs.B), C: amount(costs.C), O: amount(costs.O) },
        source: costs.source,
        ...(costs.priceYear !== undefined && { priceYear: costs.priceYear }),
      },
    },
    objective: raw.objective ?? "ksi",
    baseline: raw.baseline ?? "observed",
    maxTreatmentsPerSite: raw.maxTreatmentsPerSite ?? DEFAULT_MAX_TREATMENTS_PER_SITE,
    catalogue,
    sites: raw.sites.map(toSite),
    rules: toRules(raw.rules ?? {}),
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
    ...(raw.location !== undefined && { location: raw.location }),
    ...(raw.lengthKm !== undefined && { lengthKm: raw.lengthKm }),
    ...(raw.aadt !== undefined && { aadt: raw.aadt }),
    ...(raw.performanceFunction !== undefined && { performanceFunction: raw.performanceFunction }),
    crashes: completeCrashMatrix(raw.crashes),
    candidates: raw.candidates,
    costOverrides: Object.fromEntries(Object.entries(raw.costOverrides ?? {}).map(([id, value]) => [id, amount(value)])),
  };
}

function selector(raw: Selector): Selector {
  return { ...(raw.district !== undefined && { district: raw.district }), ...(raw.tag !== undefined && { tag: raw.tag }) };
}

function toRules(raw: NonNullable<RawScenario["rules"]>): PolicyRule[] {
  const spend = (kind: "spend-cap" | "spend-floor") => (rule: Selector & { amount?: Amount; share?: number }): PolicyRule => ({
    kind,
    ...selector(rule),
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
