import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { parseDocument } from "yaml";
import { InputError } from "../../src/io/InputError.js";
import { parseJsonForm } from "../../src/io/parseJsonForm.js";
import { loadScenario } from "../../src/io/loadScenario.js";
import { parseYamlText, readYamlFile } from "../../src/io/readYamlFile.js";
import { sitesJsonForm } from "../../src/report/sitesJsonForm.js";
import { sitesYaml } from "../../src/report/sitesYaml.js";

// Every leaf of a document, with its path.
function leaves(value: unknown, path: (string | number)[] = []): { path: (string | number)[]; value: unknown }[] {
  if (Array.isArray(value)) return value.flatMap((item, index) => leaves(item, [...path, index]));
  if (value !== null && typeof value === "object") return Object.entries(value).flatMap(([key, item]) => leaves(item, [...path, key]));
  return [{ path, value }];
}

function offsetOf(text: string, position: { line: number; column: number }): number {
  const lines = text.split("\n");
  return lines.slice(0, position.line - 1).reduce((sum, line) => sum + line.length + 1, 0) + position.column - 1;
}

function problemOf(run: () => unknown): InputError {
  try {
    run();
  } catch (error) {
    if (error instanceof InputError) return error;
    throw error;
  }
  throw new Error("no problem raised");
}

describe("YAML in its JSON form takes the fast path, with the YAML reader's answers", () => {
  const demo = readYamlFile("scenarios/demo.yaml").data;
  const text = `# A scenario written in JSON form\n\n${JSON.stringify(demo, null, 2)}\n`;

  it("reads the same data as the YAML library", () => {
    expect(parseJsonForm(text, "x.yaml", 100)).toBeDefined();
    expect(parseYamlText(text, "x.yaml").data).toEqual(parseDocument(text).toJS());
    expect(parseYamlText(text, "x.yaml").data).toEqual(demo);
  });

  it("places every value and key where it is written", () => {
    const source = parseYamlText(text, "x.yaml");
    for (const { path, value } of leaves(demo)) {
      const at = offsetOf(text, source.positionOf(path));
      expect(text.slice(at).startsWith(JSON.stringify(value)), path.join(".")).toBe(true);
      const last = path.at(-1);
      if (typeof last === "string") expect(text.slice(offsetOf(text, source.positionOf(path, true))).startsWith(JSON.stringify(last))).toBe(true);
    }
    // A path that is not there falls back to its nearest ancestor.
    expect(source.positionOf(["economics", "noSuchField"])).toEqual(source.positionOf(["economics"]));
  });

  it("refuses a repeated key, even one spelled with an escape, at the repeat", () => {
    const repeated = '{\n  "name": "a",\n  "n\\u0061me": "b"\n}\n';
    const problem = problemOf(() => parseYamlText(repeated, "r.yaml")).problems[0]!;
    expect(problem).toMatchObject({ code: "duplicate-key", line: 3, column: 3 });
    // The YAML library agrees that it is a repeated key.
    expect(parseDocument(repeated, { uniqueKeys: true }).errors.map((error) => error.code)).toContain("DUPLICATE_KEY");
  });

  it("refuses nesting deeper than the limit at the first level too deep", () => {
    const deep = `{"a": ${"[".repeat(150)}${"]".repeat(150)}}`;
    expect(problemOf(() => parseYamlText(deep, "d.yaml")).problems[0]).toMatchObject({ code: "too-deep", line: 1, column: 7 + 99 });
  });

  it("leaves anything that is not strict JSON to the YAML reader", () => {
    for (const yamlOnly of ['{"a": 1,}', '{a: 1}', '{"a": 1} # trailing comment', "name: x", '{"a": 0x1F}']) expect(parseJsonForm(yamlOnly, "y.yaml", 100)).toBeUndefined();
    expect(parseYamlText('{"a": 1} # trailing comment', "y.yaml").data).toEqual({ a: 1 });
  });

  it("keeps the key __proto__ as an ordinary key, as the YAML reader does", () => {
    const data = parseYamlText('{"__proto__": {"x": 1}, "constructor": 2}', "p.yaml").data as Record<string, unknown>;
    expect(Object.hasOwn(data, "__proto__")).toBe(true);
    expect(Object.getPrototypeOf(data)).toBe(Object.prototype);
  });
});

describe("tally's sites file in JSON form", () => {
  it("loads to the same sites as the block YAML form, through a scenario", () => {
    const { scenario } = loadScenario("scenarios/demo.yaml");
    const folder = mkdtempSync(join(tmpdir(), "averta-json-form-"));
    const header = readFileSync("scenarios/demo.yaml", "utf8").split("\nsites:")[0]!.replace(/^crashWindow:.*$/m, "").replace("../catalogs/demo-catalogue.yaml", resolve("catalogs/demo-catalogue.yaml"));
    const load = (name: string, content: string) => {
      writeFileSync(join(folder, `${name}-sites.yaml`), content);
      writeFileSync(join(folder, `${name}.yaml`), `${header}\nsites: ${name}-sites.yaml\n`);
      return loadScenario(join(folder, `${name}.yaml`)).scenario;
    };
    const fromJson = load("json", sitesJsonForm(scenario.sites, scenario.crashWindow, "test"));
    const fromYaml = load("yaml", sitesYaml(scenario.sites, scenario.crashWindow, "test"));
    expect(parseJsonForm(readFileSync(join(folder, "json-sites.yaml"), "utf8"), "j", 100)).toBeDefined();
    expect(fromJson.sites).toEqual(fromYaml.sites);
    expect(fromJson.crashWindow).toEqual(fromYaml.crashWindow);
  });
});
