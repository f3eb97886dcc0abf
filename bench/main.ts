// `npm run bench`: builds, then runs every benchmark section and writes bench-results/*.json.
// Sections are plain async functions returning rows; add new ones beside these.
import { mkdirSync, writeFileSync } from "node:fs";
import { cpus } from "node:os";
import { formatResolveBench, runResolveBench } from "./resolveBench.js";
import { formatSolverBench, runSolverBench } from "./solverBench.js";

const highsSeconds = Number(process.env.BENCH_HIGHS_SECONDS ?? 120);
const avertaSeconds = Number(process.env.BENCH_AVERTA_SECONDS ?? 120);
const machine = { node: process.version, cpus: cpus().length, cpu: cpus()[0]?.model ?? "unknown", platform: process.platform };
mkdirSync("bench-results", { recursive: true });

console.log(`Solver benchmark (HiGHS time limit ${highsSeconds} s, hard kill 30 s later; one process per solve)`);
const rows = await runSolverBench({ highsSeconds, avertaSeconds, onRow: (row) => console.log(`  done: ${row.instance}`) });
console.log(formatSolverBench(rows));

console.log("\nRe-solves on one prepared programme (exact engine, in this process)");
const resolves = await runResolveBench();
console.log(formatResolveBench(resolves));

writeFileSync("bench-results/solver.json", `${JSON.stringify({ machine, highsSeconds, rows, resolves }, null, 2)}\n`);
console.log("\nwritten: bench-results/solver.json");
