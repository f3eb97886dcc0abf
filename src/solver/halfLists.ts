import { NO_OPTION } from "./buildGroupHull.js";

/**
 * The core groups in two halves whose programme counts (products of choice counts) are as even as a
 * greedy split (largest first, each to the smaller half) improved by single moves and swaps gets
 * them: the larger half decides memory and time, and a plain greedy split can leave it twice the other.
 */
export function splitHalves(core: readonly number[], choices: readonly (readonly number[])[]): number[][] {
  const weight = (g: number): number => Math.log2(choices[g]!.length);
  const halves: number[][] = [[], []];
  const sums = [0, 0];
  for (const g of [...core].sort((x, y) => choices[y]!.length - choices[x]!.length || x - y)) {
    const h = sums[0]! <= sums[1]! ? 0 : 1;
    halves[h]!.push(g);
    sums[h] = sums[h]! + weight(g);
  }
  // Move or swap while that lowers the larger half (each step lowers it, so this ends).
  for (let improved = true; improved; ) {
    improved = false;
    const big = sums[0]! >= sums[1]! ? 0 : 1;
    const small = 1 - big;
    const diff = sums[big]! - sums[small]!;
    let bestGain = 1e-12;
    let move: [number, number] | undefined;
    halves[big]!.forEach((g, i) => {
      // Moving g (j = -1) or swapping it with halves[small][j] shifts d from the big half to the small one.
      for (let j = -1; j < halves[small]!.length; j += 1) {
        const d = weight(g) - (j < 0 ? 0 : weight(halves[small]![j]!));
        const gain = diff - Math.abs(diff - 2 * d);
        if (d > 0 && gain > bestGain) {
          bestGain = gain;
          move = [i, j];
        }
      }
    });
    if (move === undefined) break;
    const [i, j] = move;
    const g = halves[big]!.splice(i, 1)[0]!;
    if (j >= 0) halves[big]!.push(halves[small]!.splice(j, 1, g)[0]!);
    else halves[small]!.push(g);
    sums[big] = halves[big]!.reduce((t, x) => t + weight(x), 0);
    sums[small] = halves[small]!.reduce((t, x) => t + weight(x), 0);
    improved = true;
  }
  return halves;
}

export interface HalfList {
  readonly count: number;
  readonly values: Float64Array;
  /** uses[r][i]: programme i's use of row r. */
  readonly uses: readonly Float64Array[];
  /** Writes programme i's choices into a full choice vector. */
  decode(i: number, choice: (number | null)[]): void;
}

// Every programme of one half, built group by group: programme index i*n + c extends i with choice c.
export function listHalf(
  half: readonly number[],
  choices: readonly (readonly number[])[],
  rowCount: number,
  use: (g: number, a: number, r: number) => number,
  value: (g: number, a: number) => number,
): HalfList {
  let values = new Float64Array([0]);
  let uses = Array.from({ length: rowCount }, () => new Float64Array([0]));
  for (const g of half) {
    const allowed = choices[g]!;
    const n = allowed.length;
    const count = values.length * n;
    const nextValues = new Float64Array(count);
    const nextUses = uses.map(() => new Float64Array(count));
    for (let i = 0; i < values.length; i += 1) {
      for (let c = 0; c < n; c += 1) {
        nextValues[i * n + c] = values[i]! + value(g, allowed[c]!);
        for (let r = 0; r < rowCount; r += 1) nextUses[r]![i * n + c] = uses[r]![i]! + use(g, allowed[c]!, r);
      }
    }
    values = nextValues;
    uses = nextUses;
  }
  return {
    count: values.length,
    values,
    uses,
    decode(i, choice) {
      let rest = i;
      for (let h = half.length - 1; h >= 0; h -= 1) {
        const allowed = choices[half[h]!]!;
        const a = allowed[rest % allowed.length]!;
        choice[half[h]!] = a === NO_OPTION ? null : a;
        rest = Math.floor(rest / allowed.length);
      }
    },
  };
}
