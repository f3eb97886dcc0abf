// `npm run bench`: builds, then runs every benchmark section and writes bench-results/*.json.
// Sections are plain async functions returning rows; add new ones beside these.
import { mkdirSync, writeFileSync } from "node:fs";
import { cpus } from "node:os";
import { planBench } from "./planBench.js";
import { formatProgrammeBench, runProgrammeBench } from "./programmeBench.js";
import { formatProgrammeCrossCheck, runProgrammeCrossCheck } from "./programmeCrossCheck.js";
import { formatCrossCheck, runCrossCheck } from "./crossCheckBench.js";
import { formatResolveBench, runResolveBench } from "./resolveBench.js";
import { formatSolverBench, runSolverBench } from "./solverBench.js";
import { tallyBench } from "./tallyBench.js";
import { uncertaintyBench } from "./uncertaintyBench.js";

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

console.log(`\nMulti-year programmes (averta and HiGHS at gap 0, time limits ${avertaSeconds} s and ${highsSeconds} s)`);
const programmes = await runProgrammeBench(avertaSeconds, highsSeconds);
console.log(formatProgrammeBench(programmes));

writeFileSync("bench-results/solver.json", `${JSON.stringify({ machine, highsSeconds, rows, resolves, programmes }, null, 2)}\n`);
console.log("\nwritten: bench-results/solver.json");

console.log("\nPlan at scale: YAML in, table or JSON out");
const plan = planBench();
for (const form of plan) console.log(form.summary);

// Tally before uncertainty: its peak memory is read from this process's maximum resident size.
console.log("\nCrash assignment (tally): generated crashes against generated sites");
const tally = tallyBench();
console.log(tally.summary);

console.log("\nUncertainty: draws with re-optimisation in each (plan included, sensitivity excluded)");
// The previous release's checkout, built (npm run build there), for the figures beside the targets.
const previousRelease = process.env.BENCH_PREVIOUS_RELEASE;
const previousUncertainty =
  previousRelease === undefined ? undefined : ((await import(`${previousRelease}/dist/bench/uncertaintyBench.js`)) as typeof import("./uncertaintyBench.js")).uncertaintyBench;
const uncertainty = await uncertaintyBench({}, previousUncertainty);

writeFileSync("bench-results/pipeline.json", `${JSON.stringify({ machine, plan, tally, uncertainty }, null, 2)}\n`);
console.log("\nwritten: bench-results/pipeline.json");

// Last, so its memory does not count in the peaks measured above. Every scenario is solved by averta and by an
// independent model built from its rules; the target for each count is 0.
const crossCheckCases = Number(process.env.BENCH_CROSS_CHECK_CASES ?? 300);
console.log(`\nCross-check of plans with policy rules against an independent HiGHS model (${crossCheckCases} seeded scenarios)`);
const crossCheck = await runCrossCheck(1, crossCheckCases);
console.log(formatCrossCheck(crossCheck.summary));
for (const failure of crossCheck.failures) console.log(`  to look at: ${JSON.stringify(failure)}`);
writeFileSync("bench-results/crosscheck.json", `${JSON.stringify({ machine, ...crossCheck }, null, 2)}\n`);
console.log("written: bench-results/crosscheck.json");

const programmeCases = Number(process.env.BENCH_PROGRAMME_CROSS_CHECK_CASES ?? 50);
console.log(`\nCross-check of multi-year programmes against an independent HiGHS model at gap 0 (${programmeCases} seeded programmes)`);
const programmeCheck = await runProgrammeCrossCheck(1, programmeCases, 120);
console.log(formatProgrammeCrossCheck(programmeCheck.summary));
for (const failure of programmeCheck.failures) console.log(`  to look at: seed ${failure.seed}`);
writeFileSync("bench-results/programme-crosscheck.json", `${JSON.stringify({ machine, summary: programmeCheck.summary, failures: programmeCheck.failures }, null, 2)}\n`);
console.log("written: bench-results/programme-crosscheck.json");
