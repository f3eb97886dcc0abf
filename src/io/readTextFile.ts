import { readFileSync, statSync } from "node:fs";
import { InputError } from "./InputError.js";

/** Largest text file read whole: a city's crash file of a few million rows fits below it. */
export const MAX_TEXT_BYTES = 512 * 1024 * 1024;

/** Reads a UTF-8 text file; a missing, unreadable, oversized or non-UTF-8 file is an InputError. */
export function readTextFile(file: string): string {
  let bytes: Buffer;
  try {
    const stats = statSync(file);
    if (stats.isDirectory()) throw new InputError([{ code: "not-a-file", file, message: "is a folder, not a file", hint: "name a file" }]);
    if (stats.size > MAX_TEXT_BYTES) {
      throw new InputError([{ code: "too-large", file, message: `is ${(stats.size / 1048576).toFixed(0)} MiB, over the ${MAX_TEXT_BYTES / 1048576} MiB limit`, hint: "split it by year" }]);
    }
    bytes = readFileSync(file);
  } catch (error) {
    if (error instanceof InputError) throw error;
    const code = (error as NodeJS.ErrnoException).code;
    throw new InputError([{ code: "missing-file", file, message: code === "ENOENT" ? "file not found" : `cannot be read (${code ?? "unknown error"})`, hint: "check the path" }]);
  }
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new InputError([{ code: "not-utf8", file, message: "is not valid UTF-8 text", hint: "export or save the file as UTF-8" }]);
  }
}
