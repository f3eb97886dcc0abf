/**
 * One line of a text progress bar, starting with a carriage return so each call overwrites the
 * last, e.g. "\r[##########----------]  50% 500/1000 draws". `width` is the bar's length in characters; `unit` names what is counted.
 */
export function progressBar(done: number, total: number, width = 30, unit = "draws"): string {
  const share = total > 0 ? Math.min(1, done / total) : 1;
  const filled = Math.round(share * width);
  return `\r[${"#".repeat(filled)}${"-".repeat(width - filled)}] ${String(Math.floor(share * 100)).padStart(3)}% ${done}/${total} ${unit}`;
}
