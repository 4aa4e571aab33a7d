/**
 * Which days a fit of case counts works in. A counts file with dates, read against a scenario with
 * a start date, is placed on the scenario's days: scenario day = date − startDate (whole days, the
 * start date is day 0), so the fitting window and the measures in force are looked up on the same
 * days as the model's. Counts dated before the start date have no scenario day and are refused,
 * naming their CSV line. Otherwise the file's own days are used: day 0 is its first date, or its
 * day numbers as written.
 */
import type { CsvProblem } from './caseCountsCsv.ts';
import type { CaseSeries } from './caseSeries.ts';
import { epochDayToIsoDate, isoDateToEpochDay } from './isoDate.ts';

/** What day 0 of a fit is: the scenario's start date, the first date of the counts file, or the file's day 0. */
export type DayOrigin = 'scenarioStartDate' | 'firstDateInFile' | 'fileDayNumbers';

export interface DayPlacement {
  origin: DayOrigin;
  /** ISO date of day 0, or null when the file gives day numbers. */
  dayZeroDate: string | null;
  /** Fit day = case-file day + shiftDays (0 unless placed on the scenario's days). */
  shiftDays: number;
  /** One plain sentence saying which days the fit uses. */
  note: string;
}

export type PlacementResult = { ok: true; series: CaseSeries; placement: DayPlacement } | { ok: false; problems: CsvProblem[] };

/** Places the series on the scenario's days when both have dates; else keeps the file's days. */
export function placeOnScenarioDays(series: CaseSeries, scenarioStartDate: string | null): PlacementResult {
  const fileStart = series.startDate === null ? null : isoDateToEpochDay(series.startDate);
  const scenarioStart = scenarioStartDate === null ? null : isoDateToEpochDay(scenarioStartDate);
  if (fileStart === null) {
    const note = scenarioStartDate === null ? 'Days are the day numbers of the counts file.' : `The counts file gives day numbers, not dates: they are taken as the scenario's days (day 0 = ${scenarioStartDate}).`;
    return { ok: true, series, placement: { origin: 'fileDayNumbers', dayZeroDate: scenarioStartDate, shiftDays: 0, note } };
  }
  if (scenarioStart === null || scenarioStartDate === null) {
    const note = `Days are counted from the first date of the counts file (day 0 = ${series.startDate}); the scenario has no start date.`;
    return { ok: true, series, placement: { origin: 'firstDateInFile', dayZeroDate: series.startDate, shiftDays: 0, note } };
  }
  const shiftDays = fileStart - scenarioStart;
  const early = series.rows.filter((row) => row.day + shiftDays < 0);
  if (early.length > 0) {
    const first = early[0];
    const last = early[early.length - 1];
    const which = early.length === 1 ? '' : `; lines ${first.line} to ${last.line} are (${early.length} rows)`;
    return {
      ok: false,
      problems: [
        {
          line: first.line,
          column: 'date',
          rule: `is before the scenario's start date ${scenarioStartDate}, so it has no scenario day${which}; drop those rows or set an earlier start date`,
          value: epochDayToIsoDate(fileStart + first.day),
        },
      ],
    };
  }
  return {
    ok: true,
    series: { ...series, rows: series.rows.map((row) => ({ ...row, day: row.day + shiftDays })), startDate: scenarioStartDate },
    placement: {
      origin: 'scenarioStartDate',
      dayZeroDate: scenarioStartDate,
      shiftDays,
      note: `Counts are placed on the scenario's days (day 0 = ${scenarioStartDate}); the file's first date ${series.startDate} is day ${shiftDays}.`,
    },
  };
}
