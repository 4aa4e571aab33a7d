/** Phase days with their dates, and dates typed in the measures editor turned into scenario days. */
import { describe, expect, it } from 'vitest';
import { dayOfDate, phaseDaysText } from '../../src/renderer/lib/phaseDates.ts';

describe('phase dates', () => {
  it('writes both ends with their dates, across a leap day and a year end', () => {
    expect(phaseDaysText(21, 76, null)).toBe('days 21–76');
    // 2028 is a leap year: 2028-02-08 + 21 = 2028-02-29; + 76 = 2028-04-24.
    expect(phaseDaysText(21, 76, '2028-02-08')).toBe('days 21–76 (2028-02-29 to 2028-04-24)');
    expect(phaseDaysText(0, 1, '2027-12-31')).toBe('days 0–1 (2027-12-31 to 2028-01-01)');
  });

  it('turns a date into its scenario day (date − start date), before day 0 negative', () => {
    expect(dayOfDate('2028-02-08', '2028-02-29')).toBe(21);
    expect(dayOfDate('2028-02-28', '2028-03-01')).toBe(2);
    expect(dayOfDate('2027-02-28', '2027-03-01')).toBe(1);
    expect(dayOfDate('2031-03-01', '2031-02-20')).toBe(-9);
    expect(dayOfDate('2031-03-01', '2031-02-30')).toBeNull();
  });
});
