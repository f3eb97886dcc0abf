/** A source of uniform random numbers: plain state behind two methods, deterministic given its seed. */
export interface RandomSource {
  /** Next 32-bit unsigned integer, uniform on 0 … 2^32 − 1. */
  nextUint32(): number;
  /** Next double uniform on [0, 1) with 53 random bits. */
  nextUnitFloat(): number;
}

// PCG's 64-bit LCG multiplier 6364136223846793005, as 32-bit halves.
const MULTIPLIER_HIGH = 0x5851f42d;
const MULTIPLIER_LOW = 0x4c957f2d;
const MASK_64 = (1n << 64n) - 1n;

/**
 * PCG32 (PCG-XSH-RR, 64-bit state, 32-bit output) seeded exactly as the reference
 * `pcg32_srandom_r(initState, initSeq)` of pcg-c-basic (M. E. O'Neill, "PCG: A Family of Simple
 * Fast Space-Efficient Statistically Good Algorithms for Random Number Generation", HMC-CS-2014-0905;
 * https://www.pcg-random.org). `initSeq` picks one of 2^63 streams. The 64-bit state is kept as two
 * 32-bit halves so each step costs a few integer multiplies and no BigInt.
 * Example: createPcg32(42n, 54n).nextUint32() === 0xa15c02b7 (the published demo output).
 */
export function createPcg32(initState: bigint, initSeq: bigint): RandomSource {
  const increment = ((BigInt.asUintN(64, initSeq) << 1n) | 1n) & MASK_64;
  const incHigh = Number(increment >> 32n);
  const incLow = Number(increment & 0xffffffffn);
  let high = 0;
  let low = 0;

  // state = state × MULTIPLIER + increment (mod 2^64), on 32-bit halves with 16-bit limbs for the low product.
  const advance = (): void => {
    const a0 = low & 0xffff;
    const a1 = low >>> 16;
    const b0 = MULTIPLIER_LOW & 0xffff;
    const b1 = MULTIPLIER_LOW >>> 16;
    const p00 = a0 * b0;
    const p01 = a0 * b1;
    const p10 = a1 * b0;
    const middle = (p00 >>> 16) + (p01 & 0xffff) + (p10 & 0xffff);
    const productLow = (((middle & 0xffff) << 16) | (p00 & 0xffff)) >>> 0;
    const productHigh = a1 * b1 + (p01 >>> 16) + (p10 >>> 16) + (middle >>> 16);
    const nextHigh = (productHigh + Math.imul(high, MULTIPLIER_LOW) + Math.imul(low, MULTIPLIER_HIGH)) >>> 0;
    const sumLow = productLow + incLow;
    low = sumLow >>> 0;
    high = (nextHigh + incHigh + (sumLow > 0xffffffff ? 1 : 0)) >>> 0;
  };

  const nextUint32 = (): number => {
    const oldHigh = high;
    const oldLow = low;
    advance();
    // xorshifted = ((old >> 18) ^ old) >> 27, low 32 bits; rot = old >> 59.
    const shiftedHigh = oldHigh ^ (oldHigh >>> 18);
    const shiftedLow = oldLow ^ ((oldLow >>> 18) | (oldHigh << 14));
    const xorshifted = ((shiftedLow >>> 27) | (shiftedHigh << 5)) >>> 0;
    const rotation = oldHigh >>> 27;
    return ((xorshifted >>> rotation) | (xorshifted << ((32 - rotation) & 31))) >>> 0;
  };

  nextUint32();
  const seeded = (BigInt(high) << 32n) + BigInt(low) + BigInt.asUintN(64, initState);
  high = Number((seeded >> 32n) & 0xffffffffn);
  low = Number(seeded & 0xffffffffn);
  nextUint32();

  return {
    nextUint32,
    // 27 + 26 bits, as in the reference genrand_res53 of Matsumoto and Nishimura's MT19937.
    nextUnitFloat: () => ((nextUint32() >>> 5) * 67108864 + (nextUint32() >>> 6)) / 9007199254740992,
  };
}
