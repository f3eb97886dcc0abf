import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { InputError } from "../../src/io/InputError.js";
import { loadScenario } from "../../src/io/loadScenario.js";
import { amountHint, MAX_AMOUNT, parseAmount } from "../../src/io/parseAmount.js";

describe("parseAmount", () => {
  it("reads plain, thousands-separated and suffixed amounts", () => {
    // Thousands grouped in threes by commas: common practice in English-language finance.
    expect(parseAmount("4500000")).toBe(4_500_000);
    expect(parseAmount("4,500,000")).toBe(4_500_000);
    expect(parseAmount("$4,500,000")).toBe(4_500_000);
    expect(parseAmount("4_500_000")).toBe(4_500_000);
    expect(parseAmount("4.5M")).toBe(4_500_000);
    expect(parseAmount("750k")).toBe(750_000);
    expect(parseAmount("1,250.5k")).toBe(1_250_500);
  });

  it("refuses a decimal comma instead of reading 4,5M as 45 million", () => {
    // The comma is the decimal mark in much of the world (BIPM SI Brochure, 9th ed., 2019,
    // §5.4.4, from memory), so "4,5M" is ambiguous and must not become 45,000,000.
    expect(parseAmount("4,5M")).toBeUndefined();
    expect(parseAmount("4,50M")).toBeUndefined();
    expect(parseAmount("45,00")).toBeUndefined();
    expect(parseAmount("4,5000")).toBeUndefined();
    expect(parseAmount("5M,9.7M")).toBeUndefined();
  });

  it("refuses negative and malformed amounts", () => {
    expect(parseAmount("-1M")).toBeUndefined();
    expect(parseAmount(-1)).toBeUndefined();
    expect(parseAmount("4.500.000")).toBeUndefined();
    expect(parseAmount("4 500 000")).toBeUndefined();
  });

  it("says how to fix a decimal comma, a list in one value and a minus sign", () => {
    expect(amountHint("4,5M")).toMatch(/point/);
    expect(amountHint("5M,9.7M")).toMatch(/one amount per option/);
    expect(amountHint("-1M")).toMatch(/negative/);
  });

  it("holds text and numbers to the same 1e12 cap", () => {
    expect(MAX_AMOUNT).toBe(1e12);
    expect(parseAmount(1e12)).toBe(1e12);
    expect(parseAmount("1,000,000,000,000")).toBe(1e12);
    expect(parseAmount("1000b")).toBe(1e12);
    expect(parseAmount(1e12 + 1)).toBeUndefined();
    expect(parseAmount("1000000000001")).toBeUndefined();
    expect(parseAmount("2000b")).toBeUndefined();
    expect(parseAmount("9".repeat(400))).toBeUndefined(); // Infinity once converted
    expect(amountHint("2000b")).toMatch(/1e12/);
  });

  it("reads any one currency sign like $, before or after the number", () => {
    for (const text of ["€4.5M", "£4,500,000", "¥4500000", "₹4.5M", "$ 4.5M", "4.5M €", "4,500,000£"]) expect(parseAmount(text), text).toBe(4_500_000);
    expect(parseAmount("$4.5M€")).toBeUndefined();
    expect(parseAmount("€€4.5M")).toBeUndefined();
    expect(parseAmount("€-1M")).toBeUndefined();
  });

  it("refuses digits in another base and leading zeros", () => {
    for (const text of ["0x1F", "0X1f", "0o17", "0b101", "017", "00.5M", "0,500", "1e6", "Infinity", "NaN"]) expect(parseAmount(text), text).toBeUndefined();
    expect(amountHint("0x1F")).toMatch(/decimal digits/);
    expect(parseAmount("0")).toBe(0);
    expect(parseAmount("0.5M")).toBe(500_000);
  });
});

describe("amounts in a scenario file", () => {
  const demo = readFileSync("scenarios/demo.yaml", "utf8").replace("../catalogs/", `${process.cwd()}/catalogs/`);
  const folder = mkdtempSync(join(tmpdir(), "averta-amount-"));
  const load = (budget: string) => {
    const file = join(folder, "s.yaml");
    writeFileSync(file, demo.replace(/^budget: 9\.7M$/m, `budget: ${budget}`));
    return loadScenario(file).scenario;
  };
  it("accept a currency sign other than $ (schema and reader agree)", () => {
    expect(load('"€9.7M"').budget).toBe(9_700_000);
  });
  it("refuse text over the cap and digits in another base, as bad-amount at the budget's line", () => {
    for (const text of ['"2000b"', '"0x1F"']) {
      try {
        load(text);
        expect.unreachable();
      } catch (error) {
        expect(error).toBeInstanceOf(InputError);
        expect((error as InputError).problems[0]).toMatchObject({ line: 16 });
      }
    }
  });
});
