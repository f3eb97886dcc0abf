import { closeSync, existsSync, fsyncSync, openSync, renameSync, rmSync, statSync, writeSync } from "node:fs";
import { basename, dirname, join, resolve } from "node:path";
import { InputError } from "./InputError.js";

/** Why a file could not be written, for the errors that lie with the folder or disk, not with averta. */
const WRITE_PROBLEMS: Readonly<Record<string, string>> = {
  EACCES: "permission denied",
  EPERM: "permission denied",
  EROFS: "the folder is on a read-only disk",
  ENOSPC: "no space left on device",
  EDQUOT: "the disk quota is used up",
};

/**
 * Writes `content` to `file` atomically: a temporary file in the same folder, flushed, then
 * renamed over the target, so a reader never sees half a file and an interrupted run leaves none.
 * An existing file is replaced only when `force` is set. `option` names the command-line option
 * that gave the path, for the messages.
 */
export function writeOutputFile(file: string, content: string, force: boolean, option = "--out"): void {
  checkOutputTarget(file, force, option);
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
    const code = (error as NodeJS.ErrnoException).code;
    const reason = code === undefined ? undefined : WRITE_PROBLEMS[code];
    if (reason !== undefined) throw new InputError([{ code: "cannot-write", file, message: `cannot be written: ${reason} (${code})`, hint: `choose another ${option} path, or free the disk or fix the folder's permissions` }]);
    throw error;
  }
}

/**
 * Throws the InputError writeOutputFile would for `file` (an empty name, a missing folder, a
 * folder in the way, an existing file without `force`), so a command checks its targets before
 * any long work, and a command writing several files checks them all before writing any.
 * `option` names the command-line option that gave the path.
 */
export function checkOutputTarget(file: string, force: boolean, option = "--out"): void {
  if (file.trim() === "") {
    throw new InputError([{ code: "bad-option", file: option, message: "needs a file name, and got an empty one", hint: `give ${option} a file name, e.g. ${option} plan.txt` }]);
  }
  const folder = dirname(file);
  if (!existsSync(folder) || !statSync(folder).isDirectory()) {
    throw new InputError([{ code: "no-folder", file, message: `folder ${folder} does not exist`, hint: `create it first or choose another ${option} path` }]);
  }
  if (existsSync(file)) {
    if (statSync(file).isDirectory()) throw new InputError([{ code: "not-a-file", file, message: "is a folder", hint: `give ${option} a file name, not a folder` }]);
    if (!force) throw new InputError([{ code: "exists", file, message: "already exists and was left untouched", hint: `choose another ${option} path, or add --force to replace it` }]);
  }
}

/**
 * Refuses two output options that name the same file (one would silently replace the other),
 * e.g. `--out chart.svg --chart chart.svg`. `targets` pairs each option with its path, if given.
 */
export function checkDistinctOutputs(targets: readonly { readonly option: string; readonly file: string | undefined }[]): void {
  const seen = new Map<string, string>();
  for (const { option, file } of targets) {
    if (file === undefined) continue;
    const earlier = seen.get(resolve(file));
    if (earlier !== undefined) throw new InputError([{ code: "bad-option", file: option, message: `names the same file as ${earlier} (${file})`, hint: `give ${option} its own file name` }]);
    seen.set(resolve(file), option);
  }
}
