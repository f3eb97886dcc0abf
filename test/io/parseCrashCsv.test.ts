import { describe, expect, it } from "vitest";
import type { NetworkSite } from "../../src/geo/NetworkSite.js";
import { tallyNetwork } from "../../src/geo/tallyNetwork.js";
import { DEFAULT_CRASH_MAPPING } from "../../src/io/CrashMapping.js";
import { InputError } from "../../src/io/InputError.js";
import { parseCrashCsv } from "../../src/io/parseCrashCsv.js";

const site: NetworkSite = { id: "I-1", name: "I-1", kind: "intersection", district: "North", tags: [], candidates: ["t"], paths: [[{ lon: 10.4, lat: 55.4 }]] };

// Line numbers count the header as line 1; row 4 spans two lines (a quoted line break).
const csv = [
  "id,date,latitude,longitude,severity,type,note",
  "c1,2023-05-01,55.4,10.4,K,pedestrian,ok",
  "c2,2023-05-02,,10.4,A,angle,no latitude",
  'c3,2023-05-03,55.4,10.4,B,angle,"two',
  'lines, and a comma"',
  "c4,2023-05-04,fifty-five,10.4,B,angle,text in a number",
  "c5,2023-05-05,55.4,10.4,X,angle,unknown severity",
  "c6,2019-01-01,55.4,10.4,C,angle,outside the window",
  "c1,2023-06-01,55.4,10.4,O,angle,duplicate id",
  "c8,2023-02-30,55.4,10.4,O,angle,no such day",
  "c9,2023-05-09,55.4,10.4,O,sideswipe,unknown type",
  "c10,2023-05-10,0,0,O,angle,placeholder 0 0",
  "c11,2023-05-11,55.4,10.4,O,angle",
  "c12,2023-05-12,56.4,10.4,o,angle,far away: unassigned",
  "c13,2024-05-12,55.4001,10.4,c,rear-end,assigned",
].join("\r\n");

describe("crash rows: bad rows reported by line, nothing lost", () => {
  const rows = parseCrashCsv(csv, DEFAULT_CRASH_MAPPING, "crashes.csv");
  const { quality, sites } = tallyNetwork([site], rows, { firstYear: 2021, lastYear: 2025 });
  it("rejects each bad row with its line and reason", () => {
    expect(quality.rejected.map((row) => [row.line, row.reason])).toEqual([
      [3, "missing-coordinates"],
      [6, "invalid-coordinates"],
      [7, "unknown-severity"],
      [8, "outside-window"],
      [9, "duplicate-id"],
      [10, "invalid-date"],
      [11, "unknown-type"],
      [12, "missing-coordinates"],
      [13, "wrong-field-count"],
    ]);
  });
  it("accounts for every row: assigned + unassigned + rejected = rows read", () => {
    expect(rows.rowsRead).toBe(13); // 14 lines of records, one of them a quoted line break
    expect(quality.assigned).toBe(3);
    expect(quality.unassigned).toBe(1);
    expect(quality.unassignedLines).toEqual([14]);
    expect(quality.outsideExtent).toBe(1);
    expect(quality.assigned + quality.unassigned + quality.rejected.length).toBe(quality.rowsRead);
    expect(quality.districts).toEqual([{ district: "North", crashes: 4, unassigned: 1 }]);
    expect(quality.yearsBySite).toEqual([{ site: "I-1", years: [2023, 2024] }]);
  });
  it("counts the assigned crashes by type and severity (lower-case letters accepted)", () => {
    expect(sites[0]!.crashes.pedestrian.K).toBe(1);
    expect(sites[0]!.crashes.angle.B).toBe(1);
    expect(sites[0]!.crashes["rear-end"].C).toBe(1);
  });
  it("translates agency codes and column names through a mapping", () => {
    const text = ["CRASH_NO,WHEN,LAT,LON,SEV,MANNER", "A1,2022-01-01,55.4,10.4,1,PED", "A2,2022-01-02,55.4,10.4,9,PED"].join("\n");
    const mapping = { columns: { id: "crash_no", date: "WHEN", latitude: "LAT", longitude: "LON", severity: "SEV", type: "MANNER" }, severity: { "1": "K" as const }, type: { PED: "pedestrian" as const } };
    const result = parseCrashCsv(text, mapping, "agency.csv");
    expect(result.records).toMatchObject([{ id: "A1", severity: "K", type: "pedestrian", year: 2022, line: 2 }]);
    expect(result.rejected).toEqual([{ line: 3, reason: "unknown-severity", message: expect.any(String) }]);
  });
  it("refuses a file whose header lacks a column, naming the line", () => {
    try {
      parseCrashCsv("id,date,lat,longitude,severity,type\n", DEFAULT_CRASH_MAPPING, "crashes.csv");
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(InputError);
      expect((error as InputError).problems[0]).toMatchObject({ code: "csv-columns", file: "crashes.csv", line: 1 });
    }
  });
  it("refuses broken CSV syntax with its line", () => {
    expect(() => parseCrashCsv('id,date\n"x,2021-01-01\n', DEFAULT_CRASH_MAPPING, "f.csv")).toThrow(InputError);
  });
});
