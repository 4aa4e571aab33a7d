/**
 * Calendar dates written as ISO 8601 calendar dates, YYYY-MM-DD (ISO 8601-1:2019, extended format),
 * turned into whole day numbers. Pure arithmetic on the proleptic Gregorian calendar, no time zones.
 */

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;
const MS_PER_DAY = 86_400_000;

/**
 * Days since 1970-01-01 for a valid `YYYY-MM-DD` date (a whole number, can be negative),
 * or null when the text is not a real calendar date (e.g. `2024-02-30`, `2024-2-3`).
 */
export function isoDateToEpochDay(text: string): number | null {
  const m = ISO_DATE.exec(text);
  if (m === null) return null;
  const year = Number(m[1]);
  const month = Number(m[2]);
  const day = Number(m[3]);
  // Date.UTC reads years 0-99 as 1900-1999: set the full year on its own so 0001-01-01 is year 1.
  const back = new Date(Date.UTC(2000, month - 1, day));
  back.setUTCFullYear(year, month - 1, day);
  const ms = back.getTime();
  if (back.getUTCFullYear() !== year || back.getUTCMonth() !== month - 1 || back.getUTCDate() !== day) return null;
  return ms / MS_PER_DAY;
}

/** The `YYYY-MM-DD` text of a day counted from 1970-01-01 (inverse of `isoDateToEpochDay`). */
export function epochDayToIsoDate(epochDay: number): string {
  return new Date(epochDay * MS_PER_DAY).toISOString().slice(0, 10);
}
