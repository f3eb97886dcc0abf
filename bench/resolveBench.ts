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


/** Levels of the frontier workload (the `frontier` command with `--steps 49`). */
const FRONTIER_LEVELS = 50;

/** Target: the whole frontier within this many times one solve of the same scenario (prepare included in both). */
export const FRONTIER_TARGET_RATIO = 3;

/**
 * Times the re-solve workloads other commands run on one prepared programme: a 50-level budget
 * frontier at 20,000 sites from 0 to the cost of funding every site's best option (as `frontier`
 * sweeps), beside one solve of the same programme at its budget (prepared afresh, as `plan` does),
 * and 1,000 uncertainty draws (every value scaled by an independent factor in [0.5, 1.5), same
 * costs) at 5,000 sites.
 */
export async function runResolveBench(): Promise<ResolveBenchRow[]> {
  const rows: ResolveBenchRow[] = [];

  const frontierProgramme = generateBenchProgramme({ sites: 20_000, budgetShare: 0.3, rules: false, seed: 401 });
  let started = performance.now();
  const single = await prepareProgramme(frontierProgramme).solve();
  const oneSolve = (performance.now() - started) / 1000;
  rows.push({ workload: "one solve (prepare included), 20,000 sites", solves: 1, seconds: oneSolve, secondsPerSolve: oneSolve, allOptimal: single.status === "optimal" });

  const fullCost = frontierProgramme.groups.reduce((sum, group) => sum + Math.max(0, ...group.options.map((o) => o.cost)), 0);
  started = performance.now();
  const frontier = prepareProgramme(frontierProgramme);
  let allOptimal = true;
  for (let level = 0; level < FRONTIER_LEVELS; level += 1) {
    const solution = await frontier.solve({ budget: Math.round((fullCost * level) / (FRONTIER_LEVELS - 1)) });
    allOptimal &&= solution.status === "optimal";
  }
  let seconds = (performance.now() - started) / 1000;
  rows.push({
    workload: `frontier: ${FRONTIER_LEVELS} budgets, 20,000 sites (${(seconds / oneSolve).toFixed(1)}x one solve; target <= ${FRONTIER_TARGET_RATIO}x)`,
    solves: FRONTIER_LEVELS,
    seconds,
    secondsPerSolve: seconds / FRONTIER_LEVELS,
    allOptimal,
  });

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
