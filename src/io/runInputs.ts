import { realpathSync, statSync, type Stats } from "node:fs";

// Files this run has read, by device and inode (so a hard link or a symbolic link to an input is
// recognised too), with the name the user gave. Module state at the I/O edge: one run, one set.
const inputs = new Map<string, string>();

const identity = (stats: Stats) => `${stats.dev}:${stats.ino}`;

/** Records that the run read `file` (its fstat result), so no output of the run may replace it. */
export function noteRunInput(file: string, stats: Stats): void {
  inputs.set(identity(stats), file);
}

/** Forgets the inputs of an earlier run in the same process (each CLI run starts with this). */
export function forgetRunInputs(): void {
  inputs.clear();
}

/** The input file (as the user named it) that `path` is, or resolves to, if the run read it. */
export function runInputAt(path: string): string | undefined {
  try {
    const byIdentity = inputs.get(identity(statSync(path)));
    if (byIdentity !== undefined) return byIdentity;
    const real = realpathSync(path);
    for (const [, file] of inputs) if (safeRealpath(file) === real) return file;
  } catch {
    // A path that does not exist (yet) is no input.
  }
  return undefined;
}

function safeRealpath(file: string): string | undefined {
  try {
    return realpathSync(file);
  } catch {
    return undefined;
  }
}
