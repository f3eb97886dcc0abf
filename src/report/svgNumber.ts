/** A coordinate or tick value for SVG text: two decimals at most, no trailing zeros. */
export function svgNumber(value: number): string {
  return Number(value.toFixed(2)).toString();
}
