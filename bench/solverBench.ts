import { SOLVER_BENCH_INSTANCES } from "./benchInstances.js";
import { runInChild, type ChildResult } from "./runInChild.js";

/** One instance of the solver benchmark: averta's figures beside HiGHS's on the same programme. */
export interface SolverBenchRow {
  readonly instance: string;
  readonly sites: number;
  readonly rules: boolean;
  readonly averta: ChildResult;
  readonly highs: ChildResult;
  /** HiGHS seconds / averta seconds (how many times faster averta is). */
  readonly speedup: number;
  /** (averta objective - HiGHS objective) / max(1, |HiGHS objective|). */
  readonly objectiveDifference: number;
}

export interface SolverBenchOptions {
  /** HiGHS's own time limit; the process is killed 30 s after it. */
  readonly highsSeconds: number;
  readonly avertaSeconds: number;
  /** Called after each instance, e.g. to print progress. */
  readonly onRow?: (row: SolverBenchRow) => void;
}

/**
 * Runs every solver benchmark instance twice, once by averta (`solveProgramme`, engine auto)
 * and once by HiGHS alone (whole model, mip_rel_gap 0), each in its own process, one after the
 * other so they never compete for the cores.
 */
export async function runSolverBench(options: SolverBenchOptions): Promise<SolverBenchRow[]> {
  const rows: SolverBenchRow[] = [];
  for (const instance of SOLVER_BENCH_INSTANCES) {
    const averta = await runInChild({ solver: "averta", shape: instance.shape, timeLimitSeconds: options.avertaSeconds }, 30);
    const highs = await runInChild({ solver: "highs", shape: instance.shape, timeLimitSeconds: options.highsSeconds }, 30);
    const row: SolverBenchRow = {
      instance: instance.name,
      sites: instance.shape.sites,
      rules: instance.shape.rules,
      averta,
      highs,
      speedup: highs.seconds / averta.seconds,
      objectiveDifference: (averta.objective - highs.objective) / Math.max(1, Math.abs(highs.objective)),
    };
    options.onRow?.(row);
    rows.push(row);
  }
  return rows;
}

/** The rows as a plain-text table, one line per solver per instance. */
export function formatSolverBench(rows: readonly SolverBenchRow[]): string {
  const header = ["instance", "solver", "status", "seconds", "objective", "proven gap", "HiGHS s / averta s", "peak MB"];
  const lines: string[][] = [header];
  const number = (x: number, digits: number): string => (Number.isFinite(x) ? x.toFixed(digits) : "-");
  const gap = (x: number): string => (Number.isFinite(x) ? x.toExponential(1) : "-");
  for (const row of rows) {
    for (const [solver, result] of [["averta", row.averta], ["HiGHS", row.highs]] as const) {
      lines.push([
        row.instance,
        solver,
        result.status,
        number(result.seconds, 3),
        number(result.objective, 4),
        gap(result.gap),
        solver === "averta" ? number(row.speedup, 1) : "",
        number(result.peakMegabytes, 0),
      ]);
    }
  }
  const widths = header.map((_, c) => Math.max(...lines.map((line) => line[c]!.length)));
  return lines.map((line) => line.map((cell, c) => cell.padEnd(widths[c]!)).join("  ").trimEnd()).join("\n");
}
