import { completeCrashMatrix, sumCrashMatrix } from "../model/crashMatrix.js";
import type { CapitalPhase } from "../model/programmeTypes.js";
import {
  CRASH_TYPES,
  SEVERITIES,
  type Catalogue,
  type CrashType,
  type Effect,
  type SafetyPerformanceFunction,
  type AreaType,
  type Severity,
  type SiteKind,
  type Treatment,
} from "../model/types.js";
import { InputError, type InputProblem } from "./InputError.js";
import { readYamlFile, type YamlSource } from "./readYamlFile.js";
import { toLocalEvidence, type CatalogueLocalEvidence, type RawLocalEvidence } from "./toLocalEvidence.js";
import { validateWithSchema } from "./validateWithSchema.js";

interface RawEffect {
  crashTypes: (CrashType | "all")[];
  severities?: Severity[];
  cmf: number;
  standardError?: number;
  source: string;
}
interface RawTreatment {
  id: string;
  name: string;
  appliesTo: SiteKind[];
  areas?: AreaType[];
  cost: { perSite?: number; perKm?: number };
  costSource?: string;
  upkeepPerYear?: number;
  serviceLifeYears: number;
  exclusiveGroup?: string;
  phasing?: CapitalPhase[];
  effects: RawEffect[];
}
interface RawPerformanceFunction {
  id: string;
  appliesTo: SiteKind[];
  intercept: number;
  aadtExponent: number;
  lengthExponent?: number;
  overdispersion: number;
  overdispersionPerKm?: boolean;
  shares: Partial<Record<CrashType, Partial<Record<Severity, number>>>>;
  source: string;
}
/** The schema asks for treatments, localEvidence or both. */
interface RawCatalogue {
  treatments?: RawTreatment[];
  performanceFunctions?: RawPerformanceFunction[];
  localEvidence?: RawLocalEvidence[];
}

/** A catalogue with the file it came from, so later checks can point into it. */
export interface LoadedCatalogue {
  readonly catalogue: Catalogue;
  readonly source: YamlSource;
  /** Its local CMF evidence, applied once every catalogue of a scenario is loaded (applyLocalEvidence). */
  readonly localEvidence: readonly CatalogueLocalEvidence[];
}

/** Reads, validates and converts one catalogue file (treatments, SPFs, local CMF evidence). Throws InputError on bad input. */
export function loadCatalogue(file: string, label: string = file): LoadedCatalogue {
  const source = readYamlFile(file, label);
  const schemaProblems = validateWithSchema(source, "catalogue");
  if (schemaProblems.length > 0) throw new InputError(schemaProblems);
  const raw = source.data as RawCatalogue;
  const problems = [...checkTreatments(raw, source), ...checkPerformanceFunctions(raw, source)];
  if (problems.length > 0) throw new InputError(problems);
  return {
    source,
    catalogue: {
      treatments: (raw.treatments ?? []).map(toTreatment),
      performanceFunctions: (raw.performanceFunctions ?? []).map(toPerformanceFunction),
    },
    localEvidence: toLocalEvidence(raw.localEvidence),
  };
}

function toTreatment(raw: RawTreatment): Treatment {
  return {
    id: raw.id,
    name: raw.name,
    appliesTo: raw.appliesTo,
    ...(raw.areas !== undefined && { appliesToAreas: raw.areas }),
    cost: raw.cost.perKm !== undefined ? { basis: "per-km", amount: raw.cost.perKm } : { basis: "per-site", amount: raw.cost.perSite ?? 0 },
    upkeepPerYear: raw.upkeepPerYear ?? 0,
    serviceLifeYears: raw.serviceLifeYears,
    ...(raw.exclusiveGroup !== undefined && { exclusiveGroup: raw.exclusiveGroup }),
    ...(raw.costSource !== undefined && { costSource: raw.costSource }),
    ...(raw.phasing !== undefined && { phasing: raw.phasing }),
    // Specific effects first, so a catch-all ('all') effect only fills the cells they leave.
    effects: [...raw.effects].sort((a, b) => Number(a.crashTypes.includes("all")) - Number(b.crashTypes.includes("all"))).map(toEffect),
  };
}

function toEffect(raw: RawEffect): Effect {
  return {
    crashTypes: raw.crashTypes.includes("all") ? CRASH_TYPES : (raw.crashTypes as CrashType[]),
    severities: raw.severities ?? SEVERITIES,
    cmf: raw.cmf,
    ...(raw.standardError !== undefined && { standardError: raw.standardError }),
    source: raw.source,
  };
}

