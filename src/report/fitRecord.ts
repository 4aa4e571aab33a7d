/**
 * The fit record (disease.fitRecord, src/engine/fitting/fitRecord.ts) as rows of the report's
 * parameter table, printed right under the R0 assumption: where the counts came from, the
 * window, the count model, the growth rate r, doubling time and R0 with their 95% intervals,
 * and the measures divided out. Nothing is re-computed here: every figure is the record's.
 * An interval end stored as null is unbounded ("no bound").
 */
import { fitRecordMatches, type FitRecord, type Scenario } from '../engine/index.ts';
import type { ParameterRow } from './reportTypes.ts';
import { print } from './numberFormat.ts';

/** Source column of every fit row. */
export const FIT_SOURCE = 'Fit to daily case counts (fit record in the scenario file)';
/** Printed when the scenario's transmission is no longer the R0 the fit gave. */
export const R0_CHANGED_AFTER_FIT = 'R0 was changed after the fit';

/** "[lower] to [upper]" with "no bound" for a null end. */
export function intervalText(interval: readonly [number | null, number | null], format: (x: number) => string): string {
  const end = (x: number | null): string => (x === null ? 'no bound' : format(x));
  return `${end(interval[0])} to ${end(interval[1])}`;
}

/** The count model in words: "Poisson", "negative binomial, with day-of-week factors". */
export function countModelText(record: FitRecord): string {
  const family = record.family === 'poisson' ? 'Poisson' : 'negative binomial';
  return record.dayOfWeek ? `${family}, with day-of-week factors` : family;
}

/** The window: its dates when day 0 has one, with the day numbers (and whose days they are), days used and cases. */
export function fitWindowText(record: FitRecord): string {
  const w = record.window;
  const numbers = `${w.fromDay} to ${w.toDay}`;
  const days =
    w.dayOrigin === 'scenarioStartDate' ? `scenario days ${numbers}` : w.dayOrigin === 'firstDateInFile' ? `days ${numbers} counted from the file's first date` : w.dayOrigin === 'fileDayNumbers' ? `day numbers ${numbers} as the file gives them` : `days ${numbers}`;
  const span = w.fromDate !== undefined && w.toDate !== undefined ? `${w.fromDate} to ${w.toDate} (${days})` : days;
  const used = w.daysUsed === undefined ? '' : `; ${w.daysUsed} ${w.daysUsed === 1 ? 'day' : 'days'} used`;
  const cases = w.cases === undefined ? '' : `; ${print.persons(w.cases)} cases`;
  return `${span}${used}${cases}`;
}

const rate = (x: number): string => print.decimal(x, 4);
const days = (x: number): string => print.decimal(x, 1);

/** Dispersion of the counts as one line of small print; '' when the record has none. */
export function dispersionText(record: FitRecord): string {
  const d = record.dispersion;
  if (d === undefined) return '';
  const parts: string[] = [];
  if (d.pearsonRatio !== null) parts.push(`Pearson dispersion ratio of the Poisson fit ${print.decimal(d.pearsonRatio, 2)} (1 = Poisson variance)`);
  if (d.negativeBinomialAlpha !== null) parts.push(`negative-binomial alpha ${d.negativeBinomialAlpha.toPrecision(3)} (variance = mean + alpha mean^2)`);
  return parts.length === 0 ? '' : `Dispersion: ${parts.join('; ')}.`;
}

/**
 * Rows for the fit record of `scenario`, or none when it has no record. The first row says
 * when R0 was changed after the fit (transmission no longer the record's R0, fitRecordMatches).
 */
export function fitRecordRows(scenario: Scenario): ParameterRow[] {
  const record = scenario.disease.fitRecord;
  if (record === undefined) return [];
  const rows: ParameterRow[] = [];
  const add = (parameter: string, value: string, unit: string, smallPrint?: string) =>
    rows.push({ parameter, value, unit, source: FIT_SOURCE, ...(smallPrint ? { smallPrint } : {}) });
  if (!fitRecordMatches(scenario.disease.transmission, record)) {
    add(R0_CHANGED_AFTER_FIT, `the fit gave R0 = ${print.r(record.r0)}; the scenario now uses the value above`, '');
  }
  add('Fit: case-count file', record.sourceFile, '');
  add('Fit: window', fitWindowText(record), 'days, both ends included');
  add('Fit: count model', countModelText(record), '', dispersionText(record));
  add(
    'Fit: growth rate r',
    `${rate(record.growthRatePerDay)} (95% interval ${intervalText(record.growthRateInterval, rate)}; ${record.intervalMethod})`,
    'per day',
  );
  const doubling = record.doublingTimeDays === null ? 'none (not growing)' : days(record.doublingTimeDays);
  const doublingInterval = record.doublingTimeInterval === null ? '' : ` (95% interval ${intervalText(record.doublingTimeInterval, days)})`;
  add('Fit: doubling time', `${doubling}${doublingInterval}`, 'days');
  add('Fit: R0', `${print.r(record.r0)} (95% interval ${intervalText(record.r0Interval, print.r)})`, 'per case');
  const m = record.measures;
  if (m !== undefined) {
    const phase = m.phaseFromDay === null || m.phaseToDay === null ? 'no phase in force' : `days ${m.phaseFromDay} to ${m.phaseToDay - 1}`;
    add(
      'Fit: measures divided out',
      `option "${m.option}" (${phase}): ratio ${m.ratio.toPrecision(3)}, R in window ${print.r(m.reproductionNumberInWindow)}`,
      'ratio; per case',
      record.measuresNote,
    );
  } else if (record.measuresNote.trim() !== '') {
    add('Fit: measures divided out', 'none', '', record.measuresNote);
  }
  return rows;
}
