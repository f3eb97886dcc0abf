const SUFFIX: Readonly<Record<string, number>> = { k: 1e3, m: 1e6, b: 1e9 };

// Plain digits, or digits grouped in threes by commas or underscores (4,500,000 or 4_500_000),
// with an optional decimal point. A comma anywhere else is refused: in much of the world it is the
// decimal mark, so "4,5M" must not silently become 45M.
const AMOUNT = /^\s*\$?\s*([0-9]+|[0-9]{1,3}(?:,[0-9]{3})+|[0-9]{1,3}(?:_[0-9]{3})+)(\.[0-9]+)?\s*([kKmMbB]?)\s*$/;

/**
 * Reads a money amount written as 4500000, "4,500,000", "4.5M", "750k", "$4,500,000" or "1.2b".
 * Returns undefined when the text is not an amount (negative, not finite, or with a comma that
 * does not separate groups of three digits, such as the decimal comma in "4,5M").
 */
export function parseAmount(input: number | string): number | undefined {
  if (typeof input === "number") return Number.isFinite(input) && input >= 0 ? input : undefined;
  const match = AMOUNT.exec(input);
  if (!match) return undefined;
  const digits = match[1]!.replace(/[,_]/g, "") + (match[2] ?? "");
  const value = Number(digits) * (SUFFIX[match[3]!.toLowerCase()] ?? 1);
  // Round to a hundredth of a unit so "4.1M" is 4100000, not 4099999.999...
  return Number.isFinite(value) ? Math.round(value * 100) / 100 : undefined;
}

/**
 * Why `text` is not an amount, as a hint a user can act on: a decimal comma, a list of amounts
 * in one value, a minus sign, or (otherwise) the accepted forms.
 */
export function amountHint(text: string): string {
  if (/^\s*\$?\s*[0-9]+,[0-9]{1,2}\s*[kKmMbB]?\s*$/.test(text)) return "write decimals with a point, e.g. 4.5M; a comma only separates thousands, as in 4,500,000";
  if (/[0-9.][kKmMbB]?\s*[,;]\s*\$?[0-9]/.test(text) && /[kKmMbB.]\s*[,;]/.test(text)) return "give one amount per option, e.g. --budget 5M --budget 9.7M";
  if (/^\s*-/.test(text)) return "an amount cannot be negative; write 4500000, 4.5M or 750k";
  return "write 4500000, 4,500,000, 4.5M or 750k";
}
