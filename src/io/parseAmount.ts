const SUFFIX: Readonly<Record<string, number>> = { k: 1e3, m: 1e6, b: 1e9 };

/**
 * Reads a money amount written as 4500000, "4.5M", "750k", "$4,500,000" or "1.2b".
 * Returns undefined when the text is not an amount (or is negative or not finite).
 */
export function parseAmount(input: number | string): number | undefined {
  if (typeof input === "number") return Number.isFinite(input) && input >= 0 ? input : undefined;
  const match = /^\s*\$?\s*([0-9][0-9,_]*(?:\.[0-9]+)?)\s*([kKmMbB]?)\s*$/.exec(input);
  if (!match) return undefined;
  const digits = match[1]!.replace(/[,_]/g, "");
  const value = Number(digits) * (SUFFIX[match[2]!.toLowerCase()] ?? 1);
  // Round to a hundredth of a unit so "4.1M" is 4100000, not 4099999.999...
  return Number.isFinite(value) ? Math.round(value * 100) / 100 : undefined;
}
