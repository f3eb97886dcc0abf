import { readInputBytes } from "./readInputBytes.js";
import { InputError } from "./InputError.js";

/** Largest text file read whole: a city's crash file of a few million rows fits below it. */
export const MAX_TEXT_BYTES = 512 * 1024 * 1024;

/** Reads a UTF-8 text file; a missing, unreadable, oversized, non-regular or non-UTF-8 file is an InputError. */
export function readTextFile(file: string): string {
  const bytes = readInputBytes(file, file, MAX_TEXT_BYTES, "split it by year");
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new InputError([{ code: "not-utf8", file, message: "is not valid UTF-8 text", hint: "export or save the file as UTF-8" }]);
  }
}
