/**
 * A series of observed case counts by day (and optionally by age band), as imported from CSV.
 * Day 0 is the first date of the file (or day number 0 when the file gives day numbers).
 */

/** One data row: `count` cases on `day` (whole days), in `band` if the file has a band column. */
export interface CaseRow {
  day: number;
  count: number;
  band: string | null;
  /** 1-based line of the CSV file the row came from, for messages. */
  line: number;
}

export interface CaseSeries {
  rows: CaseRow[];
  /** ISO date of day 0 when the file gave dates, else null (the file gave day numbers). */
  startDate: string | null;
  /** Whether the file had a band column. */
  hasBands: boolean;
}

/** Daily totals over bands, ordered by day: the series the growth fit uses. */
export interface DailyCounts {
  day: number[];
  count: number[];
}

/** Sums the rows of each day over bands and sorts by day (days without a row are left out, not zero). */
export function dailyTotals(series: CaseSeries): DailyCounts {
  const byDay = new Map<number, number>();
  for (const row of series.rows) byDay.set(row.day, (byDay.get(row.day) ?? 0) + row.count);
  const days = [...byDay.keys()].sort((a, b) => a - b);
  return { day: days, count: days.map((d) => byDay.get(d) as number) };
}
