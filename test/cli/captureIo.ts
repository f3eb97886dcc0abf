import type { CliIo } from "../../src/cli/CliIo.js";
import { runCli } from "../../src/cli/runCli.js";

/** Runs the CLI in-process and captures what it prints. */
export async function runCaptured(argv: readonly string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = "";
  let stderr = "";
  const io: CliIo = { stdout: (text) => void (stdout += text), stderr: (text) => void (stderr += text), stderrIsTty: false };
  const code = await runCli(argv, io);
  return { code, stdout, stderr };
}
