import { existsSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { Worker } from "node:worker_threads";
import type { Objective, Scenario } from "../../model/types.js";
import type { PreparedPlan } from "../preparePlan.js";
import type { DrawSettings } from "./drawSettings.js";
import type { DrawOutcome } from "./evaluateDraw.js";
import { runDraws } from "./runDraws.js";

/** What one worker thread is sent: plain data only. */
export interface DrawJob {
  readonly scenario: Scenario;
  readonly objective: Objective;
  readonly planChoice: readonly (number | null)[];
  readonly drawIndices: readonly number[];
  readonly settings: DrawSettings;
}

// Under a TypeScript test runner this module is the .ts source; workers need the compiled copy.
function workerScript(): URL {
  const compiled = import.meta.url.endsWith(".ts")
    ? new URL("../../../dist/src/analysis/uncertainty/drawWorker.js", import.meta.url)
    : new URL("./drawWorker.js", import.meta.url);
  if (!existsSync(fileURLToPath(compiled))) throw new Error(`the worker script ${fileURLToPath(compiled)} is missing; run npm run build`);
  return compiled;
}

/**
 * Runs draws 0 … draws − 1 on `threads` threads (draw i on thread i mod threads; one thread runs
 * in this thread without workers) and returns the outcomes in draw order. Each draw seeds its own
 * random stream from (seed, index), so the outcomes do not depend on the number of threads.
 * `onProgress(done)` is called after every finished draw.
 */
export async function runDrawsInParallel(
  prepared: PreparedPlan,
  planChoice: readonly (number | null)[],
  draws: number,
  threads: number,
  settings: DrawSettings,
  onProgress: (done: number) => void = () => {},
): Promise<DrawOutcome[]> {
  if (!Number.isInteger(draws) || draws < 1) throw new RangeError(`draws must be a whole number >= 1, got ${draws}`);
  if (!Number.isInteger(threads) || threads < 1) throw new RangeError(`threads must be a whole number >= 1, got ${threads}`);
  const outcomes = new Array<DrawOutcome>(draws);
  let done = 0;
  const record = (outcome: DrawOutcome): void => {
    outcomes[outcome.draw] = outcome;
    done += 1;
    onProgress(done);
  };
  const workerCount = Math.min(threads, draws);
  const shares = Array.from({ length: workerCount }, (_, worker) =>
    Array.from({ length: Math.ceil((draws - worker) / workerCount) }, (_, k) => worker + k * workerCount),
  );
  if (workerCount === 1) {
    await runDraws(prepared, planChoice, shares[0]!, settings, record);
    return outcomes;
  }
  const script = workerScript();
  const workers = shares.map(
    (drawIndices) => new Worker(script, { workerData: { scenario: prepared.scenario, objective: prepared.objective, planChoice, drawIndices, settings } satisfies DrawJob }),
  );
  try {
    await Promise.all(
      workers.map(
        (worker) =>
          new Promise<void>((resolve, reject) => {
            worker.on("message", (outcome: DrawOutcome) => record(outcome));
            worker.on("error", reject);
            worker.on("exit", (code) => (code === 0 ? resolve() : reject(new Error(`a draw worker stopped with exit code ${code}`))));
          }),
      ),
    );
  } catch (error) {
    // One failed worker fails the run; the others would only waste time.
    await Promise.all(workers.map((worker) => worker.terminate()));
    throw error;
  }
  return outcomes;
}
