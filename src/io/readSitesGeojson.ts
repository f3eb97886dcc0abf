import { readFileSync } from "node:fs";
import type { NetworkSite } from "../geo/NetworkSite.js";
import { AREA_TYPES, SITE_KINDS, type AreaType, type GeoPoint, type SiteKind } from "../model/types.js";
import { formatFieldPath } from "./fieldPath.js";
import { findNonJsonToken } from "./findNonJsonToken.js";
import { quoteValue } from "./quoteValue.js";
import { InputError, type InputProblem } from "./InputError.js";
import { readYamlFile, type PathSegment } from "./readYamlFile.js";

const ID_PATTERN = /^[A-Za-z0-9][A-Za-z0-9._-]*$/;

/**
 * Reads candidate sites from a GeoJSON FeatureCollection (RFC 7946): a Point is an
 * intersection, a LineString or MultiLineString a segment (or, with kind: corridor, a corridor).
 * Properties: id (required), name, kind, district (required), tags, area (urban | rural), aadt, performanceFunction,
 * candidates (treatment ids for the scenario). Coordinates are [longitude, latitude] in WGS84.
 * The file must be JSON (RFC 7946 builds on RFC 8259): a number such as 0x1F, 0o17 or .inf,
 * which a YAML reader would quietly accept, is refused at its line. Every problem is reported
 * with its line and field path; throws InputError.
 */
export function readSitesGeojson(file: string): NetworkSite[] {
  const source = readYamlFile(file);
  // The YAML read has already checked the file exists, fits and is UTF-8.
  const stray = findNonJsonToken(readFileSync(file, "utf8"));
  if (stray !== undefined) {
    throw new InputError([{ code: "geojson", file: source.file, line: stray.line, column: stray.column, message: `${quoteValue(stray.token)} is not JSON: GeoJSON numbers are decimal (such as 10.4 or -3.5e-2) and text is in double quotes`, hint: "write coordinates and numbers in decimal digits, e.g. [10.4012, 55.3977], and quote every name" }]);
  }
  const problems: InputProblem[] = [];
  const problem = (path: PathSegment[], message: string, hint: string) =>
    problems.push({ code: "geojson", file: source.file, ...source.positionOf(path), path: formatFieldPath(path), message, hint });
  const data = source.data as { type?: unknown; features?: unknown } | null;
  if (data === null || typeof data !== "object" || data.type !== "FeatureCollection" || !Array.isArray(data.features)) {
    throw new InputError([{ code: "geojson", file: source.file, line: 1, column: 1, message: "is not a GeoJSON FeatureCollection", hint: 'the file must be { "type": "FeatureCollection", "features": [...] }' }]);
  }
  const sites: NetworkSite[] = [];
  const seen = new Map<string, number>();
  (data.features as unknown[]).forEach((feature, index) => {
    const at = (...rest: PathSegment[]): PathSegment[] => ["features", index, ...rest];
    const f = (feature ?? {}) as { geometry?: { type?: unknown; coordinates?: unknown }; properties?: Record<string, unknown> | null };
    const props = f.properties ?? {};
    const rawId = props.id;
    const id = typeof rawId === "number" ? String(rawId) : rawId;
    if (typeof id !== "string" || !ID_PATTERN.test(id)) {
      problem(at("properties", "id"), "the feature needs an id property of letters, digits, '.', '_' or '-'", "add properties.id, e.g. \"I-01\"");
      return;
    }
    const earlier = seen.get(id);
    if (earlier !== undefined) problem(at("properties", "id"), `site id '${id}' is used twice (first at features[${earlier}])`, "give each site its own id");
    seen.set(id, index);

    const paths = geometryPaths(f.geometry, (message) => problem(at("geometry"), message, "use a Point [lon, lat], a LineString or a MultiLineString in WGS84 degrees"));
    if (paths === undefined) return;
    const isPoint = paths.length === 1 && paths[0]!.length === 1;
    const kind = (props.kind ?? (isPoint ? "intersection" : "segment")) as SiteKind;
    if (!SITE_KINDS.includes(kind)) problem(at("properties", "kind"), `unknown kind '${String(props.kind)}'`, `use one of: ${SITE_KINDS.join(", ")}`);
    else if ((kind === "intersection") !== isPoint) problem(at("geometry"), `a${kind === "intersection" ? "n intersection needs a Point" : ` ${kind} needs a LineString or MultiLineString`}`, "match the geometry to the kind");
    if (typeof props.district !== "string" || props.district.trim() === "") problem(at("properties", "district"), "the feature needs a district property", "add properties.district (used for rules and the data-quality report)");
    const strings = (name: string): string[] | undefined => {
      const value = props[name];
      if (value === undefined) return [];
      if (Array.isArray(value) && value.every((item) => typeof item === "string")) return value as string[];
      problem(at("properties", name), `${name} must be a list of text`, `write "${name}": ["a", "b"]`);
      return undefined;
    };
    const tags = strings("tags");
    const candidates = strings("candidates");
    if (props.aadt !== undefined && !(typeof props.aadt === "number" && props.aadt > 0)) problem(at("properties", "aadt"), `aadt '${String(props.aadt)}' is not a positive number`, "give vehicles per day, e.g. 14000");
    if (props.performanceFunction !== undefined && (typeof props.performanceFunction !== "string" || !ID_PATTERN.test(props.performanceFunction))) problem(at("properties", "performanceFunction"), "performanceFunction must be an SPF id", "use an id from the catalogue's performanceFunctions");
    if (props.area !== undefined && !AREA_TYPES.includes(props.area as AreaType)) problem(at("properties", "area"), `unknown area '${String(props.area)}'`, `use one of: ${AREA_TYPES.join(", ")}`);
    if (tags === undefined || candidates === undefined || typeof props.district !== "string") return;
    sites.push({
      id,
      name: typeof props.name === "string" && props.name.trim() !== "" ? props.name : id,
      kind,
      district: props.district,
      tags,
      ...(AREA_TYPES.includes(props.area as AreaType) && { area: props.area as AreaType }),
      ...(typeof props.aadt === "number" && { aadt: props.aadt }),
      ...(typeof props.performanceFunction === "string" && { performanceFunction: props.performanceFunction }),
      candidates,
      paths,
    });
  });
  if (sites.length === 0 && problems.length === 0) problems.push({ code: "geojson", file: source.file, line: 1, column: 1, message: "has no features", hint: "add one feature per candidate site" });
  if (problems.length > 0) throw new InputError(problems);
  return sites;
}

