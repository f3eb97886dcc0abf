import { closeSync, existsSync, fsyncSync, linkSync, lstatSync, openSync, readdirSync, renameSync, rmSync, statSync } from "node:fs";
import { basename, dirname, join, resolve, sep } from "node:path";
import { createHash, randomBytes } from "node:crypto";
import { hostname } from "node:os";
import { InputError } from "./InputError.js";
import { runInputAt } from "./runInputs.js";
import { inBatches } from "./inBatches.js";
import { writeAllSync } from "./writeAllSync.js";
import { writeProblem } from "./writeProblems.js";

/** Longest file name (one path component, in bytes) most file systems accept. */
const MAX_NAME_BYTES = 255;

// Temporaries sit beside the target (a rename across disks is not atomic) and are named
// `.<name>.averta-<host>-<pid>-<random>.tmp`: a later run on the same machine (host tag) can tell
// stale ones from the pid; another machine's, in a shared folder, are never touched.
const HOST = createHash("sha256").update(hostname()).digest("hex").slice(0, 6);
const TEMPORARY = new RegExp(`^\\..*\\.averta-${HOST}-(\\d+)-[0-9a-f]{8}\\.tmp$`);

/**
 * Writes `content` (text, or bytes such as a workbook) to `file` so that a reader never sees half a file and nothing of a failed
 * write is left: a temporary file in the same folder, written to its end and fsync'd, then
 * renamed over the target with `force`, or hard-linked to a name that must not exist yet
 * without it (link fails if another run got there first, so of two runs exactly one wins).
 * A run killed mid-write leaves its temporary; the next write into that folder removes the
 * temporaries of processes that no longer run. Never replaces a folder, device, FIFO or socket,
 * nor a file this run has read. `option` names the command-line option that gave the path.
 */
export function writeOutputFile(file: string, content: string | Uint8Array | Iterable<string>, force: boolean, option = "--out"): void {
  checkOutputTarget(file, force, option);
  const folder = dirname(file);
  removeStaleTemporaries(folder);
  const temporary = join(folder, `.${basename(file).slice(0, 100)}.averta-${HOST}-${process.pid}-${randomBytes(4).toString("hex")}.tmp`);
  try {
    const descriptor = openSync(temporary, "wx");
    try {
      if (content instanceof Uint8Array) writeAllSync(descriptor, content);
      else for (const piece of typeof content === "string" ? [content] : inBatches(content)) writeAllSync(descriptor, Buffer.from(piece, "utf8"));
      fsyncSync(descriptor);
    } finally {
      closeSync(descriptor);
    }
    if (force) renameSync(temporary, file);
    else createWithoutReplacing(temporary, file, option);
    syncFolder(folder);
  } catch (error) {
    rmSync(temporary, { force: true });
    if (error instanceof InputError) throw error;
    const code = (error as NodeJS.ErrnoException).code;
    if (code === undefined) throw error;
    throw new InputError([{ code: "cannot-write", file, message: `cannot be written: ${writeProblem(code)} (${code}); nothing was written`, hint: `choose another ${option} path, or free the disk or fix the folder's permissions` }]);
  }
}

// Publishes the finished temporary under `file` only if no file has that name.
function createWithoutReplacing(temporary: string, file: string, option: string): void {
  try {
    linkSync(temporary, file);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === "EEXIST") throw existsError(file, option);
    if (code !== "EPERM" && code !== "ENOTSUP" && code !== "EOPNOTSUPP" && code !== "ENOSYS") throw error;
    // No hard links on this file system: claim the name by exclusive creation, then rename onto it.
    try {
      closeSync(openSync(file, "wx"));
    } catch (claim) {
      if ((claim as NodeJS.ErrnoException).code === "EEXIST") throw existsError(file, option);
      throw claim;
    }
    renameSync(temporary, file);
    return;
  }
  rmSync(temporary, { force: true });
}

function existsError(file: string, option: string): InputError {
  return new InputError([{ code: "exists", file, message: "already exists and was left untouched", hint: `choose another ${option} path, or add --force to replace it` }]);
}

// Removes temporaries left by averta runs that were killed mid-write (their process is gone).
function removeStaleTemporaries(folder: string): void {
  let names: string[];
  try {
    names = readdirSync(folder);
  } catch {
    return;
  }
  for (const name of names) {
    const match = TEMPORARY.exec(name);
    if (match === null || processAlive(Number(match[1]))) continue;
    rmSync(join(folder, name), { force: true });
  }
}

function processAlive(pid: number): boolean {
  if (pid === process.pid) return true;
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === "EPERM";
  }
}

// Makes the rename itself durable; some file systems cannot fsync a folder, which is harmless.
function syncFolder(folder: string): void {
  try {
    const descriptor = openSync(folder, "r");
    try {
      fsyncSync(descriptor);
    } finally {
      closeSync(descriptor);
    }
  } catch {
    // Best effort.
  }
}

/**
 * Throws the InputError writeOutputFile would for `file` (an empty or over-long name, a name
 * ending in a slash, a missing folder, a folder, device, FIFO or socket in the way, an input of
 * this run, an existing file without `force`), so a command checks its targets before any long
 * work, and a command writing several files checks them all before writing any. `option` names
 * the command-line option that gave the path.
 */
export function checkOutputTarget(file: string, force: boolean, option = "--out"): void {
  const refuse = (code: string, message: string, hint: string) => new InputError([{ code, file: file === "" ? option : file, message, hint }]);
  if (file.trim() === "") throw refuse("bad-option", "needs a file name, and got an empty one", `give ${option} a file name, e.g. ${option} plan.txt`);
  if (file.endsWith("/") || file.endsWith(sep)) throw refuse("not-a-file", "ends with a slash, so it names a folder, not a file", `give ${option} a file name, e.g. ${file}plan.txt`);
  if (Buffer.byteLength(basename(file)) > MAX_NAME_BYTES) throw refuse("bad-option", `the file name is ${Buffer.byteLength(basename(file))} bytes long, over the ${MAX_NAME_BYTES} most file systems allow`, `give ${option} a shorter name`);
  if (Buffer.byteLength(resolve(file)) > 4000) throw refuse("bad-option", "the path is too long for the file system", `give ${option} a shorter path`);
  const folder = dirname(file);
  if (!existsSync(folder) || !statSync(folder).isDirectory()) throw refuse("no-folder", `folder ${folder} does not exist`, `create it first or choose another ${option} path`);
  let stats;
  try {
    stats = lstatSync(file);
  } catch {
    return; // nothing there yet
  }
  const input = runInputAt(file);
  if (input !== undefined) throw refuse("output-is-input", `is ${input === file ? "" : `the same file as ${input}, `}an input of this run, and is never overwritten, even with --force`, `give ${option} another name`);
  const target = stats.isSymbolicLink() ? safeStat(file) : stats;
  if (target?.isDirectory()) throw refuse("not-a-file", "is a folder", `give ${option} a file name, not a folder`);
  if (target !== undefined && !target.isFile()) throw refuse("not-a-file", `is ${target.isFIFO() ? "a named pipe (FIFO)" : target.isSocket() ? "a socket" : "a device"}, not a regular file, and is never replaced`, `give ${option} a regular file name`);
  if (!force) throw existsError(file, option);
}

function safeStat(file: string) {
  try {
    return statSync(file);
  } catch {
    return undefined;
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
