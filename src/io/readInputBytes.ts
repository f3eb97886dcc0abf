import { closeSync, constants, fstatSync, openSync, readSync } from "node:fs";
import { InputError } from "./InputError.js";
import { noteRunInput } from "./runInputs.js";

const CHUNK = 1 << 20;

/**
 * Reads an input file whole, refusing at once what is not a regular file: a folder, a device
 * (`/dev/zero` would never end), a FIFO (it would block waiting for a writer; it is opened
 * non-blocking, so the open itself cannot hang) or a socket. Reads at most `maxBytes`, whatever
 * the file claims its size is, so a growing or endless file stops at the limit with a clear
 * error. Records the file as an input of the run. `label` names it in messages.
 */
export function readInputBytes(file: string, label: string, maxBytes: number, tooLargeHint: string): Buffer {
  let descriptor: number;
  try {
    descriptor = openSync(file, constants.O_RDONLY | constants.O_NONBLOCK);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    throw new InputError([
      {
        code: "missing-file",
        file: label,
        message: code === "ENOENT" ? "file not found" : code === "EACCES" || code === "EPERM" ? "cannot be read: permission denied" : `cannot be read (${code ?? "unknown error"})`,
        hint: code === "ENOENT" ? "check the spelling and the folder you run averta from" : "check the path and its permissions",
      },
    ]);
  }
  try {
    const stats = fstatSync(descriptor);
    if (stats.isDirectory()) throw new InputError([{ code: "not-a-file", file: label, message: "is a folder, not a file", hint: "name a file inside it" }]);
    if (!stats.isFile()) {
      const kind = stats.isFIFO() ? "a named pipe (FIFO)" : stats.isSocket() ? "a socket" : "a device";
      throw new InputError([{ code: "not-a-file", file: label, message: `is ${kind}, not a regular file`, hint: "save the data to a file and name that file" }]);
    }
    noteRunInput(file, stats);
    const limit = `the ${(maxBytes / 1048576).toFixed(0)} MiB limit`;
    const tooLarge = (size?: number) =>
      new InputError([{ code: "too-large", file: label, message: size === undefined ? `holds more than ${limit} (it kept growing while read)` : `is ${(size / 1048576).toFixed(1)} MiB, over ${limit}`, hint: tooLargeHint }]);
    if (stats.size > maxBytes) throw tooLarge(stats.size);
    const chunks: Buffer[] = [];
    let total = 0;
    for (;;) {
      const chunk = Buffer.allocUnsafe(Math.min(CHUNK, maxBytes + 1 - total));
      const read = readSync(descriptor, chunk, 0, chunk.length, null);
      if (read === 0) break;
      chunks.push(read === chunk.length ? chunk : chunk.subarray(0, read));
      total += read;
      if (total > maxBytes) throw tooLarge();
    }
    return Buffer.concat(chunks, total);
  } catch (error) {
    if (error instanceof InputError) throw error;
    const code = (error as NodeJS.ErrnoException).code;
    throw new InputError([{ code: "missing-file", file: label, message: `cannot be read (${code ?? "unknown error"})`, hint: "check the file and its permissions" }]);
  } finally {
    closeSync(descriptor);
  }
}
