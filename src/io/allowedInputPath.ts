import { existsSync, lstatSync, realpathSync } from "node:fs";
import { dirname, join, resolve, sep } from "node:path";

// Set for the run by the CLI's --allow-outside-files: the user's explicit consent to read files a
// scenario names outside the places below.
let outsideAllowed = false;

/** Allows (or, by default, refuses) relative scenario paths that resolve outside the allowed places. */
export function allowOutsideFiles(allowed: boolean): void {
  outsideAllowed = allowed;
}

/**
 * The path policy for files a scenario names by a relative path (catalogues, a sites file): the
 * resolved path, after every symbolic link is followed, must lie in the scenario's own folder tree
 * or in a real folder named `catalogs` directly inside the scenario's folder or one of its
 * ancestors. A `catalogs` that is itself a symbolic link does not count: it could point anywhere.
 * A scenario shared with others then cannot quietly read files from elsewhere on their disk
 * (`..`, or a link to a system folder). An absolute path is an explicit choice and is accepted
 * by the callers without this check; `--allow-outside-files` lifts it for the run.
 */
export function allowedInputPath(scenarioFile: string, resolved: string): boolean {
  if (outsideAllowed) return true;
  const real = (path: string) => (existsSync(path) ? realpathSync(path) : path);
  const inside = (path: string, folder: string) => path === folder || path.startsWith(folder.endsWith(sep) ? folder : folder + sep);
  const folder = real(dirname(resolve(scenarioFile)));
  const target = real(resolved);
  if (inside(target, folder)) return true;
  for (let ancestor = folder; ; ancestor = dirname(ancestor)) {
    const catalogs = join(ancestor, "catalogs");
    if (isRealFolder(catalogs) && inside(target, catalogs)) return true;
    if (dirname(ancestor) === ancestor) return false;
  }
}

function isRealFolder(path: string): boolean {
  try {
    const stats = lstatSync(path);
    return stats.isDirectory() && !stats.isSymbolicLink();
  } catch {
    return false;
  }
}
