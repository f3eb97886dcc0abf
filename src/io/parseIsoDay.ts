import { parseCrashDate } from "./parseCrashDate.js";

const MS_PER_DAY = 86_400_000;

/**
 * The day number (days since 1970-01-01) of an ISO date written YYYY-MM-DD, or undefined when the
 * text has another form or names no real day of the Gregorian calendar (2019-02-29, 2020-13-01),
 * or a year outside 1900–2100, the years a crash date may have (see parseCrashDate).
 * @example parseIsoDay("1970-01-02") → 1
 */
export function parseIsoDay(text: string): number | undefined {
  // parseCrashDate also reads 2020/06/30 and date-times; a projects file writes plain ISO days.
  if (!/^\d{4}-\d{2}-\d{2}$/.test(text)) return undefined;
  const date = parseCrashDate(text, "ymd");
  return date === undefined ? undefined : Date.UTC(date.year, date.month - 1, date.day) / MS_PER_DAY;
}

/**
 * The day number of the same calendar day `years` years after `day` (29 February, in a year
 * without it, becomes 1 March), so a period from `day` covers whole years up to the day before.
 * @example sameDayYearsLater(parseIsoDay("2020-07-01")!, 1) === parseIsoDay("2021-07-01")
 */
export function sameDayYearsLater(day: number, years: number): number {
  const date = new Date(day * MS_PER_DAY);
  return Date.UTC(date.getUTCFullYear() + years, date.getUTCMonth(), date.getUTCDate()) / MS_PER_DAY;
}

/** The ISO text (YYYY-MM-DD) of a day number. @example isoDayText(1) → "1970-01-02" */
export function isoDayText(day: number): string {
  return new Date(day * MS_PER_DAY).toISOString().slice(0, 10);
}
