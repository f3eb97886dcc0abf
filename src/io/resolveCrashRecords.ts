import { statSync } from "node:fs";
import { dirname, isAbsolute, resolve } from "node:path";
import type { CrashRecordFiles } from "../model/builtProjectTypes.js";
import { allowedInputPath } from "./allowedInputPath.js";
import type { InputProblem } from "./InputError.js";
import type { YamlSource } from "./readYamlFile.js";

const RECORDS_PLACES =
  "a relative path must stay inside the projects file's folder or a 'catalogs' folder in it or above it (e.g. vellmar-crashes.csv); give an absolute path to use a file elsewhere";

const WHAT: Readonly<Record<keyof CrashRecordFiles, string>> = { crashes: "crash CSV", sites: "sites GeoJSON", mapping: "crash mapping" };

/**
 * The crash-record files a projects file names (relative to it), as absolute paths, under the
 * path policy of catalogues and sites files (see allowedInputPath). Each must exist and be a
 * regular file; problems point at the field. The files are not read here.
 */
export function resolveCrashRecords(file: string, written: CrashRecordFiles | undefined, source: YamlSource): { records?: CrashRecordFiles; problems: InputProblem[] } {
  if (written === undefined) return { problems: [] };
  const problems: InputProblem[] = [];
  const resolved = (field: keyof CrashRecordFiles): string => {
    const path = written[field]!;
    const full = resolve(dirname(file), path);
    const at = { file: source.file, ...source.positionOf(["crashRecords", field]), path: `crashRecords.${field}` };
    const label = `${WHAT[field]} '${path}'`;
    if (!isAbsolute(path) && !allowedInputPath(file, full)) {
      problems.push({ code: "records-outside", ...at, message: `${label} lies outside the projects file's folder and every 'catalogs' folder above it (${full})`, hint: RECORDS_PLACES });
      return full;
    }
    const kind = fileKind(full);
    if (kind === "missing") problems.push({ code: "missing-file", ...at, message: `${label} was not found (looked in ${full})`, hint: "crash record paths are relative to the projects file" });
    if (kind === "other") problems.push({ code: "not-a-file", ...at, message: `${label} is not a regular file (${full})`, hint: `name the ${WHAT[field]} file itself` });
    return full;
  };
  const records: CrashRecordFiles = {
    crashes: resolved("crashes"),
    sites: resolved("sites"),
    ...(written.mapping !== undefined && { mapping: resolved("mapping") }),
  };
  return { records, problems };
}

function fileKind(path: string): "file" | "missing" | "other" {
  try {
    return statSync(path).isFile() ? "file" : "other";
  } catch {
    return "missing";
  }
}
