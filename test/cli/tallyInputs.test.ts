import { existsSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { parse } from "yaml";
import { runCaptured } from "./captureIo.js";

const folder = mkdtempSync(join(tmpdir(), "averta-tally-inputs-"));
const write = (name: string, text: string) => {
  const file = join(folder, name);
  writeFileSync(file, text);
  return file;
};
const SITES = write(
  "sites.geojson",
  JSON.stringify({
    type: "FeatureCollection",
    features: [
      { type: "Feature", properties: { id: "I-1", district: "North" }, geometry: { type: "Point", coordinates: [10.4, 55.4] } },
      { type: "Feature", properties: { id: "S-1", district: "South" }, geometry: { type: "LineString", coordinates: [[10.41, 55.4], [10.42, 55.4]] } },
    ],
  }),
);
const HEADER = "id,date,latitude,longitude,severity,type";
/** `perYear` crash rows at I-1 in each year from 2021 to 2025. */
const goodRows = (perYear: number, format = (year: number, k: number) => `${year}-0${1 + (k % 9)}-1${k % 10}`, separator = ",") => {
  const rows: string[] = [];
  for (let year = 2021; year <= 2025; year++) for (let k = 0; k < perYear; k++) rows.push([`c${year}-${k}`, format(year, k), "55.4", "10.4", "B", "angle"].join(separator));
  return rows;
};
let runs = 0;
/** Runs tally on crash text and returns the exit code, messages and what was written. */
async function tally(crashText: string, ...extra: string[]) {
  const crashes = write(`crashes-${++runs}.csv`, crashText);
  const out = join(folder, `sites-${runs}.yaml`);
  const result = await runCaptured(["tally", "--crashes", crashes, "--sites", SITES, "--out", out, ...extra]);
  // No stack trace, whatever happened.
  expect(result.stderr).not.toMatch(/^\s+at /m);
  const written = existsSync(out);
  expect(existsSync(`${out}.quality.txt`)).toBe(written);
  return { ...result, crashes, written, yaml: written ? (parse(readFileSync(out, "utf8")) as { crashWindow: unknown; sites: { id: string; crashes: Record<string, Record<string, number>> }[] }) : undefined, report: written ? readFileSync(`${out}.quality.txt`, "utf8") : "" };
}

describe("tally without --window on data with a stray old row", () => {
  it("takes the latest run of full years, and says which rows it left out", async () => {
    const result = await tally([HEADER, "old-1,2014-05-01,55.4,10.4,K,angle", ...goodRows(6)].join("\n") + "\n");
    expect(result.code).toBe(0);
    expect(result.yaml!.crashWindow).toEqual({ firstYear: 2021, lastYear: 2025 });
    expect(result.stderr).toMatch(/note: the window 2021-2025 \(5 years\) was taken from the data; pass --window.*1 row from 2014 left out/);
    expect(result.report).toMatch(/left out: 1 row from 2014 \(1\)/);
    expect(result.report).toMatch(/line 2: outside-window/);
    expect(result.yaml!.sites[0]!.crashes.angle!.B).toBe(30);
  });
  it("refuses, writing nothing, when no run of full years holds nearly all rows", async () => {
    const rows = goodRows(6).filter((row) => /,202[45]-/.test(row));
    for (let k = 0; k < 20; k++) rows.push(`old-${k},2015-03-0${1 + (k % 9)},55.4,10.4,C,angle`, `old2-${k},2016-03-0${1 + (k % 9)},55.4,10.4,C,angle`);
    const result = await tally([HEADER, ...rows].join("\n"));
    expect(result.code).toBe(2);
    expect(result.stderr).toMatch(/crashes-\d+\.csv: the crash years give no clear window.*2015: 20.*\(pass --window/);
    expect(result.written).toBe(false);
  });
});

describe("tally line numbers with LF, CRLF and CR line ends", () => {
  const lines = [HEADER + ",note", "c1,2023-05-01,55.4,10.4,K,angle,ok", 'c2,2023-05-01,55.4,10.4,K,angle,"spans', 'two lines"', "c3,2023-05-01,55.4,10.4,X,angle,unknown severity", ...goodRows(10).map((row) => `${row},x`), "c4,2023-02-29,55.4,10.4,K,angle,no such day"];
  for (const [name, end] of [["LF", "\n"], ["CRLF", "\r\n"], ["CR", "\r"]] as const) {
    it(`reports each rejected row on its own line (${name})`, async () => {
      const result = await tally(lines.join(end) + end);
      expect(result.code).toBe(0);
      expect(result.report).toMatch(/line 5: unknown-severity/);
      expect(result.report).toMatch(new RegExp(`line ${lines.length}: invalid-date`));
      expect(result.stderr).toMatch(/first on line 5/);
    });
  }
  it("reports the same lines for a file mixing them", async () => {
    const mixed = lines.map((line, index) => line + ["\r\n", "\n", "\r"][index % 3]).join("");
    const result = await tally(mixed);
    expect(result.report).toMatch(/line 5: unknown-severity/);
    expect(result.report).toMatch(new RegExp(`line ${lines.length}: invalid-date`));
  });
});

describe("tally and unknown severity or type codes", () => {
  const withUnknown = (count: number) => [HEADER, ...goodRows(20), ...Array.from({ length: count }, (_, k) => `u${k},2023-06-0${1 + (k % 9)},55.4,10.4,${k % 2 === 0 ? "9" : "B"},${k % 2 === 0 ? "angle" : "SS"}`)].join("\n");
  it("stops above 5 % of the rows, listing the codes and counts, with how to map them, writing nothing", async () => {
    const result = await tally(withUnknown(10)); // 10 of 110 rows: 9.1 %
    expect(result.code).toBe(2);
    expect(result.stderr).toMatch(/error: .*crashes-\d+\.csv:102: 5 rows have a severity code the mapping does not translate: '9' in 5 rows \(first on line 102\).*10 of 110 rows \(9\.1%\).*over the 5% limit.*severity: \{ "9": O \}.*--mapping FILE/);
    expect(result.stderr).toMatch(/error: .*crashes-\d+\.csv:103: 5 rows have a type code .*'SS' in 5 rows/);
    expect(result.written).toBe(false);
  });
  it("warns with the codes and counts at or below 5 %, and a mapping makes the warning go", async () => {
    const result = await tally(withUnknown(4)); // 4 of 104 rows: 3.8 %
    expect(result.code).toBe(0);
    expect(result.stderr).toMatch(/warning: .*2 rows rejected for an unknown severity code: '9' in 2 rows \(first on line 102\)/);
    expect(result.report).toMatch(/Unknown codes[\s\S]*severity "9": 2 rows, first on line 102/);
    const mapping = write("codes.yaml", 'severity: { "9": O }\ntype: { SS: other }\n');
    const mapped = await tally(withUnknown(10), "--mapping", mapping);
    expect(mapped.code).toBe(0);
    expect(mapped.stderr).not.toMatch(/unknown (severity|type) code/);
    expect(mapped.yaml!.sites[0]!.crashes.other!.B).toBe(5);
  });
});

describe("tally field separators and date formats", () => {
  it("reads a semicolon file with day-first dates and decimal commas, told from the file", async () => {
    const rows = goodRows(4, (year, k) => `${10 + k}.0${1 + k}.${year}`, ";").map((row) => row.replace("55.4;10.4", "55,4;10,4"));
    const result = await tally([HEADER.replaceAll(",", ";"), ...rows].join("\r\n"));
    expect(result.code).toBe(0);
    expect(result.yaml!.sites[0]!.crashes.angle!.B).toBe(20);
  });
  it("reads a tab file given --delimiter tab, and explains a wrong separator", async () => {
    const text = [HEADER.replaceAll(",", "\t"), ...goodRows(4, undefined, "\t")].join("\n");
    expect((await tally(text, "--delimiter", "tab")).code).toBe(0);
    const wrong = await tally(text, "--delimiter", ";");
    expect(wrong.code).toBe(2);
    expect(wrong.stderr).toMatch(/crashes-\d+\.csv:1: no column for id/);
    const unknown = await tally(text, "--delimiter", "pipe");
    expect(unknown.code).toBe(2);
    expect(unknown.stderr).toMatch(/--delimiter: 'pipe' is not a field separator/);
  });
  it("refuses dates that could be day-first or month-first, and reads them with --date-format", async () => {
    const text = [HEADER, ...goodRows(4, (year, k) => `0${1 + k}/0${2 + k}/${year}`)].join("\n");
    const ambiguous = await tally(text);
    expect(ambiguous.code).toBe(2);
    expect(ambiguous.stderr).toMatch(/crashes-\d+\.csv:2: date: dates such as '01\/02\/2021' may be day-first or month-first.*--date-format dmy/);
    expect(ambiguous.written).toBe(false);
    expect((await tally(text, "--date-format", "mdy")).code).toBe(0);
    const bad = await tally(text, "--date-format", "yyyy-mm-dd");
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/--date-format: 'yyyy-mm-dd' is not a date format/);
  });
  it("rejects a 31 February with its line", async () => {
    const result = await tally([HEADER, ...goodRows(4, (year, k) => `${year}-0${1 + k}-1${k}`), "x1,2023-02-31,55.4,10.4,K,angle"].join("\n"));
    expect(result.code).toBe(0);
    expect(result.report).toMatch(/line 22: invalid-date: crash 'x1' has date '2023-02-31', not a real date/);
  });
});

describe("tally on a crash file without crash rows", () => {
  it("exits 2 with 'no crash rows', naming the file, and writes nothing", async () => {
    for (const text of [HEADER, `${HEADER}\r\n`, `${HEADER}\n\n`]) {
      const result = await tally(text);
      expect(result.code).toBe(2);
      expect(result.stderr).toMatch(/error: .*crashes-\d+\.csv:1: no crash rows.*\(export the crash records/);
      expect(result.written).toBe(false);
    }
  });
});

describe("tally with sites that span the globe or cross the antimeridian", () => {
  it("assigns crashes and writes locations across the antimeridian", async () => {
    const sites = write(
      "world.geojson",
      JSON.stringify({
        type: "FeatureCollection",
        features: [
          { type: "Feature", properties: { id: "F-1", district: "Islands" }, geometry: { type: "LineString", coordinates: [[179.999, -16.5], [-179.999, -16.5]] } },
          { type: "Feature", properties: { id: "W-1", district: "World" }, geometry: { type: "LineString", coordinates: [[-170, -80], [-60, 10], [50, 80], [170, -70]] } },
          { type: "Feature", properties: { id: "I-1", district: "North" }, geometry: { type: "Point", coordinates: [10.4, 55.4] } },
        ],
      }),
    );
    const rows = [HEADER];
    for (let year = 2021; year <= 2025; year++) rows.push(`f${year},${year}-03-01,-16.50005,-179.9999,K,angle`, `i${year},${year}-03-02,55.4001,10.4,A,angle`, `w${year},${year}-03-03,-35,-115,B,angle`);
    const crashes = write("world.csv", rows.join("\n"));
    const out = join(folder, "world.yaml");
    const result = await runCaptured(["tally", "--crashes", crashes, "--sites", sites, "--out", out]);
    expect(result.code).toBe(0);
    const written = parse(readFileSync(out, "utf8")) as { sites: { id: string; location: { lon: number; lat: number }; lengthKm: number; crashes: Record<string, Record<string, number>> }[] };
    const [islands, world, town] = written.sites;
    expect(islands!.crashes.angle!.K).toBe(5);
    expect(town!.crashes.angle!.A).toBe(5);
    // (-115, -35) lies on W-1's first edge, the straight line from (-170, -80) to (-60, 10).
    expect(world!.crashes.angle!.B).toBe(5);
    expect(Math.abs(islands!.location.lon)).toBeCloseTo(180, 6);
    expect(islands!.lengthKm).toBeLessThan(0.3);
  });
});
