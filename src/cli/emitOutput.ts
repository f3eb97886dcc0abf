import { writeOutputFile } from "../io/writeOutputFile.js";
import type { CliIo } from "./CliIo.js";

/** Sends a command's result to --out (atomically, never clobbering without --force) or to stdout. */
export function emitOutput(io: CliIo, content: string, out: string | undefined, force: boolean): void {
  if (out === undefined) {
    io.stdout(content);
    return;
  }
  writeOutputFile(out, content, force);
  io.stderr(`wrote ${out}\n`);
}
