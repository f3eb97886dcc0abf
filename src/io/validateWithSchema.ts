import { readFileSync } from "node:fs";
import { join } from "node:path";
import { Ajv, type ErrorObject, type ValidateFunction } from "ajv";
import { closestName } from "./closestName.js";
import { formatFieldPath, parseJsonPointer } from "./fieldPath.js";
import type { InputProblem } from "./InputError.js";
import { packageRoot } from "./packageRoot.js";
import type { YamlSource } from "./readYamlFile.js";
import { quoteValue } from "./quoteValue.js";

export type SchemaName = "scenario" | "catalogue" | "sites" | "projects";
const SCHEMA_NAMES: readonly SchemaName[] = ["scenario", "catalogue", "sites", "projects"];

const compiled = new Map<SchemaName, ValidateFunction>();
let ajv: Ajv | undefined;

function validatorFor(name: SchemaName): ValidateFunction {
  let validate = compiled.get(name);
  if (!validate) {
    // One instance holds every schema, so the sites and projects schemas can refer to the scenario's definitions.
    if (!ajv) {
      ajv = new Ajv({ allErrors: true, strict: false, verbose: true });
      for (const each of SCHEMA_NAMES) ajv.addSchema(JSON.parse(readFileSync(join(packageRoot(), "schema", `${each}.schema.json`), "utf8")), each);
    }
    validate = ajv.getSchema(name)!;
    compiled.set(name, validate);
  }
  return validate;
}

/** Validates parsed YAML against one of averta's JSON Schemas; returns located problems (empty if valid). */
export function validateWithSchema(source: YamlSource, name: SchemaName): InputProblem[] {
  const validate = validatorFor(name);
  if (validate(source.data)) return [];
  const seen = new Set<string>();
  const problems: InputProblem[] = [];
  for (const error of validate.errors ?? []) {
    const problem = describe(error, source);
    const key = `${problem.path}|${problem.line}|${problem.message}`;
    if (seen.has(key)) continue;
    seen.add(key);
    problems.push(problem);
  }
  return problems;
}

// `verbose` gives each error its parentSchema, whose description becomes the hint.
function describe(error: ErrorObject, source: YamlSource): InputProblem {
  const path = parseJsonPointer(error.instancePath);
  const params = error.params as Record<string, unknown>;
  const description = (error.parentSchema as { description?: string } | undefined)?.description;
  const base = { code: "schema", file: source.file };
  const at = (segments: typeof path, key = false) => ({ ...source.positionOf(segments, key), path: formatFieldPath(segments) || "(top level)" });

  const value = valueAt(source.data, path);
  if (typeof value === "number" && !Number.isFinite(value)) {
    // YAML's .inf and .nan are numbers to the schema; say so plainly whatever bound tripped (duplicates merge by path).
    return { ...base, ...at(path), message: `must be a finite number, found ${Number.isNaN(value) ? ".nan" : value > 0 ? ".inf" : "-.inf"}`, hint: description ?? "write an ordinary number" };
  }
  switch (error.keyword) {
    case "required": {
      const missing = String(params.missingProperty);
      return { ...base, ...at(path), message: `missing required field '${missing}'`, hint: `add '${missing}:' here` };
    }
    case "additionalProperties": {
      const field = String(params.additionalProperty);
      const allowed = Object.keys((error.parentSchema as { properties?: object }).properties ?? {});
      const guess = closestName(field, allowed);
      return {
        ...base,
        ...at([...path, field], true),
        message: `unknown field ${quoteValue(field)}`,
        hint: guess ? `did you mean '${guess}'?` : `allowed fields: ${allowed.join(", ")}`,
      };
    }
    case "enum": {
      const allowed = (params.allowedValues as unknown[]).map(String);
      const value = String(valueAt(source.data, path));
      const guess = closestName(value, allowed);
      return {
        ...base,
        ...at(path),
        message: `${quoteValue(value)} is not allowed`,
        hint: guess ? `did you mean '${guess}'? (one of: ${allowed.join(", ")})` : `use one of: ${allowed.join(", ")}`,
      };
    }
    case "type":
      return {
        ...base,
        ...at(path),
        message: `must be ${article(String(params.type))}, found ${describeValue(valueAt(source.data, path))}`,
        hint: description ?? `write ${article(String(params.type))} here`,
      };
    case "pattern":
      return { ...base, ...at(path), message: `${quoteValue(String(valueAt(source.data, path)))} has the wrong form`, hint: description ?? `it must match ${String(params.pattern)}` };
    case "minimum":
    case "maximum":
    case "exclusiveMinimum":
    case "exclusiveMaximum":
      return {
        ...base,
        ...at(path),
        message: `must be ${String(params.comparison)} ${String(params.limit)}, found ${String(valueAt(source.data, path))}`,
        hint: description ?? `use a value ${String(params.comparison)} ${String(params.limit)}`,
      };
    case "minItems":
      return { ...base, ...at(path), message: `must list at least ${String(params.limit)} item(s)`, hint: description ?? "add at least one entry" };
    case "uniqueItems":
      return {
        ...base,
        ...at([...path, Number(params.j)]),
        message: `repeats an item (positions ${String(params.j)} and ${String(params.i)})`,
        hint: "list each item once",
      };
    case "not": {
      // A "not" rule carries its own words: what is wrong as its description, how to fix it as its hint.
      const rule = error.schema as { description?: string; hint?: string } | undefined;
      return { ...base, ...at(path), message: rule?.description ?? "is not allowed here", hint: rule?.hint ?? description ?? "see the schema in averta's schema folder" };
    }
    case "minProperties":
    case "maxProperties":
      return { ...base, ...at(path), message: `has the wrong number of fields`, hint: description ?? "check which fields this entry needs" };
    default:
      return { ...base, ...at(path), message: error.message ?? "is not valid", hint: description ?? "see the schema in averta's schema folder" };
  }
}

function valueAt(data: unknown, path: readonly (string | number)[]): unknown {
  let value = data;
  for (const segment of path) value = (value as Record<string | number, unknown> | undefined)?.[segment];
  return value;
}

function describeValue(value: unknown): string {
  if (value === null || value === undefined) return "nothing";
  if (Array.isArray(value)) return "a list";
  if (typeof value === "object") return "a mapping";
  if (typeof value === "string") return `text '${value.length > 40 ? value.slice(0, 40) + "…" : value}'`;
  return `${typeof value} ${String(value)}`;
}

function article(type: string): string {
  const names: Record<string, string> = {
    number: "a number",
    integer: "a whole number",
    string: "text",
    object: "a mapping (key: value lines)",
    array: "a list",
    boolean: "true or false",
    "number,string": "a number or an amount like 4.5M",
    "array,string": "a list of sites, or the name of a sites file",
  };
  return names[type] ?? type;
}