/** The geometry as paths of points, or undefined (after reporting why) when it is unusable. */
function geometryPaths(geometry: { type?: unknown; coordinates?: unknown } | undefined, report: (message: string) => void): GeoPoint[][] | undefined {
  const position = (value: unknown): GeoPoint | undefined => {
    if (!Array.isArray(value) || value.length < 2 || typeof value[0] !== "number" || typeof value[1] !== "number") return undefined;
    const [lon, lat] = value as number[];
    return Math.abs(lon!) <= 180 && Math.abs(lat!) <= 90 ? { lon: lon!, lat: lat! } : undefined;
  };
  const line = (value: unknown): GeoPoint[] | undefined => {
    if (!Array.isArray(value) || value.length < 2) return undefined;
    const points = value.map(position);
    return points.every((p): p is GeoPoint => p !== undefined) ? points : undefined;
  };
  if (geometry === undefined || geometry === null) {
    report("the feature has no geometry");
    return undefined;
  }
  let paths: (GeoPoint[] | undefined)[] | undefined;
  let problem = "";
  if (geometry.type === "Point") {
    const point = position(geometry.coordinates);
    paths = [point ? [point] : undefined];
    problem = "a Point needs coordinates [longitude, latitude] within ±180, ±90";
  } else if (geometry.type === "LineString") {
    paths = [line(geometry.coordinates)];
    problem = "a LineString needs two or more [longitude, latitude] positions";
  } else if (geometry.type === "MultiLineString" && Array.isArray(geometry.coordinates) && geometry.coordinates.length > 0) {
    paths = geometry.coordinates.map(line);
    problem = "each line of a MultiLineString needs two or more positions";
  }
  if (paths !== undefined) {
    if (paths.every((p): p is GeoPoint[] => p !== undefined)) return paths;
    report(problem);
    return undefined;
  }
  report(`geometry type '${String(geometry.type)}' is not supported`);
  return undefined;
}
