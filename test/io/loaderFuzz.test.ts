import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import fc from "fast-check";
import { stringify } from "yaml";
import { afterAll, describe, expect, it } from "vitest";
import { preparePlan } from "../../src/analysis/preparePlan.js";
import { InputError } from "../../src/io/InputError.js";
import { loadScenario } from "../../src/io/loadScenario.js";

const RUNS = 1000;
const scratch = mkdtempSync(join(tmpdir(), "averta-fuzz-"));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

// The demo cut to its first five sites (loading all 51 takes about 0.1 s, too slow for 1,000 runs),
// its never-fund rule moved to a site that remains, and its catalogue given as an absolute path so
// copies load from the scratch folder.
const DEMO_FULL = readFileSync("scenarios/demo.yaml", "utf8")
  .replace("../catalogs/demo-catalogue.yaml", resolve("catalogs/demo-catalogue.yaml"))
  .replace("    - site: S-05", "    - site: I-05");
const DEMO = DEMO_FULL.slice(0, DEMO_FULL.indexOf("  - id: I-06"));
const DEMO_LINES = DEMO.split("\n");

let written = 0;
/** Loads `text` as a scenario; returns "ok", or the InputError's code; anything else thrown fails the test. */
function outcome(text: string | Uint8Array): string {
  const file = join(scratch, `case-${++written}.yaml`);
  writeFileSync(file, text);
  try {
    const loaded = loadScenario(file);
    preparePlan(loaded.scenario); // what the loader accepts, the model must be able to use
    return "ok";
  } catch (error) {
    if (error instanceof InputError) {
      expect(error.problems.length).toBeGreaterThan(0);
      for (const problem of error.problems) expect(problem.message).not.toBe("");
      return error.code;
    }
    throw error;
  } finally {
    rmSync(file, { force: true });
  }
}

/** One edit to a line of the demo: delete, duplicate, swap with the next, replace text, insert noise, or retype a value. */
const mutation = fc.record({
  line: fc.nat(DEMO_LINES.length - 1),
  kind: fc.constantFrom("delete", "duplicate", "swap", "truncate", "insert", "value", "indent"),
  text: fc.oneof(
    fc.string({ maxLength: 12 }),
    fc.constantFrom("-1", ".inf", ".nan", "~", "[]", "{}", "&a x", "*a", "\t", "'", '"', "---", ": :", "0x1F", "1e400", "-0", "9999999999999999999", "!!binary AAAA", "? x"),
  ),
  position: fc.nat(80),
});

function mutate(edits: readonly { line: number; kind: string; text: string; position: number }[]): string {
  const lines = [...DEMO_LINES];
  for (const { line, kind, text, position } of edits) {
    const at = line % lines.length;
    const current = lines[at] ?? "";
    if (kind === "delete") lines.splice(at, 1);
    else if (kind === "duplicate") lines.splice(at, 0, current);
    else if (kind === "swap" && at + 1 < lines.length) [lines[at], lines[at + 1]] = [lines[at + 1]!, current];
    else if (kind === "truncate") lines[at] = current.slice(0, position % (current.length + 1));
    else if (kind === "insert") lines[at] = current.slice(0, position) + text + current.slice(position);
    else if (kind === "value") lines[at] = current.includes(": ") ? current.slice(0, current.indexOf(": ") + 2) + text : current + text;
    else if (kind === "indent") lines[at] = " ".repeat(position % 5) + current.trimStart();
  }
  return lines.join("\n");
}

describe("the loader throws only InputError (fast-check)", () => {
  it("starts from a demo excerpt that loads", () => {
    expect(outcome(DEMO)).toBe("ok");
  });

  it(`on ${RUNS} random mutations of the demo scenario`, () => {
    const codes = new Map<string, number>();
    fc.assert(
      fc.property(fc.array(mutation, { minLength: 1, maxLength: 3 }), (edits) => {
        const code = outcome(mutate(edits));
        codes.set(code, (codes.get(code) ?? 0) + 1);
      }),
      { numRuns: RUNS, seed: 4242 },
    );
    // Mutations must both break the file in several ways and sometimes leave it loadable.
    expect(codes.get("ok") ?? 0).toBeGreaterThan(0);
    expect(codes.size).toBeGreaterThan(4);
  });

  it(`on ${RUNS} random YAML documents built from records, lists and odd scalars`, () => {
    const scalar = fc.oneof(fc.string({ maxLength: 8 }), fc.integer(), fc.double(), fc.boolean(), fc.constant(null), fc.constantFrom("4.5M", "750k", "-1", "intersection", "leading-pedestrian-interval"));
    const { tree } = fc.letrec((tie) => ({
      tree: fc.oneof({ depthSize: "small" }, scalar, fc.array(tie("tree"), { maxLength: 3 }), fc.dictionary(fc.constantFrom("name", "id", "sites", "budget", "kind", "crashes", "candidates", "catalogues", "x"), tie("tree"), { maxKeys: 4 })),
    }));
    // Top-level records that look like scenarios, so the checks beyond the first schema error run too.
    const scenarioLike = fc.record(
      {
        name: fc.oneof(fc.constant("Random"), scalar),
        catalogues: fc.constant([resolve("catalogs/demo-catalogue.yaml")]),
        currency: fc.constantFrom("USD", "USD", "usd"),
        budget: fc.oneof(fc.constantFrom("4.5M", "750k", 120000), scalar),
        crashWindow: fc.record({ firstYear: fc.integer({ min: 1940, max: 2110 }), lastYear: fc.integer({ min: 1940, max: 2110 }) }),
        economics: fc.constant({ discountRate: 0.04, horizonYears: 20, crashCosts: { K: 1, A: 1, B: 1, C: 1, O: 1, source: "x" } }),
        sites: fc.array(fc.record({ id: fc.constantFrom("a", "b", "c", "a b"), name: fc.constant("n"), kind: fc.constantFrom("intersection", "segment"), district: fc.constant("d"), crashes: fc.constant({ pedestrian: { A: 1 } }), candidates: fc.array(fc.constantFrom("leading-pedestrian-interval", "road-diet", "nope"), { maxLength: 2 }) }, { requiredKeys: ["id", "kind", "candidates"] }), { maxLength: 3 }),
      },
      { requiredKeys: ["name", "catalogues", "currency", "budget", "crashWindow", "economics", "sites"] },
    );
    const codes = new Map<string, number>();
    fc.assert(
      fc.property(fc.oneof(tree, scenarioLike), (value) => {
        const code = outcome(stringify(value));
        codes.set(code, (codes.get(code) ?? 0) + 1);
      }),
      { numRuns: RUNS, seed: 777 },
    );
    expect(codes.size).toBeGreaterThan(2);
  });

  it(`on ${RUNS} random byte strings`, () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 200 }), (bytes) => {
        outcome(bytes);
      }),
      { numRuns: RUNS, seed: 99 },
    );
  });
});
