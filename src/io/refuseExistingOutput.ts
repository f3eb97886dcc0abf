import { existsSync } from "node:fs";
import { InputError } from "./InputError.js";

/**
 * Checks, before a long computation, that an output file may be written: an existing file is
 * refused unless `force` is set (writeOutputFile checks again when it writes). `option` names
 * the command-line option that gave the path.
 */
export function refuseExistingOutput(option: string, file: string | undefined, force: boolean): void {
  if (file === undefined || force || !existsSync(file)) return;
  throw new InputError([{ code: "exists", file, message: `(${option}) already exists and was left untouched`, hint: `choose another ${option} path, or add --force to replace it` }]);
}
