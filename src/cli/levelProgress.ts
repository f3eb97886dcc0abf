import { progressBar } from "../report/progressBar.js";
import type { CliIo } from "./CliIo.js";

/** A progress bar of budget levels on standard error, only when it is a terminal (nothing is written otherwise). */
export function levelProgress(io: CliIo): ((done: number, total: number) => void) | undefined {
  return io.stderrIsTty ? (done, total) => io.stderr(progressBar(done, total, 30, "budget levels")) : undefined;
}
