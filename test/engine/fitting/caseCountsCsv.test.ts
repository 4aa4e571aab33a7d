import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { dailyTotals, formatCsvProblem, parseCaseCountsCsv, type CaseCsvResult } from '../../../src/engine/fitting/index.ts';

function messages(result: CaseCsvResult): string[] {
  if (result.ok) throw new Error('expected the file to be rejected');
  return result.problems.map(formatCsvProblem);
}

describe('case-count CSV import', () => {
  it('reads dates as day numbers from the earliest date, with BOM, CRLF, blank lines and semicolons', () => {
    const text = '\uFEFFDate;Count\r\n2031-03-03;4\r\n\r\n2031-03-01;2\r\n;\r\n2031-03-02;0\r\n';
    const result = parseCaseCountsCsv(text);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.series.startDate).toBe('2031-03-01');
    expect(result.series.rows.map((r) => [r.day, r.count, r.line])).toEqual([
      [2, 4, 2],
      [0, 2, 4],
      [1, 0, 6],
    ]);
    expect(dailyTotals(result.series)).toEqual({ day: [0, 1, 2], count: [2, 0, 4] });
  });

  it('counts days across a month and a leap day', () => {
    const result = parseCaseCountsCsv('date,count\n2032-02-28,1\n2032-03-01,2\n');
    expect(result.ok && result.series.rows.map((r) => r.day)).toEqual([0, 2]);
  });

  it('reads day numbers, headerless files and quoted fields', () => {
    const a = parseCaseCountsCsv('day,cases\n0,5\n1,"7"\n');
    expect(a.ok && a.series.rows.map((r) => [r.day, r.count])).toEqual([
      [0, 5],
      [1, 7],
    ]);
    expect(a.ok && a.series.startDate).toBe(null);
    const b = parseCaseCountsCsv('2031-01-05,3\n2031-01-06,4\n');
    expect(b.ok && b.series.rows.map((r) => [r.day, r.count])).toEqual([
      [0, 3],
      [1, 4],
    ]);
  });

  it('sums a band column into daily totals', () => {
    const result = parseCaseCountsCsv('band,day,count\n0-19,0,3\n20+,0,5\n0-19,1,4\n20+,1,"6"\n');
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.series.hasBands).toBe(true);
    expect(dailyTotals(result.series)).toEqual({ day: [0, 1], count: [8, 10] });
  });

  it('rejects negative, non-integer, non-numeric and missing counts, naming line and column', () => {
    const text = 'date,count\n2031-03-01,4\n2031-03-02,-3\n\n2031-03-03,2.5\n2031-03-04,many\n2031-03-05,\n';
    expect(messages(parseCaseCountsCsv(text))).toEqual([
      'line 3, column "count": must be >= 0, got "-3"',
      'line 5, column "count": must be a whole number, got "2.5"',
      'line 6, column "count": must be a number, got "many"',
      'line 7, column "count": is missing (must be a whole number >= 0)',
    ]);
  });

  it('rejects a decimal comma in a semicolon file as not a number', () => {
    expect(messages(parseCaseCountsCsv('day;count\n0;12,5\n'))).toEqual(['line 2, column "count": must be a number, got "12,5"']);
  });

  it('rejects bad dates, mixed date and day numbers, repeats and wrong field counts', () => {
    expect(messages(parseCaseCountsCsv('date,count\n2031-02-29,1\n'))).toEqual([
      'line 2, column "date": must be a calendar date written YYYY-MM-DD, got "2031-02-29"',
    ]);
    expect(messages(parseCaseCountsCsv('2031-03-01,1\n3,2\n'))).toEqual([
      'line 2, column "date": must be a calendar date written YYYY-MM-DD, got "3"',
    ]);
    expect(messages(parseCaseCountsCsv('day,count\n1,1\n2031-03-01,2\n'))).toEqual([
      'line 3, column "day": must be a whole day number (the column holds day numbers, not dates), got "2031-03-01"',
    ]);
    expect(messages(parseCaseCountsCsv('day,count\n1,1\n1,2\n'))).toEqual(['line 3, column "day": repeats this day (first given on line 2)']);
    expect(messages(parseCaseCountsCsv('day,count\n1,1,9\n'))[0]).toMatch(/^line 2: must have 2 fields separated by ","/);
  });

  it('rejects unknown or missing header columns and empty files', () => {
    expect(messages(parseCaseCountsCsv('when,count\n1,2\n'))).toEqual([
      'line 1, column "when": is not a known column (expected date or day, count or cases, optional band)',
      'line 1, column "date": header must have exactly one date or day column',
    ]);
    expect(messages(parseCaseCountsCsv('\uFEFF\n\n'))).toEqual(['file: has no data rows']);
    expect(messages(parseCaseCountsCsv('day,count\n'))).toEqual(['file: has a header but no data rows']);
  });

  it('ships a readable example file (resources/example-cases.csv)', () => {
    const result = parseCaseCountsCsv(readFileSync(new URL('../../../resources/example-cases.csv', import.meta.url), 'utf8'));
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.series.rows.length).toBeGreaterThanOrEqual(28);
    expect(result.series.rows.every((r, i) => r.day === i)).toBe(true);
  });
});
