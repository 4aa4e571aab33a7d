/**
 * What the options board shows of the draws (the scenario's uncertainty section): the interval
 * under each cell, written by the one formatter (numberFormat.ts, `formatInterval`) with the
 * catalogue's format of the row, and the rows of chances (paired draws: each option against the
 * reference under the same draw). Only formats what the engine's summary holds.
 */
import type { ScenarioResults, UncertaintyResults } from '../../engine/index.ts';
import { formatInterval, screen } from '../../report/numberFormat.ts';
import { isReferenceCell, outcome, valueContextOf, type Outcome } from '../../report/outcomes.ts';

/** "8,150 (6,900–9,700)": median and interval (without the unit, which the value above carries) of row `entry` for option `o` over the draws; null when there is none. */
export function cellInterval(entry: Outcome, o: number, draws: UncertaintyResults, results: ScenarioResults): string | null {
  const option = results.options[o];
  if (option === undefined || isReferenceCell(entry, option, results)) return null;
  const interval = draws.options[o]?.intervals[entry.key];
  if (interval === null || interval === undefined) return null;
  // The unit is already written after the cell's own value above.
  return formatInterval({ ...entry, unit: '' }, interval, 'screen', valueContextOf(results));
}

export interface ChanceRow {
  key: string;
  label: string;
  hint: string;
  /** The share of draws per option (null in the reference's column of a comparison with the reference). */
  values: (number | null)[];
}

const FEWER: Record<string, string> = {
  deaths: 'fewer deaths',
  infections: 'fewer infections',
  admissions: 'fewer hospital admissions',
  peakIcuOccupancy: 'a lower ICU peak',
};

/**
 * The chance rows: for each outcome the draws compare, the share of draws in which the option does
 * better than the reference; then the chance of the fewest deaths of all options.
 */
export function chanceRows(draws: UncertaintyResults, referenceIndex: number): ChanceRow[] {
  const keys = Object.keys(draws.options[0]?.probabilityBetterThanReference ?? {});
  const n = draws.uncertainty.draws - draws.uncertainty.failedDraws;
  const rows: ChanceRow[] = keys.map((key) => {
    const words = FEWER[key] ?? `a lower ${outcome(key).label.toLowerCase()}`;
    return {
      key: `better-${key}`,
      label: `Chance of ${words} than the reference`,
      hint: `Share of the ${screen.persons(n)} draws in which this option gives ${words} than the reference option under the same draw (paired comparison).`,
      values: draws.options.map((o, k) => (k === referenceIndex ? null : (o.probabilityBetterThanReference[key] ?? null))),
    };
  });
  if (keys.includes('deaths')) {
    rows.push({
      key: 'best-deaths',
      label: 'Chance of the fewest deaths of all options',
      hint: `Share of the ${screen.persons(n)} draws in which this option gives the fewest deaths of all options (ties shared).`,
      values: draws.options.map((o) => o.probabilityBest.deaths ?? null),
    });
  }
  return rows;
}
