import type { CliIo } from "../../src/cli/CliIo.js";

/** A CliIo that keeps what a command printed, for in-process CLI tests. */
export function captureIo(): CliIo & { out: string; err: string } {
  const io = {
    out: "",
    err: "",
    stderrIsTty: false,
    stdout: (text: string) => {
      io.out += text;
    },
    stderr: (text: string) => {
      io.err += text;
    },
  };
  return io;
}
