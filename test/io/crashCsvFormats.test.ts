import { describe, expect, it } from "vitest";
import { checkUnknownCodes, MAX_UNKNOWN_CODE_SHARE } from "../../src/io/checkUnknownCodes.js";
import { DEFAULT_CRASH_MAPPING } from "../../src/io/CrashMapping.js";
import { detectDateFormat } from "../../src/io/detectDateFormat.js";
import { InputError } from "../../src/io/InputError.js";
import { parseCrashCsv, type CrashCsvOptions } from "../../src/io/parseCrashCsv.js";
import { parseCrashDate } from "../../src/io/parseCrashDate.js";

const HEADER = ["id", "date", "latitude", "longitude", "severity", "type"];
const parse = (lines: readonly string[], options: CrashCsvOptions = {}, end = "\n") => parseCrashCsv(lines.join(end) + end, DEFAULT_CRASH_MAPPING, "crashes.csv", options);
/** The InputError problem a parse throws (the test fails when it does not throw). */
function problemOf(run: () => unknown) {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(InputError);
    return (error as InputError).problems[0]!;
  }
  throw new Error("expected an InputError");
}

describe("crash file field separators", () => {
  it("tells comma, semicolon and tab from the header", () => {
    for (const delimiter of [",", ";", "\t"]) {
      const rows = parse([HEADER.join(delimiter), ["c1", "2023-05-01", "55.4", "10.4", "K", "angle"].join(delimiter)]);
      expect(rows.delimiter).toBe(delimiter);
      expect(rows.records).toMatchObject([{ id: "c1", year: 2023, location: { lat: 55.4, lon: 10.4 } }]);
    }
  });
  it("reads decimal commas in a semicolon file's coordinates", () => {
    const rows = parse([HEADER.join(";"), "c1;2023-05-01;55,4;10,4;K;angle"]);
    expect(rows.records[0]!.location).toEqual({ lat: 55.4, lon: 10.4 });
  });
  it("picks the one separator that splits the header into the crash columns", () => {
    const rows = parse(["id;date;latitude;longitude;severity;type;note, with a comma", "c1;2023-05-01;55.4;10.4;K;angle;x, y"]);
    expect(rows.delimiter).toBe(";");
    expect(rows.records).toHaveLength(1);
  });
  it("refuses, on line 1, a header it cannot split into the crash columns by any separator it holds", () => {
    const problem = problemOf(() => parse(["id,date;latitude,longitude;severity,type", "c1,2023-05-01;55.4,10.4;K,angle"]));
    expect(problem).toMatchObject({ code: "csv-delimiter", file: "crashes.csv", line: 1 });
    expect(problem.hint).toMatch(/--delimiter/);
  });
  it("says a header read as one column may need --delimiter", () => {
    const problem = problemOf(() => parse([HEADER.join("|"), "c1|2023-05-01|55.4|10.4|K|angle"]));
    expect(problem).toMatchObject({ code: "csv-columns", line: 1 });
    expect(problem.hint).toMatch(/--delimiter/);
  });
  it("obeys a given separator", () => {
    const problem = problemOf(() => parse([HEADER.join(";"), "c1;2023-05-01;55.4;10.4;K;angle"], { delimiter: "," }));
    expect(problem).toMatchObject({ code: "csv-columns", line: 1 });
  });
  it("refuses a mapped column that appears twice", () => {
    expect(problemOf(() => parse([[...HEADER, "date"].join(","), "c1,2023-05-01,55.4,10.4,K,angle,2024-01-01"]))).toMatchObject({ code: "csv-columns", line: 1 });
  });
});

