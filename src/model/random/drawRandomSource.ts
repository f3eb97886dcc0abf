import { createPcg32, type RandomSource } from "./pcg32.js";

/**
 * The random source for one uncertainty draw, derived from the run's seed and the draw's index
 * alone, so a draw gives the same numbers however the draws are split between threads.
 * PCG32 seeded with state = seed × 2^32 + drawIndex on stream `drawIndex`: distinct draws get
 * distinct starting states and distinct streams.
 */
export function drawRandomSource(seed: number, drawIndex: number): RandomSource {
  if (!Number.isInteger(seed) || seed < 0 || seed > 0xffffffff) throw new RangeError(`seed must be a whole number from 0 to 4294967295, got ${seed}`);
  if (!Number.isInteger(drawIndex) || drawIndex < 0) throw new RangeError(`draw index must be a whole number >= 0, got ${drawIndex}`);
  return createPcg32((BigInt(seed) << 32n) | BigInt(drawIndex), BigInt(drawIndex));
}
