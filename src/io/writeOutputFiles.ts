import { existsSync } from "node:fs";
import { InputError } from "./InputError.js";
import { writeOutputFile } from "./writeOutputFile.js";

/**
 * Writes several files that belong together (e.g. an output and its report). Without `force`,
 * any existing target stops the run before anything is written, so a refusal never leaves half
 * of the set behind.
 */
export function writeOutputFiles(files: readonly { readonly path: string; readonly content: string }[], force: boolean): void {
  if (!force) {
    const existing = files.filter((file) => existsSync(file.path));
    if (existing.length > 0) {
      throw new InputError(existing.map((file) => ({ code: "exists", file: file.path, message: "already exists and was left untouched", hint: "choose another --out path, or add --force to replace it" })));
    }
  }
  for (const file of files) writeOutputFile(file.path, file.content, force);
}