describe("crash dates", () => {
  // Real dates of the Gregorian calendar (leap years: divisible by 4, centuries by 400; common practice).
  it("reads each format, with ISO date-times", () => {
    expect(parseCrashDate("2024-03-31", "ymd")).toEqual({ year: 2024, month: 3, day: 31 });
    expect(parseCrashDate("2024/3/31", "ymd")).toEqual({ year: 2024, month: 3, day: 31 });
    expect(parseCrashDate("2024-03-31T23:59:59.5Z", "ymd")).toEqual({ year: 2024, month: 3, day: 31 });
    expect(parseCrashDate("2024-12-31T23:30:00-05:00", "ymd")).toEqual({ year: 2024, month: 12, day: 31 });
    expect(parseCrashDate("2024-03-31 14:05", "ymd")).toEqual({ year: 2024, month: 3, day: 31 });
    expect(parseCrashDate("31/03/2024", "dmy")).toEqual({ year: 2024, month: 3, day: 31 });
    expect(parseCrashDate("31.03.2024", "dmy")).toEqual({ year: 2024, month: 3, day: 31 });
    expect(parseCrashDate("31-03-2024 5:45 PM", "dmy")).toEqual({ year: 2024, month: 3, day: 31 });
    expect(parseCrashDate("03/31/2024", "mdy")).toEqual({ year: 2024, month: 3, day: 31 });
  });
  it("refuses days that do not exist, times that do not exist and the wrong format", () => {
    for (const [text, format] of [
      ["31/02/2023", "dmy"],
      ["29/02/2023", "dmy"],
      ["29/02/1900", "dmy"],
      ["2023-04-31", "ymd"],
      ["2023-13-01", "ymd"],
      ["2023-00-10", "ymd"],
      ["2023-01-00", "ymd"],
      ["2023-01-01T24:00", "ymd"],
      ["2023-01-01T12:60", "ymd"],
      ["2023-01-01 13:00 PM", "ymd"],
      ["2023-01-01T10:00+25:00", "ymd"],
      ["31/03/2024", "ymd"],
      ["2024-03-31", "dmy"],
      ["31/03/2024", "mdy"],
      ["2024-03-31x", "ymd"],
      ["2024-03/31", "ymd"],
      ["0024-03-31", "ymd"],
      ["31/03/24", "dmy"],
    ] as const) {
      expect(parseCrashDate(text, format), `${text} as ${format}`).toBeUndefined();
    }
    expect(parseCrashDate("29/02/2024", "dmy")).toEqual({ year: 2024, month: 2, day: 29 });
    expect(parseCrashDate("29/02/2000", "dmy")).toEqual({ year: 2000, month: 2, day: 29 });
  });
  it("tells the format from the dates, and refuses to guess", () => {
    const at = (...texts: string[]) => texts.map((text, index) => ({ text, line: index + 2 }));
    expect(detectDateFormat(at("2024-03-01", "2024-04-02"))).toEqual({ ok: true, format: "ymd" });
    expect(detectDateFormat(at("03/04/2022", "31/12/2022"))).toEqual({ ok: true, format: "dmy" });
    expect(detectDateFormat(at("03/04/2022", "12/31/2022"))).toEqual({ ok: true, format: "mdy" });
    expect(detectDateFormat(at("03/04/2022", "05/06/2022"))).toMatchObject({ ok: false, line: 2 });
    expect(detectDateFormat(at("2024-03-01", "n/a", "05/06/2022"))).toMatchObject({ ok: false, line: 4 });
    expect(detectDateFormat(at("13/04/2022", "04/13/2022"))).toMatchObject({ ok: false, line: 3 });
  });
  it("refuses an ambiguous file with its line and a hint, and reads it with --date-format", () => {
    const lines = [HEADER.join(","), "c1,03/04/2022,55.4,10.4,K,angle", "c2,05/06/2022,55.4,10.4,K,angle"];
    const problem = problemOf(() => parse(lines));
    expect(problem).toMatchObject({ code: "date-format", file: "crashes.csv", line: 2 });
    expect(problem.hint).toMatch(/--date-format dmy/);
    expect(parse(lines, { dateFormat: "mdy" }).records.map((record) => record.year)).toEqual([2022, 2022]);
  });
  it("rejects a date that does not exist with its line, in a day-first file", () => {
    const rows = parse([HEADER.join(";"), "c1;31/03/2022;55,4;10,4;K;angle", "c2;31/02/2022;55,4;10,4;K;angle"]);
    expect(rows.dateFormat).toBe("dmy");
    expect(rows.rejected).toMatchObject([{ line: 3, reason: "invalid-date" }]);
  });
});

describe("crash coordinates", () => {
  it("reads decimal degrees only: no other bases, no words, no stray characters", () => {
    const values = ["0x1F", "0b1", "0o7", "Infinity", "NaN", "55.4.1", "55,4,1", "1_0", "55 .4", "--5", "٥٥"];
    const rows = parse([HEADER.join(","), ...values.map((value, index) => `c${index},2023-05-01,"${value}",10.4,K,angle`)]);
    expect(rows.records).toHaveLength(0);
    expect(rows.rejected.map((row) => [row.line, row.reason])).toEqual(values.map((_, index) => [index + 2, "invalid-coordinates"]));
    const good = parse([HEADER.join(","), "g1,2023-05-01,+55.4,10.4,K,angle", "g2,2023-05-01,55.,1e-5,K,angle", "g3,2023-05-01, 55.4 ,-.5,K,angle"]);
    expect(good.records.map((record) => [record.location.lat, record.location.lon])).toEqual([[55.4, 10.4], [55, 1e-5], [55.4, -0.5]]);
  });
});

