import { InputError } from "../io/InputError.js";
import { writeAllSync } from "../io/writeAllSync.js";
import { writeProblem } from "../io/writeProblems.js";

/** Where a command writes: the terminal streams, injectable so commands run in tests in-process. */
export interface CliIo {
  readonly stdout: (text: string) => void;
  readonly stderr: (text: string) => void;
  /** Whether stderr is a terminal (progress bars only then). */
  readonly stderrIsTty: boolean;
}

/**
 * The process's own streams, written synchronously to their end: a closed pipe (`| head -1`) or a
 * full disk (`> /dev/full`) on standard output becomes one clear error (exit 2), never a crash
 * or a silent loss. A failing standard error cannot report anything, so it is ignored.
 */
export const processIo: CliIo = {
  stdout: (text) => {
    try {
      writeAllSync(1, Buffer.from(text, "utf8"));
    } catch (error) {
      const code = (error as NodeJS.ErrnoException).code;
      throw new InputError([{ code: "cannot-write", file: "standard output", message: `cannot be written: ${writeProblem(code)}${code === undefined ? "" : ` (${code})`}`, hint: "write to a file with --out, or check the disk and the command reading the output" }]);
    }
  },
  stderr: (text) => {
    try {
      writeAllSync(2, Buffer.from(text, "utf8"));
    } catch {
      // Nowhere left to say it.
    }
  },
  stderrIsTty: Boolean(process.stderr.isTTY),
};
