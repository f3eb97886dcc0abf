import { fork } from "node:child_process";

/** What the parent asks a child process to solve. */
export interface ChildRequest {
  readonly solver: "averta" | "highs";
  readonly shape: unknown;
  readonly timeLimitSeconds: number;
}

/** What a child reports back (numbers are NaN when unknown). */
export interface ChildResult {
  readonly status: string;
  readonly seconds: number;
  readonly objective: number;
  readonly bound: number;
  readonly gap: number;
  readonly peakMegabytes: number;
}

/**
 * Solves one benchmark instance in a fresh Node process and kills it (SIGKILL) if it has not
 * answered `graceSeconds` after its own time limit: HiGHS can overrun its limit badly in set-up
 * on very large models.
 */
export function runInChild(request: ChildRequest, graceSeconds: number): Promise<ChildResult> {
  return new Promise((resolve) => {
    const started = performance.now();
    const child = fork(new URL("./solveInChild.js", import.meta.url), [JSON.stringify(request)], {
      execArgv: ["--max-old-space-size=4096"],
      serialization: "advanced", // keeps NaN for unknown figures
      stdio: ["ignore", "inherit", "inherit", "ipc"],
    });
    let settled = false;
    const finish = (result: ChildResult): void => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      child.kill("SIGKILL");
      resolve(result);
    };
    const timer = setTimeout(() => {
      finish({
        status: "killed at hard limit",
        seconds: (performance.now() - started) / 1000,
        objective: Number.NaN,
        bound: Number.NaN,
        gap: Number.NaN,
        peakMegabytes: Number.NaN,
      });
    }, (request.timeLimitSeconds + graceSeconds) * 1000);
    child.on("message", (message) => finish(message as ChildResult));
    child.on("exit", (code) => {
      finish({ status: `exited (${code})`, seconds: Number.NaN, objective: Number.NaN, bound: Number.NaN, gap: Number.NaN, peakMegabytes: Number.NaN });
    });
  });
}
