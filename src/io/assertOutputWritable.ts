import { existsSync, statSync } from "node:fs";
import { dirname } from "node:path";
import { InputError } from "./InputError.js";

/**
 * Checks, before any work is written, that `file` could be written by writeOutputFile: its folder
 * exists and it is not a folder, nor an existing file unless `force`. Commands that write several
 * files call this for each first, so a refusal never leaves some written and others not.
 */
export function assertOutputWritable(file: string, force: boolean, option: string): void {
  const folder = dirname(file);
  if (!existsSync(folder) || !statSync(folder).isDirectory()) {
    throw new InputError([{ code: "no-folder", file, message: `folder ${folder} does not exist`, hint: `create it first or choose another ${option} path` }]);
  }
  if (!existsSync(file)) return;
  if (statSync(file).isDirectory()) throw new InputError([{ code: "not-a-file", file, message: "is a folder", hint: `give a file name to ${option}` }]);
  if (!force) throw new InputError([{ code: "exists", file, message: "already exists and was left untouched", hint: `choose another ${option} path, or add --force to replace it` }]);
}
