import { describe, expect, it } from "vitest";
import { parseCsv } from "./parseCsv.js";

// The examples of RFC 4180 section 2 (rules 1 to 7), https://www.rfc-editor.org/rfc/rfc4180#section-2.
describe("parseCsv (the test's own RFC 4180 parser)", () => {
  it("splits records on CRLF, with or without a final line break (rules 1, 2)", () => {
    expect(parseCsv("aaa,bbb,ccc\r\nzzz,yyy,xxx\r\n")).toEqual([["aaa", "bbb", "ccc"], ["zzz", "yyy", "xxx"]]);
    expect(parseCsv("aaa,bbb,ccc\r\nzzz,yyy,xxx")).toEqual([["aaa", "bbb", "ccc"], ["zzz", "yyy", "xxx"]]);
  });
  it("reads quoted fields holding commas, line breaks and doubled quotes (rules 5, 6, 7)", () => {
    expect(parseCsv('"aaa","b\r\nbb","ccc"\r\n')).toEqual([["aaa", "b\r\nbb", "ccc"]]);
    expect(parseCsv('"aaa","b""bb","ccc"\r\n')).toEqual([["aaa", 'b"bb', "ccc"]]);
    expect(parseCsv('a,"x,y",\r\n')).toEqual([["a", "x,y", ""]]);
  });
});
