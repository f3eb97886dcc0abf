import { describe, expect, it } from "vitest";
import { amountHint, parseAmount } from "../../src/io/parseAmount.js";

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
});
