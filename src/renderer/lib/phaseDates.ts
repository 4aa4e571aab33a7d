/**
 * Calendar dates for the measures editor when the scenario has a start date (day 0): a phase's
 * days with their dates, and the scenario day of a date typed in a date field
 * (day = date − startDate, whole days; the same convention as the fit and every table).
 */
import { isoDateToEpochDay } from '../../engine/index.ts';
import { dateOfDay } from '../../report/numberFormat.ts';

/** "days 21–76", or "days 21–76 (2031-03-22 to 2031-05-16)" with a start date; both ends included. */
export function phaseDaysText(firstDay: number, lastDay: number, startDate: string | null): string {
  const days = `days ${firstDay}–${lastDay}`;
  if (startDate === null) return days;
  const from = dateOfDay(startDate, firstDay);
  const to = dateOfDay(startDate, lastDay);
  return from === null || to === null ? days : `${days} (${from} to ${to})`;
}

/** The scenario day of `date` (YYYY-MM-DD), or null when either is not a calendar date. */
export function dayOfDate(startDate: string, date: string): number | null {
  const start = isoDateToEpochDay(startDate);
  const at = isoDateToEpochDay(date);
  return start === null || at === null ? null : at - start;
}
