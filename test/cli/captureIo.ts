import type { CliIo } from "../../src/cli/CliIo.js";
import { runCli } from "../../src/cli/runCli.js";

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

/** Runs the CLI in-process and captures what it prints. */
export async function runCaptured(argv: readonly string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  const io = captureIo();
  const code = await runCli(argv, io);
  return { code, stdout: io.out, stderr: io.err };
}
