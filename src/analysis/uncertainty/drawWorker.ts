// Entry point of one worker thread of runDrawsInParallel: prepares the plan from the scenario it is
// given (deterministic, so identical to the main thread's) and runs its share of the draws.
import { parentPort, workerData } from "node:worker_threads";
import { preparePlan } from "../preparePlan.js";
import { runDraws } from "./runDraws.js";
import type { DrawJob } from "./runDrawsInParallel.js";

const job = workerData as DrawJob;
const prepared = preparePlan(job.scenario, job.objective);
await runDraws(prepared, job.planChoice, job.drawIndices, job.settings, (outcome) => parentPort!.postMessage(outcome));
