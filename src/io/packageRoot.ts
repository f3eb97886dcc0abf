import { existsSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";

/** The folder holding averta's package.json, found from this module whether run from src or dist. */
export function packageRoot(): string {
  let folder = dirname(fileURLToPath(import.meta.url));
  while (!existsSync(join(folder, "package.json"))) {
    const parent = dirname(folder);
    if (parent === folder) throw new Error("averta's package.json was not found above " + fileURLToPath(import.meta.url));
    folder = parent;
  }
  return folder;
}
