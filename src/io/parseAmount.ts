const SUFFIX: Readonly<Record<string, number>> = { k: 1e3, m: 1e6, b: 1e9 };

/** Largest money amount accepted, in currency units (the schemas' `maximum` for numbers). */
export const MAX_AMOUNT = 1e12;

// Plain digits, or digits grouped in threes by commas or underscores (4,500,000 or 4_500_000),
// with an optional decimal point. A comma anywhere else is refused: in much of the world it is the
// decimal mark, so "4,5M" must not silently become 45M. No leading zeros ("017" could be read as
// octal) and nothing but decimal digits, so "0x1F", "0o17" and "0b101" are refused. One currency
// sign (any Unicode currency symbol: $, €, £, ¥, ₹, …) may stand before or after the number.
const AMOUNT = /^\s*(\p{Sc})?\s*(0|[1-9][0-9]*|[1-9][0-9]{0,2}(?:,[0-9]{3})+|[1-9][0-9]{0,2}(?:_[0-9]{3})+)(\.[0-9]+)?\s*([kKmMbB]?)\s*(\p{Sc})?\s*$/u;

/**
 * Reads a money amount written as 4500000, "4,500,000", "4.5M", "750k", "$4,500,000", "€4.5M",
 * "4.5M £" or "1.2b", up to MAX_AMOUNT (1e12). Returns undefined when the text is not an amount:
 * negative, not finite, over the cap, not in decimal digits, with two currency signs, or with a
 * comma that does not separate groups of three digits (the decimal comma in "4,5M").
 */
export function parseAmount(input: number | string): number | undefined {
  const value = typeof input === "number" ? input : amountValue(input);
  return value !== undefined && Number.isFinite(value) && value >= 0 && value <= MAX_AMOUNT ? value : undefined;
}

/** The value of amount text before the cap, or undefined when it is not written as an amount. */
function amountValue(text: string): number | undefined {
  const match = AMOUNT.exec(text);
  if (!match || (match[1] !== undefined && match[5] !== undefined)) return undefined;
  const digits = match[2]!.replace(/[,_]/g, "") + (match[3] ?? "");
  const value = Number(digits) * (SUFFIX[match[4]!.toLowerCase()] ?? 1);
  // Round to a hundredth of a unit so "4.1M" is 4100000, not 4099999.999...
  return Math.round(value * 100) / 100;
}

/**
 * Why `text` is not an amount, as a hint a user can act on: a decimal comma, a list of amounts
 * in one value, a minus sign, a value over the cap, digits in another base, or (otherwise) the
 * accepted forms.
 */
export function amountHint(text: string): string {
  if (/^\s*\p{Sc}?\s*[0-9]+,[0-9]{1,2}\s*[kKmMbB]?\s*\p{Sc}?\s*$/u.test(text)) return "write decimals with a point, e.g. 4.5M; a comma only separates thousands, as in 4,500,000";
  if (/[0-9.][kKmMbB]?\s*[,;]\s*\p{Sc}?[0-9]/u.test(text) && /[kKmMbB.]\s*[,;]/.test(text)) return "give one amount per option, e.g. --budget 5M --budget 9.7M";
  if (/^\s*\p{Sc}?\s*-/u.test(text)) return "an amount cannot be negative; write 4500000, 4.5M or 750k";
  if (/^\s*\p{Sc}?\s*0[xXoObB][0-9a-fA-F]/u.test(text) || /^\s*\p{Sc}?\s*0[0-9]/u.test(text)) return "write the amount in decimal digits without leading zeros, e.g. 4500000 or 4.5M";
  const value = amountValue(text);
  if (value !== undefined && value > MAX_AMOUNT) return `amounts above ${MAX_AMOUNT.toLocaleString("en-US")} (1e12) are refused; check the units`;
  return "write 4500000, 4,500,000, 4.5M or 750k, with at most one currency sign such as $ or €";
}
