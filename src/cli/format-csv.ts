/**
 * CSV rendering (RFC 4180: comma separator, CRLF line ends, quotes doubled): one row per
 * option, full-precision numbers, by-band columns named after the band labels. Empty cell = none
 * (e.g. no doubling time when not growing).
 */
import type { OptionsReport, OptionRow } from './options-report.ts';

function field(value: string | number | null): string {
  if (value === null) return '';
  const text = String(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

const SCALAR_COLUMNS: [string, (o: OptionRow) => string | number | null][] = [
  ['option', (o) => o.name],
  ['r_start', (o) => o.rStart],
  ['growth_rate_per_day', (o) => o.growthRatePerDay],
  ['doubling_time_days', (o) => o.doublingTimeDays],
  ['halving_time_days', (o) => o.halvingTimeDays],
  ['peak_day', (o) => o.peakDay],
  ['peak_prevalence', (o) => o.peakPrevalence],
  ['infections', (o) => o.infections],
  ['attack_rate', (o) => o.attackRate],
  ['deaths', (o) => o.deaths],
];

export function formatCsv(report: OptionsReport): string {
  const header = [
    ...SCALAR_COLUMNS.map(([name]) => name),
    ...report.ageBands.map((band) => `attack_rate ${band}`),
    ...report.ageBands.map((band) => `deaths ${band}`),
  ];
  const rows = report.options.map((o) => [
    ...SCALAR_COLUMNS.map(([, value]) => value(o)),
    ...o.attackRateByBand,
    ...o.deathsByBand,
  ]);
  return [header, ...rows].map((row) => row.map(field).join(',')).join('\r\n') + '\r\n';
}
