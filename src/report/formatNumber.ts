/** Formats money as a whole number with thousands separators, e.g. 4500000 → "4,500,000". */
export function formatMoney(amount: number): string {
  if (!Number.isFinite(amount)) return amount > 0 ? "∞" : "–";
  return Math.round(amount).toLocaleString("en-US");
}

/** Formats a count or ratio with fixed decimals; infinities and NaN as dashes or ∞. */
export function formatFixed(value: number, decimals: number): string {
  if (Number.isNaN(value)) return "–";
  if (!Number.isFinite(value)) return value > 0 ? "∞" : "–";
  return value.toLocaleString("en-US", { minimumFractionDigits: decimals, maximumFractionDigits: decimals });
}

/** A plain number for JSON: infinities and NaN become null (JSON has no Infinity). */
export function jsonNumber(value: number): number | null {
  return Number.isFinite(value) ? value : null;
}
