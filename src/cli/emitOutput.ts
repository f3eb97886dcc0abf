import { inBatches } from "../io/inBatches.js";
import { writeOutputFile } from "../io/writeOutputFile.js";
import type { CliIo } from "./CliIo.js";

/**
 * Sends a command's result to --out (atomically, never clobbering without --force) or to stdout.
 * `content` may come in pieces (a large JSON or CSV result), written batch by batch so the whole
 * text is never held at once.
 */
export function emitOutput(io: CliIo, content: string | Iterable<string>, out: string | undefined, force: boolean): void {
  if (out === undefined) {
    for (const batch of typeof content === "string" ? [content] : inBatches(content)) io.stdout(batch);
    return;
  }
  writeOutputFile(out, content, force);
  io.stderr(`wrote ${out}\n`);
}
