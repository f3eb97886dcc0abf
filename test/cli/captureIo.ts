import type { CliIo } from "../../src/cli/CliIo.js";

/** A CliIo that records what a command prints, for in-process CLI tests. */
export function captureIo(): CliIo & { out: () => string; err: () => string } {
  let out = "";
  let err = "";
  return {
    stdout: (text) => {
      out += text;
    },
    stderr: (text) => {
      err += text;
    },
    stderrIsTty: false,
    out: () => out,
    err: () => err,
  };
}
