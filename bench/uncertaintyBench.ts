import { availableParallelism } from "node:os";
import { preparePlan } from "../src/analysis/preparePlan.js";
import { analyseUncertainty } from "../src/analysis/uncertainty/analyseUncertainty.js";
import { loadScenario } from "../src/io/loadScenario.js";
import type { Scenario } from "../src/model/types.js";
import { generatedCityScenario } from "./generatedCityScenario.js";

/** One timed uncertainty run. */
export interface UncertaintyBenchResult {
  readonly name: string;
  readonly sites: number;
  readonly draws: number;
  readonly threads: number;
  readonly seconds: number;
  readonly drawsPerSecond: number;
  /** Draws whose re-optimisation returned a list (the rest timed out or were not solved). */
  readonly solvedDraws: number;
}

/** Settings of the benchmark; the defaults are the documented benchmark (1000 draws, 2,000 generated sites). */
export interface UncertaintyBenchOptions {
  readonly draws: number;
  readonly generatedSites: number;
  readonly threads: number;
}

async function timeRun(name: string, scenario: Scenario, options: UncertaintyBenchOptions): Promise<UncertaintyBenchResult> {
  const started = performance.now();
  const prepared = preparePlan(scenario);
  const result = await analyseUncertainty(prepared, {
    draws: options.draws,
    seed: 2027,
    threads: options.threads,
    sampleBaselines: true,
    budget: scenario.budget,
    solveOptions: {},
  });
  const seconds = (performance.now() - started) / 1000;
  return { name, sites: scenario.sites.length, draws: options.draws, threads: options.threads, seconds, drawsPerSecond: options.draws / seconds, solvedDraws: result.summary.solvedDraws };
}

/** Wall-clock target of the generated run (2,000 sites x 1,000 draws, 2 threads), and its speed-up on the previous release. */
export const UNCERTAINTY_TARGET_SECONDS = 30;
export const UNCERTAINTY_TARGET_SPEEDUP = 5;

/**
 * Times uncertainty runs with re-optimisation in every draw (plan solve included, sensitivity
 * excluded) on the demo and on a generated scenario, prints one line each and returns the figures.
 * With `previous`, the previous release's own uncertaintyBench (same scenarios, seed and threads,
 * from its built checkout) runs right after, in the same process, and the generated run's
 * figure is printed beside it with the speed-up.
 */
export async function uncertaintyBench(settings: Partial<UncertaintyBenchOptions> = {}, previous?: typeof uncertaintyBench): Promise<UncertaintyBenchResult[]> {
  const options: UncertaintyBenchOptions = { draws: 1000, generatedSites: 2000, threads: availableParallelism(), ...settings };
  const { scenario } = loadScenario("scenarios/demo.yaml");
  const results: UncertaintyBenchResult[] = [];
  for (const [name, case_] of [
    ["uncertainty: demo", scenario],
    [`uncertainty: generated ${options.generatedSites} sites`, generatedCityScenario(scenario, options.generatedSites)],
  ] as const) {
    const result = await timeRun(name, case_, options);
    console.log(
      `${result.name}: ${result.draws} draws on ${result.threads} thread(s) in ${result.seconds.toFixed(1)} s (${result.drawsPerSecond.toFixed(1)} draws/s; ${result.solvedDraws} re-optimised to a list)`,
    );
    results.push(result);
  }
  const generated = results[results.length - 1]!;
  let comparison = "previous release: not run (set BENCH_PREVIOUS_RELEASE to its built checkout)";
  if (previous !== undefined) {
    const before = (await previous(options)).at(-1)!;
    comparison = `previous release ${before.seconds.toFixed(1)} s, ${(before.seconds / generated.seconds).toFixed(1)}x faster (target >= ${UNCERTAINTY_TARGET_SPEEDUP}x)`;
  }
  console.log(`  generated run: ${generated.seconds.toFixed(1)} s (target <= ${UNCERTAINTY_TARGET_SECONDS} s on 2 threads); ${comparison}`);
  return results;
}
