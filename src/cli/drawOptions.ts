import { availableParallelism } from "node:os";
import type { Command } from "commander";
import { parseIntegerOption } from "./parseOptionValues.js";

/** Draws and seed used when none are given: same seed, same output, on any machine. */
export const DEFAULT_DRAWS = 1000;
export const DEFAULT_SEED = 2027;

/** The Monte Carlo options as commander hands them over (text). */
export interface DrawOptionText {
  draws: string;
  seed: string;
  threads?: string;
}

/** The Monte Carlo options, checked. */
export interface DrawOptions {
  readonly draws: number;
  readonly seed: number;
  readonly threads: number;
}

/**
 * Adds `--draws`, `--seed` and `--threads` (the options every command that runs uncertainty draws
 * shares, with one set of names and defaults) to `command`.
 */
export function addDrawOptions(command: Command, drawsHelp: string): Command {
  return command
    .option("-n, --draws <count>", drawsHelp, String(DEFAULT_DRAWS))
    .option("-s, --seed <seed>", "random seed, a whole number from 0 to 4294967295", String(DEFAULT_SEED))
    .option("-t, --threads <count>", "threads to spread the draws over (the result does not depend on it)");
}

/** Checks the options `addDrawOptions` added; `minDraws` is 0 where no draws means "skip". */
export function parseDrawOptions(text: DrawOptionText, minDraws: 0 | 1): DrawOptions {
  return {
    draws: parseIntegerOption("--draws", text.draws, minDraws, 1_000_000),
    seed: parseIntegerOption("--seed", text.seed, 0, 0xffffffff),
    // Threads only change the speed; the machine's parallelism is a sensible default.
    threads: text.threads === undefined ? Math.min(availableParallelism(), 64) : parseIntegerOption("--threads", text.threads, 1, 64),
  };
}
