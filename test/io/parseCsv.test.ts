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
