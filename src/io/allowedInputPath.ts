import { existsSync, realpathSync } from "node:fs";
import { dirname, join, resolve, sep } from "node:path";

/**
 * The path policy for files a scenario names by a relative path (catalogues, a sites file): the
 * resolved path may only reach the scenario's own folder tree or a folder named `catalogs`
 * directly inside the scenario's folder or one of its ancestors, judged after symbolic links are
 * followed. A scenario shared with others then cannot quietly read files from elsewhere on their
 * disk; an absolute path is an explicit choice and is accepted by the callers without this check.
 */
export function allowedInputPath(scenarioFile: string, resolved: string): boolean {
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
