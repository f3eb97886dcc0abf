import { readdirSync, readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { guardCsvText, toCsv } from "../../src/report/toCsv.js";
import { parseCsv } from "./parseCsv.js";

// Cells a spreadsheet could run as a formula (OWASP, "CSV Injection": cells that begin with =, +,
// -, @, tab or carriage return), and the same signs behind a line feed, spaces, a no-break space,
// other Unicode white space or invisible characters, which some spreadsheets skip.
const HOSTILE = [
  "=1+1",
  "+1+1",
  "-2+3",
  "@SUM(A1:A2)",
  "\t=1",
  "\r=1",
  "\n=1",
  "\nplain text after a line feed",
  " =1+1",
  "   @SUM(A1)",
  "\u00a0=1+1",
  "\u2003+1",
  "\u3000-1+2",
  "\ufeff=1",
  "\u200b=1",
  "\t",
  "\uff1d1+1", // full-width equals sign
  "-",
  "+",
  "=",
];

describe("the CSV guard against formula injection", () => {
  it("prefixes every formula-like text cell with an apostrophe and keeps its text", () => {
    const rows = parseCsv(toCsv(["name"], HOSTILE.map((cell) => [cell])));
    expect(rows.slice(1).map((row) => row[0])).toEqual(HOSTILE.map((cell) => `'${cell}`));
  });
  it("guards the header too (a currency code is user text)", () => {
    expect(parseCsv(toCsv(["budget_=HYPERLINK(1)", "=x"], []))[0]).toEqual(["budget_=HYPERLINK(1)", "'=x"]);
  });
  it("leaves numbers and plain-number text machine-readable", () => {
    const rows = parseCsv(toCsv(["a", "b", "c", "d", "e"], [[-3.5, "-3.5", "+2", "1e-5", -0.25]]));
    expect(rows[1]).toEqual(["-3.5", "-3.5", "+2", "1e-5", "-0.25"]);
  });
  it("leaves ordinary text alone", () => {
    for (const text of ["Main St & 3rd", "a-b", "x=y", "I-01", "#1", "'quoted"]) expect(guardCsvText(text)).toBe(text);
  });
  it("is the only way a report writes CSV: every *Csv.ts writer renders through toCsv", () => {
    const folder = "src/report";
    const writers = readdirSync(folder).filter((name) => /Csv\.ts$/.test(name) && name !== "toCsv.ts");
    expect(writers.length).toBeGreaterThanOrEqual(5);
    for (const name of writers) {
      const source = readFileSync(`${folder}/${name}`, "utf8");
      expect(source, name).toMatch(/from "\.\/(toCsv|csvPreamble)\.js"/);
      // No hand-rolled rows: a join on commas or line ends would bypass the guard.
      expect(source, name).not.toMatch(/join\(\s*["'`](,|\\r\\n|\\n)["'`]\s*\)/);
    }
    // The preamble itself is rendered by toCsv.
    expect(readFileSync(`${folder}/csvPreamble.ts`, "utf8")).toMatch(/toCsv\(/);
  });
});
