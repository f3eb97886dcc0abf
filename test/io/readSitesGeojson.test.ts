import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { InputError } from "../../src/io/InputError.js";
import { readCrashMapping } from "../../src/io/readCrashMapping.js";
import { readSitesGeojson } from "../../src/io/readSitesGeojson.js";

const folder = mkdtempSync(join(tmpdir(), "averta-geo-"));
const write = (name: string, text: string) => {
  const file = join(folder, name);
  writeFileSync(file, text);
  return file;
};
const problemsOf = (action: () => unknown) => {
  try {
    action();
  } catch (error) {
    if (error instanceof InputError) return error.problems;
    throw error;
  }
  throw new Error("expected an InputError");
};

describe("readSitesGeojson (RFC 7946 FeatureCollection)", () => {
  it("reads Points as intersections and (Multi)LineStrings as segments or corridors", () => {
    const file = write(
      "ok.geojson",
      JSON.stringify({
        type: "FeatureCollection",
        features: [
          { type: "Feature", properties: { id: "I-1", district: "N", aadt: 9000, candidates: ["a"] }, geometry: { type: "Point", coordinates: [10.4, 55.4] } },
          { type: "Feature", properties: { id: 7, name: "Ring", kind: "corridor", district: "N", tags: ["x"] }, geometry: { type: "MultiLineString", coordinates: [[[10.4, 55.4], [10.41, 55.4]], [[10.41, 55.4], [10.42, 55.41]]] } },
        ],
      }),
    );
    const sites = readSitesGeojson(file);
    expect(sites.map((s) => [s.id, s.kind, s.paths.length, s.name])).toEqual([["I-1", "intersection", 1, "I-1"], ["7", "corridor", 2, "Ring"]]);
    expect(sites[0]!.aadt).toBe(9000);
  });
  it("reports every bad feature with its line and field path", () => {
    const text = [
      "{",
      '  "type": "FeatureCollection",',
      '  "features": [',
      '    { "type": "Feature", "properties": { "id": "S-1", "district": "N", "kind": "intersection" }, "geometry": { "type": "LineString", "coordinates": [[10.4, 55.4], [10.5, 55.4]] } },',
      '    { "type": "Feature", "properties": { "id": "S-2", "district": "N" }, "geometry": { "type": "LineString", "coordinates": [[10.4, 55.4]] } },',
      '    { "type": "Feature", "properties": { "id": "S-1", "district": "N", "aadt": "lots" }, "geometry": { "type": "Point", "coordinates": [200, 55] } }',
      "  ]",
      "}",
    ].join("\n");
    const problems = problemsOf(() => readSitesGeojson(write("bad.geojson", text)));
    expect(problems.map((p) => [p.line, p.path])).toEqual([
      [4, "features[0].geometry"],
      [5, "features[1].geometry"],
      [6, "features[2].properties.id"],
      [6, "features[2].geometry"],
    ]);
  });
});

describe("readCrashMapping", () => {
  it("reads columns and agency codes", () => {
    const mapping = readCrashMapping(write("m.yaml", 'columns: { latitude: LAT }\nseverity: { "1": K, "5": o }\ntype: { PED: pedestrian }\n'));
    expect(mapping.columns.latitude).toBe("LAT");
    expect(mapping.columns.id).toBe("id");
    expect(mapping.severity).toEqual({ "1": "K", "5": "O" });
    expect(mapping.type).toEqual({ PED: "pedestrian" });
  });
  it("points at a code mapped to something that is not KABCO, and at an unknown field", () => {
    const problems = problemsOf(() => readCrashMapping(write("bad.yaml", "columns:\n  lattitude: LAT\nseverity:\n  '9': X\n")));
    expect(problems.map((p) => [p.code, p.line])).toEqual([["mapping", 2], ["mapping", 4]]);
  });
});

describe("readSitesGeojson takes JSON numbers only", () => {
  const feature = (coordinates: string) => `{\n  "type": "FeatureCollection",\n  "features": [\n    { "type": "Feature", "properties": { "id": "I-1", "district": "N", "name": "0x1F \\" Main" },\n      "geometry": { "type": "Point", "coordinates": ${coordinates} } }\n  ]\n}\n`;
  it("refuses hexadecimal, octal, leading-zero and infinite coordinates at their line and column", () => {
    for (const [coordinates, token] of [["[0x1F, 55.4]", "0x1F"], ["[10.4, 0o17]", "0o17"], ["[010.4, 55.4]", "010.4"], ["[.inf, 55.4]", ".inf"], ["[+10.4, 55.4]", "+10.4"], ["[10.4, 55.]", "55."]] as const) {
      const text = feature(coordinates);
      const problems = problemsOf(() => readSitesGeojson(write("hex.geojson", text)));
      // Numbers in base 16 or 8 are refused by the YAML reader itself (code not-decimal), the rest by the GeoJSON checks.
      expect(problems[0], coordinates).toMatchObject({ code: /^0[xo]/.test(token) ? "not-decimal" : "geojson", line: 5, column: text.split("\n")[4]!.indexOf(token) + 1 });
    }
  });
  it("reads decimal and exponent coordinates, and text that only looks like a number", () => {
    const sites = readSitesGeojson(write("ok-numbers.geojson", feature("[1.04e1, -0.5e-0]")));
    expect(sites[0]!.paths[0]![0]).toEqual({ lon: 10.4, lat: -0.5 });
    expect(sites[0]!.name).toBe('0x1F " Main');
  });
});

describe("site maps and mappings with CR or mixed line ends", () => {
  it("reads a GeoJSON whose lines end in CR, CRLF or LF alike, and locates problems on the editor's line", () => {
    const lines = ["{", '  "type": "FeatureCollection",', '  "features": [', '    { "type": "Feature", "properties": { "id": "I-1", "district": "N" }, "geometry": { "type": "Point", "coordinates": [10.4,', "      55.4] } },", '    { "type": "Feature", "properties": { "id": "I-2" }, "geometry": { "type": "Point", "coordinates": [10.5, 55.5] } }', "  ]", "}"];
    for (const end of ["\n", "\r\n", "\r"]) {
      const problems = problemsOf(() => readSitesGeojson(write("cr.geojson", lines.join(end))));
      expect(problems.map((p) => [p.code, p.line, p.path])).toEqual([["geojson", 6, "features[1].properties.district"]]);
      const fixed = lines.map((line) => line.replace('{ "id": "I-2" }', '{ "id": "I-2", "district": "S" }'));
      expect(readSitesGeojson(write("cr-ok.geojson", fixed.join(end))).map((site) => site.paths[0]![0])).toEqual([{ lon: 10.4, lat: 55.4 }, { lon: 10.5, lat: 55.5 }]);
      const hex = fixed.map((line) => line.replace("[10.5, 55.5]", "[0x1F, 55.5]"));
      expect(problemsOf(() => readSitesGeojson(write("cr-hex.geojson", hex.join(end))))[0]).toMatchObject({ line: 6 });
    }
  });
  it("reads a mapping with CR line ends and points at the right line", () => {
    const problems = problemsOf(() => readCrashMapping(write("cr.yaml", "columns:\r  latitude: LAT\rseverity:\r  '9': X\r")));
    expect(problems.map((p) => [p.code, p.line])).toEqual([["mapping", 4]]);
  });
});
