import { prepareProgramme } from "../src/solver/prepareProgramme.js";
import { generateBenchProgramme } from "./generateBenchProgramme.js";
import { seededRandom as mulberry32 } from "../scripts/seededRandom.js";

/** One re-solve workload: how many solves, how long in all, and whether each was proven optimal. */
export interface ResolveBenchRow {
  readonly workload: string;
  readonly solves: number;
  readonly seconds: number;
  readonly secondsPerSolve: number;
  readonly allOptimal: boolean;
}


/**
 * Times the re-solve workloads other commands run on one prepared programme: a 40-level budget
 * frontier at 20,000 sites, and 1,000 uncertainty draws (every value scaled by an independent
 * factor in [0.5, 1.5), same costs) at 5,000 sites.
 */
export async function runResolveBench(): Promise<ResolveBenchRow[]> {
  const rows: ResolveBenchRow[] = [];

  const frontierProgramme = generateBenchProgramme({ sites: 20_000, budgetShare: 0.3, rules: false, seed: 401 });
  const frontier = prepareProgramme(frontierProgramme);
  let started = performance.now();
  let allOptimal = true;
  for (let level = 1; level <= 40; level += 1) {
    const solution = await frontier.solve({ budget: (frontierProgramme.budget * level) / 20 });
    allOptimal &&= solution.status === "optimal";
  }
  let seconds = (performance.now() - started) / 1000;
  rows.push({ workload: "frontier: 40 budgets, 20,000 sites", solves: 40, seconds, secondsPerSolve: seconds / 40, allOptimal });

  const drawProgramme = generateBenchProgramme({ sites: 5_000, budgetShare: 0.3, rules: false, seed: 402 });
  const draws = prepareProgramme(drawProgramme);
  const random = mulberry32(403);
  started = performance.now();
  allOptimal = true;
  for (let draw = 0; draw < 1_000; draw += 1) {
    const values = drawProgramme.groups.map((g) => g.options.map((o) => o.value * (0.5 + random())));
    const solution = await draws.solve({ values });
    allOptimal &&= solution.status === "optimal";
  }
  seconds = (performance.now() - started) / 1000;
  rows.push({ workload: "uncertainty: 1,000 draws, 5,000 sites", solves: 1_000, seconds, secondsPerSolve: seconds / 1_000, allOptimal });
  return rows;
}

/** The rows as a plain-text table. */
export function formatResolveBench(rows: readonly ResolveBenchRow[]): string {
  const header = ["workload", "solves", "seconds", "s per solve", "all optimal"];
  const lines = [header, ...rows.map((r) => [r.workload, String(r.solves), r.seconds.toFixed(2), r.secondsPerSolve.toFixed(4), r.allOptimal ? "yes" : "NO"])];
  const widths = header.map((_, c) => Math.max(...lines.map((line) => line[c]!.length)));
  return lines.map((line) => line.map((cell, c) => cell.padEnd(widths[c]!)).join("  ").trimEnd()).join("\n");
}
