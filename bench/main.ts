// `npm run bench`: builds, then runs every benchmark section and writes bench-results/*.json.
// Sections are plain async functions returning rows; add new ones beside runSolverBench.
import { mkdirSync, writeFileSync } from "node:fs";
import { formatSolverBench, runSolverBench } from "./solverBench.js";

const highsSeconds = Number(process.env.BENCH_HIGHS_SECONDS ?? 120);
const avertaSeconds = Number(process.env.BENCH_AVERTA_SECONDS ?? 120);

console.log(`Solver benchmark (HiGHS time limit ${highsSeconds} s, hard kill 30 s later; one process per solve)`);
const rows = await runSolverBench({
  highsSeconds,
  avertaSeconds,
  onRow: (row) => console.log(`  done: ${row.instance}`),
});
console.log(formatSolverBench(rows));
mkdirSync("bench-results", { recursive: true });
const machine = { node: process.version, cpus: (await import("node:os")).cpus().length, platform: process.platform };
writeFileSync("bench-results/solver.json", `${JSON.stringify({ machine, highsSeconds, rows }, null, 2)}\n`);
console.log("written: bench-results/solver.json");
