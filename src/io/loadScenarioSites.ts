import { realpathSync } from "node:fs";
import { dirname, isAbsolute, relative, resolve } from "node:path";
import { allowedInputPath } from "./allowedInputPath.js";
import { atReference } from "./atReference.js";
import { closestName } from "./closestName.js";
import { InputError, type InputProblem } from "./InputError.js";
import type { RawScenario } from "./loadScenario.js";
import { readYamlFile, type PathSegment, type YamlSource } from "./readYamlFile.js";
import { validateWithSchema } from "./validateWithSchema.js";

type RawSite = RawScenario["sites"][number];
type CrashWindow = RawScenario["crashWindow"];
/** A site as written: its candidates may be left out. */
type WrittenSite = Omit<RawSite, "candidates"> & { candidates?: string[] };
/** The scenario file as written, after schema validation: sites inline or in a file it names. */
type WrittenScenario = Omit<RawScenario, "sites" | "crashWindow"> & { sites: WrittenSite[] | string; crashWindow?: CrashWindow };

/** A scenario's sites, wherever they are written, with the scenario's siteCandidates applied. */
export interface ScenarioSites {
  /** Every site with its candidates: its siteCandidates entry if the scenario has one, else its own list, else none. */
  readonly sites: RawSite[];
  readonly crashWindow: CrashWindow;
  /** Where the sites are written: the scenario itself, or the sites file it names. */
  readonly source: YamlSource;
}

const SITES_PLACES =
  "a relative sites path must stay inside the scenario's folder or a 'catalogs' folder in it or above it (e.g. vellmar-sites.yaml); give an absolute path to use a sites file elsewhere";

/**
 * Reads the sites of a schema-valid scenario: its inline `sites:` list, or the sites file that
 * `sites: <path>` names (relative to the scenario, under the same path policy as catalogues),
 * validated against schema/sites.schema.json with problems located in that file. The crash window
 * comes from the scenario or the sites file; both may give it only if they agree. Throws InputError.
 */
export function loadScenarioSites(file: string, scenario: YamlSource): ScenarioSites {
  const written = scenario.data as WrittenScenario;
  const here = (path: PathSegment[], key = false) => ({ file: scenario.file, ...scenario.positionOf(path, key), path: path.length === 0 ? "(top level)" : String(path[0]) });
  let source = scenario;
  let sites: WrittenSite[];
  let crashWindow = written.crashWindow;
  if (typeof written.sites === "string") {
    source = readSitesFile(file, written.sites, here(["sites"]));
    const data = source.data as { crashWindow?: CrashWindow; sites: WrittenSite[] };
    sites = data.sites;
    if (crashWindow !== undefined && data.crashWindow !== undefined && !sameWindow(crashWindow, data.crashWindow)) {
      const there = source.positionOf(["crashWindow"]);
      throw new InputError([
        {
          code: "window-mismatch",
          ...here(["crashWindow"]),
          message: `crashWindow ${span(crashWindow)} differs from ${span(data.crashWindow)} in the sites file (${source.file}:${there.line}:${there.column})`,
          hint: `remove crashWindow here to use the sites file's, or re-run averta tally with --window ${span(crashWindow)}`,
        },
      ]);
    }
    crashWindow ??= data.crashWindow;
    if (crashWindow === undefined) {
      throw new InputError([
        {
          code: "schema",
          file: source.file,
          ...source.positionOf([]),
          path: "(top level)",
          message: "the sites file gives no crashWindow, and neither does the scenario",
          hint: "add crashWindow: { firstYear: 2021, lastYear: 2025 } to the sites file (averta tally writes one) or to the scenario",
        },
      ]);
    }
  } else {
    sites = written.sites;
    if (crashWindow === undefined) {
      throw new InputError([{ code: "schema", ...here([]), message: "missing required field 'crashWindow'", hint: "add 'crashWindow: { firstYear: 2021, lastYear: 2025 }' with the years the crash counts cover" }]);
    }
  }

  const overrides = new Map(Object.entries(written.siteCandidates ?? {}));
  const ids = new Set(sites.map((site) => site.id));
  const problems: InputProblem[] = [];
  for (const id of overrides.keys()) {
    if (ids.has(id)) continue;
    const guess = closestName(id, ids);
    problems.push({ code: "unknown-id", file: scenario.file, ...scenario.positionOf(["siteCandidates", id], true), path: `siteCandidates.${id}`, message: `unknown site '${id}'`, hint: guess ? `did you mean '${guess}'?` : "use a site id from the sites list" });
  }
  if (problems.length > 0) throw new InputError(problems);
  return {
    sites: sites.map((site) => ({ ...site, candidates: overrides.get(site.id) ?? site.candidates ?? [] })),
    crashWindow,
    source,
  };
}

/**
 * Where a site's candidate list is written: its `siteCandidates` entry in the scenario when there
 * is one, else `sites[index].candidates` (in the sites file, when the scenario names one).
 */
export function candidatesPath(raw: RawScenario, index: number): PathSegment[] {
  const id = raw.sites[index]!.id;
  return raw.siteCandidates !== undefined && Object.hasOwn(raw.siteCandidates, id) ? ["siteCandidates", id] : ["sites", index, "candidates"];
}

function readSitesFile(scenarioFile: string, path: string, at: Omit<InputProblem, "code" | "message">): YamlSource {
  const resolved = resolve(dirname(scenarioFile), path);
  if (!isAbsolute(path) && !allowedInputPath(scenarioFile, resolved)) {
    throw new InputError([{ code: "sites-outside", ...at, message: `sites file '${path}' lies outside the scenario's folder and every 'catalogs' folder above it (${resolved})`, hint: SITES_PLACES }]);
  }
  if (realPath(resolved) === realPath(resolve(scenarioFile))) {
    throw new InputError([{ code: "sites-self", ...at, message: "names the scenario itself as its sites file", hint: "name the file averta tally wrote, or list the sites here" }]);
  }
  const source = atReference(() => readYamlFile(resolved, relative(process.cwd(), resolved) || resolved), at, {
    label: `sites file '${path}'`,
    resolved,
    missingHint: "the sites path is relative to the scenario file; averta tally --out writes one",
    notAFileHint: "name the sites .yaml file",
  });
  const problems = validateWithSchema(source, "sites");
  if (problems.length > 0) throw new InputError(problems);
  return source;
}

function realPath(path: string): string {
  try {
    return realpathSync(path);
  } catch {
    return path;
  }
}

function sameWindow(a: CrashWindow, b: CrashWindow): boolean {
  return a.firstYear === b.firstYear && a.lastYear === b.lastYear;
}

function span(window: CrashWindow): string {
  return `${window.firstYear}-${window.lastYear}`;
}
