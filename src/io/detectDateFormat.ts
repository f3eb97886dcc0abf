import { DATE_FORMAT_EXAMPLES, dateShape, type DateFormat } from "./parseCrashDate.js";

/** A date value of a crash file and the line it is on. */
export interface DatedLine {
  readonly text: string;
  readonly line: number;
}

/** The date format a crash file uses, or why it cannot be told (with the line that shows it). */
export type DateFormatDetection =
  | { readonly ok: true; readonly format: DateFormat }
  | { readonly ok: false; readonly line: number; readonly message: string; readonly hint: string };

/**
 * Tells a file's date format from all its dates. Year-first dates (2024-03-31, an ISO date-time)
 * mean ymd. Year-last dates are day-first (dmy) when some date's first number is over 12, and
 * month-first (mdy) when some date's second number is over 12. It refuses, rather than guess: a
 * file that mixes year-first and year-last dates, or day-first and month-first ones, and a file of
 * year-last dates none of which has a number over 12 (03/04/2022 is 3 April or 4 March). Values of
 * neither shape do not count (they are rejected later as invalid dates); with none of either
 * shape it answers ymd. Cost O(rows).
 */
export function detectDateFormat(dates: Iterable<DatedLine>): DateFormatDetection {
  let yearFirst: DatedLine | undefined;
  let yearLast: DatedLine | undefined;
  let dayFirst: DatedLine | undefined;
  let monthFirst: DatedLine | undefined;
  let ambiguous: DatedLine | undefined;
  for (const date of dates) {
    const shape = dateShape(date.text);
    if (shape.kind === "year-first") yearFirst ??= date;
    else if (shape.kind === "year-last") {
      yearLast ??= date;
      if (shape.first > 12 && shape.second <= 12) dayFirst ??= date;
      else if (shape.second > 12 && shape.first <= 12) monthFirst ??= date;
      else if (shape.first !== shape.second) ambiguous ??= date;
    }
  }
  const choose = "pass --date-format ymd, dmy or mdy; rows in another format are then rejected with their lines";
  if (yearFirst && yearLast) {
    const [early, late] = yearFirst.line < yearLast.line ? [yearFirst, yearLast] : [yearLast, yearFirst];
    return { ok: false, line: late.line, message: `dates are written in two ways: '${early.text}' (line ${early.line}) and '${late.text}' (line ${late.line})`, hint: choose };
  }
  if (!yearLast) return { ok: true, format: "ymd" };
  if (dayFirst && monthFirst) {
    return { ok: false, line: Math.max(dayFirst.line, monthFirst.line), message: `some dates are day-first ('${dayFirst.text}', line ${dayFirst.line}) and some month-first ('${monthFirst.text}', line ${monthFirst.line})`, hint: choose };
  }
  if (dayFirst) return { ok: true, format: "dmy" };
  if (monthFirst) return { ok: true, format: "mdy" };
  if (ambiguous) {
    return {
      ok: false,
      line: ambiguous.line,
      message: `dates such as '${ambiguous.text}' may be day-first or month-first, and no date in the file has a day over 12 to tell which`,
      hint: `pass --date-format dmy for ${DATE_FORMAT_EXAMPLES.dmy} or --date-format mdy for ${DATE_FORMAT_EXAMPLES.mdy}`,
    };
  }
  // Every date has its day equal to its month: both readings give the same dates.
  return { ok: true, format: "dmy" };
}
