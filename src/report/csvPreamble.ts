import { toCsv } from "./toCsv.js";

/** How many lines every averta CSV opens with before its column header (readers skip them). */
export const CSV_PREAMBLE_LINES = 2;

/**
 * The two lines every averta CSV opens with: what the file is (command, scenario, the run's
 * facts) and the units of its columns. Each line is one CSV field starting with "#", with line
 * breaks and controls in user text turned to spaces, so it always spans one physical line and a
 * reader can skip exactly two (`pandas.read_csv(f, skiprows=2)`, R `read.csv(f, skip = 2)`).
 */
export function csvPreamble(about: readonly string[], units: readonly string[]): string {
  const line = (parts: readonly string[]) => toCsv([parts.map(oneLine).join(" | ")], []);
  return line(["# averta", ...about]) + line(["# units", ...units]);
}

const BREAKS = /[\u0000-\u001f\u007f-\u009f\u2028\u2029]+/g;

function oneLine(text: string): string {
  return text.replace(BREAKS, " ");
}
