/** How the day, month and year of a crash date are ordered: ymd 2024-03-31, dmy 31/03/2024, mdy 03/31/2024. */
export type DateFormat = "ymd" | "dmy" | "mdy";
export const DATE_FORMATS: readonly DateFormat[] = ["ymd", "dmy", "mdy"];

/** How each format is written, for messages. */
export const DATE_FORMAT_EXAMPLES: Readonly<Record<DateFormat, string>> = {
  ymd: "YYYY-MM-DD (or YYYY/MM/DD, YYYY.MM.DD, or an ISO date-time such as 2024-03-31T14:05:00Z)",
  dmy: "DD/MM/YYYY (or DD-MM-YYYY, DD.MM.YYYY)",
  mdy: "MM/DD/YYYY (or MM-DD-YYYY, MM.DD.YYYY)",
};

/** A calendar date as written (a time or time-zone offset after it does not shift it). */
export interface CalendarDate {
  readonly year: number;
  readonly month: number;
  readonly day: number;
}

/** Earliest and latest years read as crash dates; anything else is a typo or a placeholder. */
export const FIRST_CRASH_YEAR = 1900;
export const LAST_CRASH_YEAR = 2100;

// An optional time after the date: hh:mm, seconds and fractions, AM/PM, and a zone (Z, ±hh, ±hh:mm, ±hhmm).
const TIME = String.raw`(?:[T ](\d{1,2}):(\d{2})(?::(\d{2})(?:\.\d+)?)?(?: ?([AaPp][Mm]))?(?:Z|[+-](\d{2})(?::?(\d{2}))?)?)?`;
const YEAR_FIRST = new RegExp(String.raw`^(\d{4})([-/.])(\d{1,2})\2(\d{1,2})${TIME}$`);
const YEAR_LAST = new RegExp(String.raw`^(\d{1,2})([-/.])(\d{1,2})\2(\d{4})${TIME}$`);

/** The shape of a date's text: year first, year last (day and month in some order), or neither. */
export type DateShape =
  | { readonly kind: "year-first" }
  | { readonly kind: "year-last"; readonly first: number; readonly second: number }
  | { readonly kind: "none" };

/** Which of the accepted shapes `text` has, before any check that it is a real date. */
export function dateShape(text: string): DateShape {
  if (YEAR_FIRST.test(text)) return { kind: "year-first" };
  const match = YEAR_LAST.exec(text);
  return match ? { kind: "year-last", first: Number(match[1]), second: Number(match[3]) } : { kind: "none" };
}

/**
 * Reads a crash date in `format`, checking it is a real day of the Gregorian calendar (no 31/02,
 * 29 February only in leap years), a year from 1900 to 2100, and any time after it a real time of
 * day. Returns undefined for anything else.
 * @example parseCrashDate("31.03.2024 17:45", "dmy") → { year: 2024, month: 3, day: 31 }
 */
export function parseCrashDate(text: string, format: DateFormat): CalendarDate | undefined {
  const match = (format === "ymd" ? YEAR_FIRST : YEAR_LAST).exec(text);
  if (!match) return undefined;
  const [a, b, c] = [Number(match[1]), Number(match[3]), Number(match[4])];
  const date = format === "ymd" ? { year: a, month: b, day: c } : format === "dmy" ? { year: c, month: b, day: a } : { year: c, month: a, day: b };
  if (date.year < FIRST_CRASH_YEAR || date.year > LAST_CRASH_YEAR || date.month < 1 || date.month > 12) return undefined;
  if (date.day < 1 || date.day > daysInMonth(date.year, date.month)) return undefined;
  return validTime(match) ? date : undefined;
}

/** Days in a month of the Gregorian calendar (leap years: divisible by 4, centuries only by 400). */
function daysInMonth(year: number, month: number): number {
  if (month === 2) return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0 ? 29 : 28;
  return [4, 6, 9, 11].includes(month) ? 30 : 31;
}

function validTime(match: RegExpExecArray): boolean {
  if (match[5] === undefined) return true;
  const hours = Number(match[5]);
  const minutes = Number(match[6]);
  const seconds = match[7] === undefined ? 0 : Number(match[7]);
  const twelveHour = match[8] !== undefined;
  const hoursOk = twelveHour ? hours >= 1 && hours <= 12 : hours <= 23;
  // 60 seconds: a leap second (ISO 8601).
  const zoneOk = match[9] === undefined || (Number(match[9]) <= 23 && (match[10] === undefined || Number(match[10]) <= 59));
  return hoursOk && minutes <= 59 && seconds <= 60 && zoneOk;
}