describe("a crash file without crash rows", () => {
  it("is refused, naming the file and the header's line", () => {
    for (const text of ["id,date,latitude,longitude,severity,type", "id,date,latitude,longitude,severity,type\r\n", "\ufeffid,date,latitude,longitude,severity,type\n\n\n"]) {
      const problem = problemOf(() => parseCrashCsv(text, DEFAULT_CRASH_MAPPING, "crashes.csv"));
      expect(problem).toMatchObject({ code: "no-crash-rows", file: "crashes.csv", line: 1 });
      expect(problem.message).toMatch(/no crash rows/);
    }
    expect(problemOf(() => parseCrashCsv("", DEFAULT_CRASH_MAPPING, "crashes.csv"))).toMatchObject({ code: "csv-empty" });
  });
});

describe("rejected rows keep their lines whatever the line ends", () => {
  it("gives the same lines for LF, CRLF, CR and mixed files with a quoted line break", () => {
    const lines = [HEADER.join(",") + ",note", "c1,2023-05-01,55.4,10.4,K,angle,ok", 'c2,2023-05-01,55.4,10.4,K,angle,"two', 'lines"', "c3,2023-05-01,55.4,10.4,X,angle,unknown severity", "c4,2023-02-30,55.4,10.4,K,angle,no such day"];
    for (const end of ["\n", "\r\n", "\r"]) {
      expect(parse(lines, {}, end).rejected.map((row) => [row.line, row.reason])).toEqual([[5, "unknown-severity"], [6, "invalid-date"]]);
    }
    const mixed = `${lines[0]}\r\n${lines[1]}\n${lines[2]}\r\n${lines[3]}\r${lines[4]}\n${lines[5]}`;
    expect(parseCrashCsv(mixed, DEFAULT_CRASH_MAPPING, "m.csv").rejected.map((row) => row.line)).toEqual([5, 6]);
  });
});

describe("unknown severity and type codes", () => {
  const file = (unknown: number, total: number) =>
    parse([HEADER.join(","), ...Array.from({ length: total }, (_, index) => `c${index},2023-05-01,55.4,10.4,${index < unknown ? (index % 2 === 0 ? "9" : "K") : "K"},${index < unknown && index % 2 === 1 ? "SS" : "angle"}`)]);
  it("counts each code with its first line", () => {
    expect(file(5, 10).unknownCodes).toEqual([
      { field: "severity", code: "9", rows: 3, firstLine: 2 },
      { field: "type", code: "SS", rows: 2, firstLine: 3 },
    ]);
  });
  it("warns with the codes and counts at or below 5 % of the rows", () => {
    expect(MAX_UNKNOWN_CODE_SHARE).toBe(0.05);
    const warnings = checkUnknownCodes(file(5, 100), "crashes.csv");
    expect(warnings).toHaveLength(2);
    expect(warnings[0]).toMatch(/'9' in 3 rows \(first on line 2\)/);
    expect(warnings[1]).toMatch(/'SS' in 2 rows \(first on line 3\)/);
    expect(warnings.join("\n")).toMatch(/--mapping/);
    expect(checkUnknownCodes(file(0, 100), "crashes.csv")).toEqual([]);
  });
  it("refuses above 5 %, listing the codes, their counts and how to map them", () => {
    const error = (() => {
      try {
        checkUnknownCodes(file(6, 100), "crashes.csv");
      } catch (caught) {
        return caught as InputError;
      }
      throw new Error("expected an InputError");
    })();
    expect(error).toBeInstanceOf(InputError);
    expect(error.problems.map((problem) => [problem.code, problem.file, problem.line])).toEqual([
      ["unknown-codes", "crashes.csv", 2],
      ["unknown-codes", "crashes.csv", 3],
    ]);
    expect(error.problems[0]!.message).toMatch(/'9' in 3 rows.*6 of 100 rows \(6\.0%\)/);
    expect(error.problems[0]!.hint).toMatch(/severity: \{ "9": O \}.*--mapping/);
    expect(error.problems[1]!.hint).toMatch(/type: \{ "SS": other \}/);
  });
});
