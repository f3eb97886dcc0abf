import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { parseCsv } from "../../src/io/parseCsv.js";

function fields(text: string): readonly (readonly string[])[] {
  const result = parseCsv(text);
  if (!result.ok) throw new Error(result.problem.message);
  return result.records.map((record) => record.fields);
}

// The numbered examples are those of RFC 4180, section 2 ("Definition of the CSV Format").
describe("parseCsv against RFC 4180 section 2", () => {
  it("rule 1: records separated by CRLF", () => {
    expect(fields("aaa,bbb,ccc\r\nzzz,yyy,xxx\r\n")).toEqual([["aaa", "bbb", "ccc"], ["zzz", "yyy", "xxx"]]);
  });
  it("rule 2: the last record may lack a line break", () => {
    expect(fields("aaa,bbb,ccc\r\nzzz,yyy,xxx")).toEqual([["aaa", "bbb", "ccc"], ["zzz", "yyy", "xxx"]]);
  });
  it("rule 3: an optional header line has the same format", () => {
    expect(fields("field_name,field_name,field_name\r\naaa,bbb,ccc\r\n")[0]).toEqual(["field_name", "field_name", "field_name"]);
  });
  it("rule 5: fields may be enclosed in double quotes", () => {
    expect(fields('"aaa","bbb","ccc"\r\nzzz,yyy,xxx')).toEqual([["aaa", "bbb", "ccc"], ["zzz", "yyy", "xxx"]]);
  });
  it("rule 6: quoted fields may hold line breaks and commas", () => {
    expect(fields('"aaa","b\r\nbb","ccc"\r\nzzz,yyy,xxx')).toEqual([["aaa", "b\r\nbb", "ccc"], ["zzz", "yyy", "xxx"]]);
    expect(fields('"a,b",c')).toEqual([["a,b", "c"]]);
  });
  it('rule 7: a double quote inside a quoted field is written twice', () => {
    expect(fields('"aaa","b""bb","ccc"')).toEqual([["aaa", 'b"bb', "ccc"]]);
  });
  it("rule 4: spaces are part of a field", () => {
    expect(fields(" a , b ")).toEqual([[" a ", " b "]]);
  });
});

describe("parseCsv beyond the RFC's examples", () => {
  it("skips a UTF-8 byte order mark and accepts bare LF line ends", () => {
    expect(fields("\uFEFFid,x\nA,1\n")).toEqual([["id", "x"], ["A", "1"]]);
  });
  it("keeps empty fields and reports each record's starting line, counting breaks inside quotes", () => {
    const result = parseCsv('id,note\r\n1,"two\r\nlines"\r\n2,\r\n\r\n3,x');
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.records.map((r) => r.line)).toEqual([1, 2, 4, 6]);
    expect(result.records[2]!.fields).toEqual(["2", ""]);
  });
  it("reports an unterminated quote and a stray quote with their line", () => {
    const open = parseCsv('a,b\r\n1,"never closed\r\n');
    expect(open.ok).toBe(false);
    if (!open.ok) expect(open.problem).toMatchObject({ line: 2, column: 3 });
    const stray = parseCsv('a,b\nx,ab"c\n');
    expect(stray.ok).toBe(false);
    if (!stray.ok) expect(stray.problem).toMatchObject({ line: 2, column: 5 });
    const after = parseCsv('"ab"c,d');
    expect(after.ok).toBe(false);
  });
});

describe("parseCsv line numbers with LF, CRLF, CR and mixed line ends (fast-check)", () => {
  // Each CRLF, LF or CR is one line end, as editors and Python's universal newlines count them.
  const countLineEnds = (text: string) => (text.match(/\r\n|\r|\n/g) ?? []).length;
  const lineEnd = fc.constantFrom("\n", "\r\n", "\r");
  const field = fc.array(fc.constantFrom("a", "7", " ", ",", ";", "\t", '"', "\n", "\r", "\r\n", "é"), { maxLength: 6 }).map((parts) => parts.join(""));
  const record = fc.array(field, { minLength: 1, maxLength: 4 }).filter((fields) => !(fields.length === 1 && fields[0] === ""));
  for (const delimiter of [",", ";", "\t"] as const) {
    it(`gives every record the line it starts on, separated by ${JSON.stringify(delimiter)} (1,000 cases)`, () => {
      let cases = 0;
      fc.assert(
        fc.property(fc.array(fc.tuple(record, lineEnd), { minLength: 1, maxLength: 8 }), fc.boolean(), (records, finalBreak) => {
          const quote = (text: string) => (/["\r\n,;\t]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text);
          let text = "";
          const starts: number[] = [];
          records.forEach(([fields, end], index) => {
            starts.push(text.length);
            text += fields.map(quote).join(delimiter) + (index < records.length - 1 || finalBreak ? end : "");
          });
          const parsed = parseCsv(text, delimiter);
          expect(parsed.ok).toBe(true);
          if (!parsed.ok) return;
          expect(parsed.records.map((r) => r.fields)).toEqual(records.map(([fields]) => fields));
          expect(parsed.records.map((r) => r.line)).toEqual(starts.map((start) => 1 + countLineEnds(text.slice(0, start))));
          cases++;
        }),
        { numRuns: 1000, seed: 4180 },
      );
      expect(cases).toBe(1000);
    });
  }
  it("numbers the same file alike whatever its line ends, quoted breaks included", () => {
    const lines = ["id,note", "1,plain", '2,"spans', 'two lines"', "3,after"];
    for (const end of ["\n", "\r\n", "\r"]) {
      const parsed = parseCsv(lines.join(end) + end);
      expect(parsed.ok && parsed.records.map((r) => r.line)).toEqual([1, 2, 3, 5]);
    }
    const mixed = parseCsv('id,note\r\n1,plain\n2,"spans\rtwo lines"\r\n3,after\r4,last');
    expect(mixed.ok && mixed.records.map((r) => r.line)).toEqual([1, 2, 3, 5, 6]);
  });
  it("locates a syntax problem on the right line after CRLF and CR line ends", () => {
    for (const end of ["\r\n", "\r"]) {
      const problem = parseCsv(["a,b", "1,2", '3,"x', 'y"', '4,ab"c'].join(end));
      expect(problem.ok).toBe(false);
      if (!problem.ok) expect(problem.problem).toMatchObject({ line: 5, column: 5 });
    }
  });
});
