import { closeSync, existsSync, fsyncSync, openSync, renameSync, rmSync, statSync, writeSync } from "node:fs";
import { basename, dirname, join } from "node:path";
import { InputError } from "./InputError.js";

/**
 * Writes `content` to `file` atomically: a temporary file in the same folder, flushed, then
 * renamed over the target, so a reader never sees half a file and an interrupted run leaves none.
 * An existing file is replaced only when `force` is set.
 */
export function writeOutputFile(file: string, content: string, force: boolean): void {
  checkOutputTarget(file, force);
  const folder = dirname(file);
  const temporary = join(folder, `.${basename(file)}.${process.pid}.${Date.now()}.tmp`);
  try {
    const descriptor = openSync(temporary, "wx");
    try {
      writeSync(descriptor, content);
      fsyncSync(descriptor);
    } finally {
      closeSync(descriptor);
    }
    renameSync(temporary, file);
  } catch (error) {
    rmSync(temporary, { force: true });
    throw error;
  }
}

/**
 * Throws the InputError writeOutputFile would for `file` (missing folder, a folder in the way,
 * an existing file without `force`), so a command writing several files can check them all first.
 */
export function checkOutputTarget(file: string, force: boolean): void {
  const folder = dirname(file);
  if (!existsSync(folder) || !statSync(folder).isDirectory()) {
    throw new InputError([{ code: "no-folder", file, message: `folder ${folder} does not exist`, hint: "create it first or choose another --out path" }]);
  }
  if (existsSync(file)) {
    if (statSync(file).isDirectory()) throw new InputError([{ code: "not-a-file", file, message: "is a folder", hint: "give a file name to --out" }]);
    if (!force) throw new InputError([{ code: "exists", file, message: "already exists and was left untouched", hint: "choose another --out path, or add --force to replace it" }]);
  }
}
