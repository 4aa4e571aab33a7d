/** The one number formatter: the app's screen style against the printed style, and kinds. */
import { describe, expect, it } from 'vitest';
import { formatAxisValue, formatInterval, formatValue, NOT_A_NUMBER, print, screen } from '../../src/report/numberFormat.ts';

describe('screen style (the app)', () => {
  it('shortens millions, groups thousands and uses a true minus sign', () => {
    expect(screen.persons(1_264_000)).toBe('1.26 M');
    expect(screen.persons(8297.66)).toBe('8,298');
    expect(screen.signedPersons(-53.2)).toBe('\u221253');
    expect(screen.signedPersons(0.2)).toBe('±0');
    expect(screen.percent(0.8336)).toBe('83.4 %');
    expect(screen.percent(0.00042)).toBe('0.042 %');
    expect(screen.growthRate(-0.02)).toBe('\u22122.0 %/day');
    expect(screen.doublingOrHalving(null, 9.31)).toBe('halves in 9.3 days');
  });
});

describe('print style (report, CLI tables, Markdown)', () => {
  it('writes whole numbers in full with ASCII signs and no spaces before %', () => {
    expect(print.persons(1_264_000)).toBe('1,264,000');
    expect(print.signedPersons(-53.2)).toBe('-53');
    expect(print.signedPersons(53.2)).toBe('+53');
    expect(print.percent(0.8336)).toBe('83.4%');
    expect(print.growthRate(0.147)).toBe('+0.147');
    expect(print.growthRate(-0.0001)).toBe('-0.000');
    expect(print.doublingOrHalving(4.71, null)).toBe('4.7');
    expect(print.doublingOrHalving(null, null)).toBe('flat');
    expect(print.multiplier(1 / 3)).toBe('33.3%');
  });

  it('prints non-finite numbers as a dash in both styles', () => {
    for (const f of [screen, print]) {
      expect(f.persons(Number.NaN)).toBe(NOT_A_NUMBER);
      expect(f.percent(Number.POSITIVE_INFINITY)).toBe(NOT_A_NUMBER);
    }
  });
});

describe('formatValue by kind', () => {
  it('adds the unit on screen and leaves it to the row label in print', () => {
    expect(formatValue({ kind: 'count', unit: 'persons' }, 1_264_000, 'screen')).toBe('1.26 M persons');
    expect(formatValue({ kind: 'count', unit: 'persons' }, 1_264_000, 'print')).toBe('1,264,000');
    expect(formatValue({ kind: 'change', unit: 'persons' }, -12, 'screen')).toBe('\u221212 persons');
    expect(formatValue({ kind: 'ratio', unit: 'per 1,000 doses', digits: 1 }, 4.105, 'screen')).toBe('4.1 per 1,000 doses');
    expect(formatValue({ kind: 'ratio' }, 2.49997, 'print')).toBe('2.50');
    expect(formatValue({ kind: 'days' }, 1, 'screen')).toBe('1 day');
    expect(formatValue({ kind: 'days' }, 12, 'print')).toBe('12');
    expect(formatValue({ kind: 'day' }, 45, 'screen')).toBe('day 45');
    expect(formatValue({ kind: 'fraction' }, 0.25, 'print')).toBe('25.0%');
  });

  it('writes an interval like its value', () => {
    const interval = { median: 1234, low: 1100.4, high: 1400.6 };
    expect(formatInterval({ kind: 'count', unit: 'persons' }, interval, 'screen')).toBe('1,234 persons (1,100–1,401)');
    expect(formatInterval({ kind: 'count', unit: 'persons' }, interval, 'print')).toBe('1,234 (1,100 to 1,401)');
    expect(formatInterval({ kind: 'fraction' }, { median: 0.5, low: 0.45, high: 0.55 }, 'print')).toBe('50.0% (45.0% to 55.0%)');
  });

  it('says "to" on screen when a bound carries a sign, so the dash never reads as a minus', () => {
    expect(formatInterval({ kind: 'change', unit: 'persons' }, { median: -53, low: -195, high: -7 }, 'screen')).toBe('−53 persons (−195 to −7)');
  });

  it('writes a day of the horizon as its date when the start date is known', () => {
    expect(formatValue({ kind: 'date' }, 45, 'screen', { startDate: '2026-02-01' })).toBe('2026-03-18');
    expect(formatValue({ kind: 'date' }, 0, 'print', { startDate: '2024-02-29' })).toBe('2024-02-29');
    expect(formatValue({ kind: 'date' }, 365, 'print', { startDate: '2023-03-01' })).toBe('2024-02-29');
    expect(formatValue({ kind: 'date' }, 45, 'screen')).toBe('day 45');
    expect(formatValue({ kind: 'date' }, 45, 'print', { startDate: '2026-02-30' })).toBe('45');
    expect(formatInterval({ kind: 'date' }, { median: 10, low: 5, high: 20 }, 'print', { startDate: '2026-12-25' })).toBe('2027-01-04 (2026-12-30 to 2027-01-14)');
  });

  it('shortens axis values', () => {
    expect([0, 950, 12_345, 1_500_000, 0.25].map(formatAxisValue)).toEqual(['0', '950', '12k', '1.5M', '0.25']);
  });
});
