import { describe, expect, it } from "vitest";
import { jsonChunks } from "../../src/report/jsonChunks.js";
import { seededRandom } from "../solver/randomProgramme.js";

// Reference: JSON.stringify(value, null, 2), the runtime's own serialiser (ECMA-262, JSON.stringify).

function randomValue(random: () => number, depth: number): unknown {
  const pick = random();
  if (depth > 3 || pick < 0.35) {
    const leaves: unknown[] = [null, true, false, 0, -1.5e-7, 1e21, Number.NaN, Infinity, "", "text with \"quotes\", a line\nbreak and ünïcode", undefined, new Date(0)];
    return leaves[Math.floor(random() * leaves.length)];
  }
  const size = depth < 2 && random() < 0.3 ? 65 + Math.floor(random() * 80) : Math.floor(random() * 5);
  if (pick < 0.65) return Array.from({ length: size }, () => randomValue(random, depth + 1));
  return Object.fromEntries(Array.from({ length: size }, (_, i) => [random() < 0.2 ? String(i) : `key ${i}`, randomValue(random, depth + 1)]));
}

describe("jsonChunks", () => {
  it("joins to exactly what JSON.stringify(value, null, 2) writes, on 200 random nested values", () => {
    const random = seededRandom(77);
    let split = 0;
    for (let n = 0; n < 200; n += 1) {
      const value = randomValue(random, 0);
      if (value === undefined) continue; // JSON.stringify gives no text at all for it
      const chunks = [...jsonChunks(value)];
      expect(chunks.join(""), `value ${n}`).toBe(JSON.stringify(value, null, 2));
      if (chunks.length > 1) split += 1;
    }
    // Large values must really come in pieces.
    expect(split).toBeGreaterThan(20);
  });

  it("writes a list of 20,000 entries one entry at a time", () => {
    const value = { name: "plan", selected: Array.from({ length: 20_000 }, (_, i) => ({ site: `S-${i}`, cost: i * 1000, nested: { list: [1, 2, 3] } })) };
    const chunks = [...jsonChunks(value)];
    expect(chunks.join("")).toBe(JSON.stringify(value, null, 2));
    expect(Math.max(...chunks.map((c) => c.length))).toBeLessThan(200);
  });
});
