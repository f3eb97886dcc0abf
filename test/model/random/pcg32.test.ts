import { describe, expect, it } from "vitest";
import { createPcg32 } from "../../../src/model/random/pcg32.js";
import { drawRandomSource } from "../../../src/model/random/drawRandomSource.js";

// A straight port of the paper's pcg32_random_r / pcg32_srandom_r with BigInt, as an
// independent second implementation (O'Neill 2014, HMC-CS-2014-0905, section 6.3.1; pcg-c-basic).
function referencePcg32(initState: bigint, initSeq: bigint): () => number {
  const mask = (1n << 64n) - 1n;
  const multiplier = 6364136223846793005n;
  let state = 0n;
  const increment = ((initSeq << 1n) | 1n) & mask;
  const next = (): number => {
    const old = state;
    state = (old * multiplier + increment) & mask;
    const xorshifted = Number((((old >> 18n) ^ old) >> 27n) & 0xffffffffn);
    const rotation = Number(old >> 59n);
    return ((xorshifted >>> rotation) | (xorshifted << ((32 - rotation) & 31))) >>> 0;
  };
  next();
  state = (state + initState) & mask;
  next();
  return next;
}

describe("createPcg32", () => {
  it("reproduces the published pcg32 demo vector for state 42, stream 54", () => {
    // Source: pcg-c-basic pcg32-demo output, "Round 1: 32bit:" line, https://www.pcg-random.org/using-pcg-c-basic.html
    const random = createPcg32(42n, 54n);
    const outputs = Array.from({ length: 6 }, () => random.nextUint32());
    expect(outputs).toEqual([0xa15c02b7, 0x7b47f409, 0xba1d3330, 0x83d2f293, 0xbfa4784b, 0xcbed606e]);
  });

  it("matches a BigInt port of the reference algorithm over many seeds and streams", () => {
    let compared = 0;
    for (const [state, seq] of [[0n, 0n], [1n, 1n], [0xffffffffffffffffn, 7n], [123456789012345n, 987654321n], [2027n << 32n, 2027n]] as const) {
      const fast = createPcg32(state, seq);
      const slow = referencePcg32(state, seq);
      for (let i = 0; i < 2000; i += 1) {
        expect(fast.nextUint32()).toBe(slow());
        compared += 1;
      }
    }
    expect(compared).toBe(10_000);
  });

  it("gives unit floats in [0, 1) whose mean and variance are those of U(0, 1) (1/2 and 1/12)", () => {
    const random = createPcg32(7n, 3n);
    const n = 100_000;
    let sum = 0;
    let sumSquares = 0;
    let outside = 0;
    for (let i = 0; i < n; i += 1) {
      const u = random.nextUnitFloat();
      if (!(u >= 0 && u < 1)) outside += 1;
      sum += u;
      sumSquares += u * u;
    }
    const mean = sum / n;
    const variance = sumSquares / n - mean * mean;
    expect(outside).toBe(0);
    // 5 standard errors: sd of the mean is sqrt(1/12/n) = 0.00091.
    expect(Math.abs(mean - 0.5)).toBeLessThan(5 * Math.sqrt(1 / 12 / n));
    expect(Math.abs(variance - 1 / 12)).toBeLessThan(0.002);
  });
});

describe("drawRandomSource", () => {
  it("depends only on (seed, draw index)", () => {
    const a = drawRandomSource(2027, 5);
    const b = drawRandomSource(2027, 5);
    const c = drawRandomSource(2027, 6);
    const d = drawRandomSource(2028, 5);
    const first = [a.nextUint32(), a.nextUint32()];
    expect([b.nextUint32(), b.nextUint32()]).toEqual(first);
    expect([c.nextUint32(), c.nextUint32()]).not.toEqual(first);
    expect([d.nextUint32(), d.nextUint32()]).not.toEqual(first);
  });

  it("rejects seeds outside 32 bits", () => {
    expect(() => drawRandomSource(-1, 0)).toThrow(RangeError);
    expect(() => drawRandomSource(2 ** 32, 0)).toThrow(RangeError);
  });
});
