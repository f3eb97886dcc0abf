/** Short axis label for an amount: 2500000 → "2.5M", 750000 → "750k", 40 → "40". */
export function compactAmount(amount: number): string {
  const size = Math.abs(amount);
  const [divisor, suffix] = size >= 1e9 ? [1e9, "bn"] : size >= 1e6 ? [1e6, "M"] : size >= 1e3 ? [1e3, "k"] : [1, ""];
  return `${Number((amount / divisor).toPrecision(3))}${suffix}`;
}