function toPerformanceFunction(raw: RawPerformanceFunction): SafetyPerformanceFunction {
  return {
    id: raw.id,
    appliesTo: raw.appliesTo,
    intercept: raw.intercept,
    aadtExponent: raw.aadtExponent,
    lengthExponent: raw.lengthExponent ?? 0,
    overdispersion: raw.overdispersion,
    overdispersionPerKm: raw.overdispersionPerKm ?? false,
    calibrationFactor: 1,
    shares: completeCrashMatrix(raw.shares),
    source: raw.source,
  };
}

/** Duplicate ids, and two effects of one treatment that name the same crash cell (which CMF applies?). */
function checkTreatments(raw: RawCatalogue, source: YamlSource): InputProblem[] {
  const problems: InputProblem[] = [];
  const firstIndex = new Map<string, number>();
  (raw.treatments ?? []).forEach((treatment, index) => {
    const earlier = firstIndex.get(treatment.id);
    if (earlier !== undefined) {
      problems.push({
        code: "duplicate-id",
        file: source.file,
        ...source.positionOf(["treatments", index, "id"]),
        path: `treatments[${index}].id`,
        message: `treatment id '${treatment.id}' is used twice (first at treatments[${earlier}])`,
        hint: "give each treatment its own id",
      });
    } else firstIndex.set(treatment.id, index);

    const claimed = new Map<string, number>();
    treatment.effects.forEach((effect, effectIndex) => {
      if (effect.crashTypes.includes("all")) return; // a catch-all effect yields to the specific ones
      for (const type of effect.crashTypes)
        for (const severity of effect.severities ?? SEVERITIES) {
          const cell = `${type}/${severity}`;
          const other = claimed.get(cell);
          if (other !== undefined && other !== effectIndex) {
            problems.push({
              code: "overlapping-effects",
              file: source.file,
              ...source.positionOf(["treatments", index, "effects", effectIndex]),
              path: `treatments[${index}].effects[${effectIndex}]`,
              message: `effects ${other} and ${effectIndex} of '${treatment.id}' both cover ${type} crashes of severity ${severity}`,
              hint: "each crash type and severity may have one CMF per treatment; split the severities between the effects",
            });
            return;
          }
          claimed.set(cell, effectIndex);
        }
    });
    problems.push(...checkPhasing(treatment, index, source));
    if (treatment.cost.perKm !== undefined && !treatment.appliesTo.every((kind) => kind !== "intersection")) {
      problems.push({
        code: "cost-basis",
        file: source.file,
        ...source.positionOf(["treatments", index, "cost"]),
        path: `treatments[${index}].cost`,
        message: `'${treatment.id}' is costed per km but applies to intersections, which have no length`,
        hint: "cost it perSite, or apply it to segments and corridors only",
      });
    }
  });
  return problems;
}

function checkPerformanceFunctions(raw: RawCatalogue, source: YamlSource): InputProblem[] {
  const problems: InputProblem[] = [];
  const seen = new Set<string>();
  (raw.performanceFunctions ?? []).forEach((spf, index) => {
    const at = (field: string) => ({ file: source.file, ...source.positionOf(["performanceFunctions", index, field]), path: `performanceFunctions[${index}].${field}` });
    if (seen.has(spf.id)) {
      problems.push({ code: "duplicate-id", ...at("id"), message: `performance function id '${spf.id}' is used twice`, hint: "give each its own id" });
    }
    seen.add(spf.id);
    const total = sumCrashMatrix(completeCrashMatrix(spf.shares));
    if (Math.abs(total - 1) > 1e-3) {
      problems.push({
        code: "shares-sum",
        ...at("shares"),
        message: `crash shares sum to ${total.toFixed(4)}, not 1`,
        hint: "the shares split predicted crashes across types and severities, so they must add up to 1",
      });
    }
  });
  return problems;
}

/** A phasing spends all of the capital, once per year. */
function checkPhasing(treatment: RawTreatment, index: number, source: YamlSource): InputProblem[] {
  if (treatment.phasing === undefined) return [];
  const at = { file: source.file, ...source.positionOf(["treatments", index, "phasing"]), path: `treatments[${index}].phasing` };
  const years = treatment.phasing.map((phase) => phase.yearsBeforeBuild);
  if (new Set(years).size !== years.length) {
    return [{ code: "phasing", ...at, message: `the phasing of '${treatment.id}' names one year twice`, hint: "give each yearsBeforeBuild once, with the share of capital spent that year" }];
  }
  const total = treatment.phasing.reduce((sum, phase) => sum + phase.share, 0);
  // Rounded in the message, so 0.2 + 0.7 reads 0.9, not 0.8999999999999999.
  if (Math.abs(total - 1) > 1e-9) {
    return [{ code: "phasing", ...at, message: `the phasing shares of '${treatment.id}' add up to ${Number(total.toPrecision(12))}, not 1`, hint: "make the shares add up to 1 (e.g. 0.2 the year before and 0.8 in the build year)" }];
  }
  return [];
}
