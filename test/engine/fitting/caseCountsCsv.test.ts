import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { dailyTotals, fitGrowth, formatCsvProblem, isoDateToEpochDay, parseCaseCountsCsv, type CaseCsvResult } from '../../../src/engine/fitting/index.ts';
import { MAX_DATA_ROWS, MAX_GAP_DAYS } from '../../../src/engine/fitting/caseCountsCsv.ts';

function messages(result: CaseCsvResult): string[] {
  if (result.ok) throw new Error('expected the file to be rejected');
  return result.problems.map(formatCsvProblem);
}

describe('case-count CSV import', () => {
  it('reads dates as day numbers from the earliest date, with BOM, CRLF, blank lines and semicolons', () => {
    const text = '\uFEFFDate;Count\r\n2031-03-01;2\r\n\r\n2031-03-02;0\r\n;\r\n2031-03-03;4\r\n';
    const result = parseCaseCountsCsv(text);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.series.startDate).toBe('2031-03-01');
    expect(result.series.rows.map((r) => [r.day, r.count, r.line])).toEqual([
      [0, 2, 2],
      [1, 0, 4],
      [2, 4, 6],
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

  it('reads a long file row by row (no call-stack limit) and fits it', () => {
    const rows = 150_000;
    const lines = ['day,count'];
    for (let d = 0; d < rows; d++) lines.push(`${d},${(d % 7) + 1}`);
    const parsed = parseCaseCountsCsv(lines.join('\n'));
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    const fit = fitGrowth(dailyTotals(parsed.series), { toDay: 60 });
    expect(fit.ok).toBe(true);
    if (fit.ok) expect(fit.fit.fromDay).toBe(0);
  });

  it('refuses more than MAX_DATA_ROWS rows with one line', () => {
    const text = `day,count\n${Array.from({ length: MAX_DATA_ROWS + 1 }, (_, d) => `${d},1`).join('\n')}`;
    expect(messages(parseCaseCountsCsv(text))).toEqual(['file: must have at most 200,000 data rows (has 200,001); keep the weeks you fit']);
  });

  it('refuses a mistyped year (2031 -> 2013) naming its line, once', () => {
    const dates = Array.from({ length: 10 }, (_, k) => `2031-03-${String(k + 1).padStart(2, '0')}`);
    dates[5] = '2013-03-06';
    const text = `date,count\n${dates.map((d, k) => `${d},${10 + k}`).join('\n')}`;
    expect(messages(parseCaseCountsCsv(text))).toEqual([
      'line 7, column "date": must not be earlier than the date on line 6 (2031-03-05); sort the rows by date, got "2013-03-06"',
    ]);
    // The same typo on the first row is a gap forward.
    const first = `date,count\n2013-03-01,1\n${dates.slice(1, 5).map((d) => `${d},3`).join('\n')}`;
    expect(messages(parseCaseCountsCsv(first))).toEqual([
      `line 3, column "date": is 6575 days after the date on line 2 (2013-03-01); gaps over ${MAX_GAP_DAYS} days are refused (check for a mistyped year or month), got "2031-03-02"`,
    ]);
  });

  it('accepts rows of one day for several bands, and a gap of exactly MAX_GAP_DAYS', () => {
    const ok = parseCaseCountsCsv(`day,count,band\n0,1,a\n0,2,b\n${MAX_GAP_DAYS},3,a\n${MAX_GAP_DAYS},1,b\n`);
    expect(ok.ok).toBe(true);
    expect(messages(parseCaseCountsCsv(`day,count\n0,1\n${MAX_GAP_DAYS + 1},3\n`))[0]).toMatch(/^line 3, column "day": is 29 days after the day on line 2/);
  });

  it('lists at most 20 problems and counts the rest', () => {
    const text = `day,count\n${Array.from({ length: 50 }, (_, d) => `${d},-1`).join('\n')}`;
    const lines = messages(parseCaseCountsCsv(text));
    expect(lines).toHaveLength(21);
    expect(lines[20]).toBe('file: has 30 more problems not listed');
  });

  it('accepts the valid date 0001-01-01 and still refuses dates that do not exist', () => {
    expect(isoDateToEpochDay('0001-01-01')).toBe(-719162);
    // Day counts checked with Python's datetime.date (proleptic Gregorian calendar).
    expect(isoDateToEpochDay('0099-12-31')).toBe(-683004);
    expect(isoDateToEpochDay('0001-02-29')).toBeNull();
    const parsed = parseCaseCountsCsv('date,count\n0001-01-01,1\n0001-01-02,2\n');
    expect(parsed.ok && parsed.series.startDate).toBe('0001-01-01');
  });

  it('gives a clear reason for a one-row file and for an all-zero file', () => {
    const one = parseCaseCountsCsv('date,count\n2031-03-01,5\n');
    expect(one.ok).toBe(true);
    if (!one.ok) return;
    const single = fitGrowth(dailyTotals(one.series));
    expect(!single.ok && single.problems).toEqual([{ field: 'counts', rule: 'must cover at least 2 days to show growth (the file has counts for day 0 only)' }]);
    const zeros = parseCaseCountsCsv('day,count\n0,0\n1,0\n2,0\n');
    if (!zeros.ok) throw new Error('expected a readable file');
    const none = fitGrowth(dailyTotals(zeros.series));
    expect(!none.ok && none.problems[0].rule).toBe('must include some cases: all 3 days have 0, so there is no growth to fit');
  });
});
