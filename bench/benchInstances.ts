import type { BenchProgrammeShape } from "./generateBenchProgramme.js";

/** One benchmark instance: a name for the table and the seeded shape that regenerates it. */
export interface BenchInstance {
  readonly name: string;
  readonly shape: BenchProgrammeShape;
}

/** The solver benchmark's instances (the rows of the README's performance table). */
export const SOLVER_BENCH_INSTANCES: readonly BenchInstance[] = [
  { name: "single 1,000 b10", shape: { sites: 1_000, budgetShare: 0.1, rules: false, seed: 11 } },
  { name: "single 1,000 b30", shape: { sites: 1_000, budgetShare: 0.3, rules: false, seed: 12 } },
  { name: "single 5,000 b10", shape: { sites: 5_000, budgetShare: 0.1, rules: false, seed: 51 } },
  { name: "single 5,000 b30", shape: { sites: 5_000, budgetShare: 0.3, rules: false, seed: 52 } },
  { name: "single 20,000 b10", shape: { sites: 20_000, budgetShare: 0.1, rules: false, seed: 201 } },
  { name: "single 20,000 b30", shape: { sites: 20_000, budgetShare: 0.3, rules: false, seed: 202 } },
  { name: "single 20,000x6 b30", shape: { sites: 20_000, budgetShare: 0.3, rules: false, seed: 203, options: 6 } },
  { name: "rules 1,000 b30", shape: { sites: 1_000, budgetShare: 0.3, rules: true, seed: 13 } },
  { name: "rules 5,000 b30", shape: { sites: 5_000, budgetShare: 0.3, rules: true, seed: 53 } },
  { name: "rules 20,000 b30", shape: { sites: 20_000, budgetShare: 0.3, rules: true, seed: 204 } },
];
