// Child-process entry for the solver benchmark: one solve per process, so that peak memory
// (maxRSS) belongs to that solve alone and a runaway solver can be killed outright.
import { buildHighsModel } from "../src/solver/buildHighsModel.js";
import { checkSolution } from "../src/solver/checkSolution.js";
import { loadHighs } from "../src/solver/loadHighs.js";
import { readHighsChoice } from "../src/solver/readHighsChoice.js";
import { runHighs } from "../src/solver/runHighs.js";
import { solveProgramme } from "../src/solver/solveProgramme.js";
import { generateBenchProgramme, type BenchProgrammeShape } from "./generateBenchProgramme.js";
import { generateBenchYearProgramme, type BenchYearProgrammeShape } from "./generateBenchYearProgramme.js";
import type { ChildRequest, ChildResult } from "./runInChild.js";

async function main(): Promise<ChildResult> {
  const request = JSON.parse(process.argv[2]!) as ChildRequest;
  // A shape with `years` is a multi-year programme.
  const programme = (request.shape as { years?: number }).years === undefined ? generateBenchProgramme(request.shape as BenchProgrammeShape) : generateBenchYearProgramme(request.shape as BenchYearProgrammeShape);
  // Whoever uses HiGHS loads it before the clock starts (averta only needs it for rules).
  const highs = request.solver === "highs" || programme.constraints.length > 0 ? await loadHighs() : undefined;
  const started = performance.now();
  if (request.solver === "averta") {
    const solution = await solveProgramme(programme, { timeLimitSeconds: request.timeLimitSeconds });
    return {
      status: solution.status,
      seconds: (performance.now() - started) / 1000,
      objective: solution.objective,
      bound: solution.bound,
      gap: solution.gap,
      peakMegabytes: process.resourceUsage().maxRSS / 1024,
    };
  }
  // mip_rel_gap 0 for a proof; mip_abs_gap left at its HiGHS default of 1e-6 value units.
  const model = buildHighsModel(highs!, programme, true);
  const run = runHighs(highs!, model.data, { timeLimitSeconds: request.timeLimitSeconds, relativeGap: 0, absoluteGap: 1e-6 });
  const seconds = (performance.now() - started) / 1000;
  const choice = run.colValue.length > 0 ? readHighsChoice(model, run.colValue, programme.groups.length) : undefined;
  const check = choice === undefined ? undefined : checkSolution(programme, choice);
  const objective = check?.feasible === true ? check.objective : Number.NaN;
  return {
    status: check?.feasible === true ? run.status : `${run.status} (no verified programme)`,
    seconds,
    objective,
    bound: run.bound,
    gap: (run.bound - objective) / Math.max(1, Math.abs(run.bound)),
    peakMegabytes: process.resourceUsage().maxRSS / 1024,
  };
}

main().then(
  (result) => process.send?.(result),
  (error: unknown) => process.send?.({ status: `error: ${String(error)}`, seconds: Number.NaN, objective: Number.NaN, bound: Number.NaN, gap: Number.NaN, peakMegabytes: Number.NaN }),
);
