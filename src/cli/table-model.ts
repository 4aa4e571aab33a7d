/**
 * The printed layout shared by the plain-text and Markdown formats: a heading block, the
 * options table (one row per option), two by-band tables (one column per option) and notes.
 */
import { decimal, doublingText, percent, persons } from './numbers.ts';
import type { OptionsReport } from './options-report.ts';
import { reciprocityNotes } from './reciprocity-notes.ts';

export interface TextTable {
  caption: string;
  header: string[];
  rows: string[][];
  /** Columns aligned left (text); the others are numbers, aligned right. */
  leftColumns: number;
}

export interface PrintedReport {
  title: string;
  facts: string[];
  tables: TextTable[];
  notes: string[];
  caution: string;
}

export function printedReport(report: OptionsReport): PrintedReport {
  const optionsTable: TextTable = {
    caption: 'Policy options',
    header: ['Option', 'R at start', 'Growth per day', 'Doubling time (days)', 'Peak day', 'Peak prevalence', 'Infections', 'Attack rate', 'Deaths'],
    leftColumns: 1,
    rows: report.options.map((o) => [
      o.name,
      decimal(o.rStart, 2),
      decimal(o.growthRatePerDay, 3),
      doublingText(o.doublingTimeDays, o.halvingTimeDays),
      String(o.peakDay),
      percent(o.peakPrevalence, 2),
      persons(o.infections),
      percent(o.attackRate),
      persons(o.deaths),
    ]),
  };
  const byBand = (caption: string, cell: (o: OptionsReport['options'][number], i: number) => string): TextTable => ({
    caption,
    header: ['Age band', ...report.options.map((o) => o.name)],
    leftColumns: 1,
    rows: report.ageBands.map((band, i) => [band, ...report.options.map((o) => cell(o, i))]),
  });
  const notes = reciprocityNotes(report.reciprocity);
  return {
    title: report.title,
    facts: [
      `R0 (no measures): ${decimal(report.r0, 2)}`,
      `Horizon: ${report.horizonDays} days`,
      `Reference option: ${report.referenceOption}`,
    ],
    tables: [
      optionsTable,
      byBand('Attack rate by age band', (o, i) => percent(o.attackRateByBand[i])),
      byBand('Deaths by age band', (o, i) => persons(o.deathsByBand[i])),
    ],
    notes,
    caution: report.caution,
  };
}
