import type { SolveOptions } from "../../solver/index.js";

/** What every uncertainty draw needs besides the prepared plan; plain data, so it crosses to worker threads. */
export interface DrawSettings {
  /** Seed of the whole run; each draw derives its own stream from (seed, draw index). */
  readonly seed: number;
  /** Draw each site's baseline from its posterior (false: hold baselines at their point estimates). */
  readonly sampleBaselines: boolean;
  readonly budget: number;
  readonly solveOptions: Partial<SolveOptions>;
}
