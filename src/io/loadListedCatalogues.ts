import { dirname, isAbsolute, relative, resolve } from "node:path";
import { allowedInputPath } from "./allowedInputPath.js";
import { atReference } from "./atReference.js";
import { InputError } from "./InputError.js";
import { loadCatalogue, type LoadedCatalogue } from "./loadCatalogue.js";
import type { YamlSource } from "./readYamlFile.js";

const CATALOGUE_PLACES =
  "a relative catalogue path must stay inside the scenario's folder or a 'catalogs' folder in it or above it (e.g. ../catalogs/x.yaml); give an absolute path to use a catalogue elsewhere";

/**
 * Loads the catalogues a scenario lists under `catalogues:` (paths relative to the scenario file
 * `file`), in order. Refuses, at the list entry: a relative path outside the scenario's folder and
 * the 'catalogs' folders above it, a catalogue listed twice, and one that is missing or not a file.
 */
export function loadListedCatalogues(paths: readonly string[], source: YamlSource, file: string): LoadedCatalogue[] {
  const seen = new Map<string, number>();
  return paths.map((path, index) => {
    const at = { file: source.file, ...source.positionOf(["catalogues", index]), path: `catalogues[${index}]` };
    const resolved = resolve(dirname(file), path);
    const outside = !isAbsolute(path) && !allowedInputPath(file, resolved);
    if (outside) {
      throw new InputError([{ code: "catalogue-outside", ...at, message: `catalogue '${path}' lies outside the scenario's folder and every 'catalogs' folder above it (${resolved})`, hint: CATALOGUE_PLACES }]);
    }
    const earlier = seen.get(resolved);
    if (earlier !== undefined) {
      throw new InputError([{ code: "duplicate-id", ...at, message: `catalogue '${path}' is already listed at catalogues[${earlier}]`, hint: "list each catalogue once" }]);
    }
    seen.set(resolved, index);
    return atReference(() => loadCatalogue(resolved, relative(process.cwd(), resolved) || resolved), at, {
      label: `catalogue '${path}'`,
      resolved,
      missingHint: "catalogue paths are relative to the scenario file",
      notAFileHint: "name the catalogue's .yaml file",
    });
  });
}
