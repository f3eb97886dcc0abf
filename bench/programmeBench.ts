import type { BenchYearProgrammeShape } from "./generateBenchYearProgramme.js";
import { runInChild, type ChildResult } from "./runInChild.js";

/** One multi-year instance with the targets it is held to. */
interface ProgrammeBenchInstance {
  readonly name: string;
  readonly shape: BenchYearProgrammeShape;
  readonly targetSeconds: number;
  /** Least HiGHS seconds / averta seconds; undefined where the target sets none. */
  readonly targetSpeedup?: number;
  readonly targetPeakMegabytes?: number;
}

/** The targets: 5,000 sites × 5 years with carry-over ≤ 10 s and ≥ 5× HiGHS; 20,000 × 5 ≤ 30 s and ≤ 2 GB. */
export const PROGRAMME_BENCH_INSTANCES: readonly ProgrammeBenchInstance[] = [
  { name: "programme 5,000x5 unspent", shape: { sites: 5_000, years: 5, carryOver: "unspent", seed: 501 }, targetSeconds: 10, targetSpeedup: 5 },
  { name: "programme 20,000x5 unspent", shape: { sites: 20_000, years: 5, carryOver: "unspent", seed: 2001 }, targetSeconds: 30, targetPeakMegabytes: 2048 },
];

export interface ProgrammeBenchRow {
  readonly instance: ProgrammeBenchInstance;
  readonly averta: ChildResult;
  readonly highs: ChildResult;
}

/** Each instance solved by averta (exact engine, auto) and by HiGHS alone at gap 0, each in its own process, in turn. */
export async function runProgrammeBench(avertaSeconds: number, highsSeconds: number): Promise<ProgrammeBenchRow[]> {
  const rows: ProgrammeBenchRow[] = [];
  for (const instance of PROGRAMME_BENCH_INSTANCES) {
    const averta = await runInChild({ solver: "averta", shape: instance.shape, timeLimitSeconds: avertaSeconds }, 30);
    const highs = await runInChild({ solver: "highs", shape: instance.shape, timeLimitSeconds: highsSeconds }, 30);
    rows.push({ instance, averta, highs });
  }
  return rows;
}

/** A verdict per target: `met`, or `missed` with the figure; a run that proved nothing misses the time target. */
export function formatProgrammeBench(rows: readonly ProgrammeBenchRow[]): string {
  const figure = (x: number, digits: number): string => (Number.isFinite(x) ? x.toFixed(digits) : "-");
  const gap = (x: number): string => (Number.isFinite(x) ? x.toExponential(1) : "-");
  const lines: string[] = [];
  for (const { instance, averta, highs } of rows) {
    lines.push(`  ${instance.name}`);
    for (const [solver, result] of [["averta", averta], ["HiGHS ", highs]] as const) {
      lines.push(`    ${solver}  ${result.status.padEnd(12)} ${figure(result.seconds, 2).padStart(8)} s  objective ${figure(result.objective, 4)}  gap ${gap(result.gap)}  peak ${figure(result.peakMegabytes, 0)} MB`);
    }
    const proven = averta.status === "optimal";
    const time = proven && averta.seconds <= instance.targetSeconds ? "met" : proven ? "missed" : "missed (not proven)";
    lines.push(`    target: proven optimal in ≤ ${instance.targetSeconds} s: ${time} (${figure(averta.seconds, 2)} s)`);
    if (instance.targetSpeedup !== undefined) {
      // HiGHS's time when it proves; else its time limit, a lower bound on its time.
      const speedup = highs.seconds / averta.seconds;
      const verdict = proven && speedup >= instance.targetSpeedup ? "met" : "missed";
      lines.push(`    target: ≥ ${instance.targetSpeedup}× faster than HiGHS: ${verdict} (${figure(speedup, 1)}×${highs.status === "optimal" ? "" : ", HiGHS unproven"})`);
    }
    if (instance.targetPeakMegabytes !== undefined) {
      const verdict = averta.peakMegabytes <= instance.targetPeakMegabytes ? "met" : "missed";
      lines.push(`    target: peak memory ≤ ${instance.targetPeakMegabytes} MB: ${verdict} (${figure(averta.peakMegabytes, 0)} MB)`);
    }
  }
  return lines.join("\n");
}
