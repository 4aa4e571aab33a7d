/**
 * The Spread view's content, as pure functions of the engine's results and the draws' summary:
 * per outcome the interval of each option (an interval plot: the interval as a bar, its median
 * and the value at the scenario's own inputs as marks) and the ranking of the uncertain inputs by
 * their partial rank correlation with the outcome (PRCC; Blower & Dowlatabadi 1994, Int Stat Rev
 * 62:229), put in words. Charts are greyscale-friendly: bars and marks differ by shape and shade.
 */
import type { ChartConfiguration } from 'chart.js';
import type { ScenarioResults, SensitivityEntry, UncertaintyResults } from '../../engine/index.ts';
import { formatAxisValue, formatInterval, formatValue, screen } from '../../report/numberFormat.ts';
import { outcome, outcomesFor, valueContextOf, type Outcome } from '../../report/outcomes.ts';
import { parameterLabel } from './uncertaintyEdits.ts';

/** Board outcomes that have an interval for some option (in the board's order). */
export function spreadOutcomes(results: ScenarioResults, draws: UncertaintyResults): Outcome[] {
  return outcomesFor(results, 'board').filter((e) => draws.options.some((o) => o.intervals[e.key] != null));
}

/** Outcomes the draws rank the inputs for (those compared draw by draw). */
export function rankedOutcomes(draws: UncertaintyResults): string[] {
  return [...new Set(draws.sensitivity.map((s) => s.outcome))];
}

export interface SpreadRow {
  option: string;
  /** Value at the scenario's own inputs (the board's number), or null. */
  value: number | null;
  median: number | null;
  low: number | null;
  high: number | null;
  /** "8,150 (6,900–9,700)" or "—". */
  text: string;
  valueText: string;
}

export function spreadRows(entry: Outcome, results: ScenarioResults, draws: UncertaintyResults): SpreadRow[] {
  const context = valueContextOf(results);
  return results.options.map((o, k) => {
    const interval = draws.options[k]?.intervals[entry.key] ?? null;
    const value = entry.read(o, results);
    return {
      option: o.name,
      value,
      median: interval?.median ?? null,
      low: interval?.low ?? null,
      high: interval?.high ?? null,
      text: interval === null ? '—' : formatInterval(entry, interval, 'screen', context),
      valueText: value === null ? '—' : formatValue(entry, value, 'screen', context),
    };
  });
}

const BAR = 'rgba(90, 98, 108, 0.45)';
const BAR_EDGE = '#3b4148';
const MEDIAN = '#111111';
const POINT = '#ffffff';

/** Interval plot: one floating bar per option from low to high, the median as a bold dash, the scenario's value as a hollow circle. */
export function spreadChartConfig(entry: Outcome, rows: readonly SpreadRow[], levelText: string): ChartConfiguration {
  const labels = rows.map((r) => r.option);
  return {
    type: 'bar',
    data: {
      labels,
      datasets: [
        { type: 'bar', label: `${levelText} interval`, data: rows.map((r) => (r.low === null || r.high === null ? null : [r.low, r.high])) as never, backgroundColor: BAR, borderColor: BAR_EDGE, borderWidth: 1, barPercentage: 0.5 },
        { type: 'line', label: 'Median of the draws', data: rows.map((r) => r.median), showLine: false, pointStyle: 'line', pointRadius: 16, pointHoverRadius: 16, borderColor: MEDIAN, borderWidth: 3, backgroundColor: MEDIAN },
        { type: 'line', label: "At the scenario's own inputs", data: rows.map((r) => r.value), showLine: false, pointStyle: 'circle', pointRadius: 5, borderColor: MEDIAN, borderWidth: 2, backgroundColor: POINT },
      ],
    },
    options: {
      scales: {
        x: { ticks: { autoSkip: false } },
        y: { beginAtZero: false, title: { display: true, text: `${entry.label}${entry.unit ? ` (${entry.unit})` : ''}` }, ticks: { callback: (v) => formatAxisValue(Number(v)) } },
      },
      plugins: { legend: { labels: { usePointStyle: true } }, tooltip: { enabled: true } },
    },
  };
}

/** The option's PRCCs for one outcome, largest in size first (undefined ones last). */
export function ranking(draws: UncertaintyResults, option: string, outcomeKey: string): SensitivityEntry[] {
  return draws.sensitivity
    .filter((s) => s.option === option && s.outcome === outcomeKey)
    .sort((a, b) => Math.abs(b.prcc ?? -1) - Math.abs(a.prcc ?? -1));
}

/** PRCC of this size or more counts as a clear driver (common practice for PRCC screens). */
export const CLEAR_DRIVER = 0.2;

/** "+0.93" / "−0.41" */
export const prccText = (x: number | null): string => (x === null ? 'not defined (the outcome does not vary)' : `${x >= 0 ? '+' : '−'}${Math.abs(x).toFixed(2)}`);

/**
 * The ranking in words: "R0 explains most of the spread in deaths under “No measures” (PRCC +0.93);
 * next come Infectious period (days) (+0.41) and Work contacts factor (−0.20)."
 */
export function sensitivityWords(entries: readonly SensitivityEntry[], option: string, outcomeKey: string): string {
  const what = outcome(outcomeKey).label.toLowerCase();
  const defined = entries.filter((e): e is SensitivityEntry & { prcc: number } => e.prcc !== null);
  if (defined.length === 0) return `The ${what} under “${option}” do not vary over the draws, so no input can be ranked.`;
  const [top, ...rest] = defined;
  if (Math.abs(top.prcc) < CLEAR_DRIVER) return `No uncertain input stands out for ${what} under “${option}”: every PRCC is below ${CLEAR_DRIVER} in size (largest: ${parameterLabel(top.parameter)}, ${prccText(top.prcc)}).`;
  const next = rest.filter((e) => Math.abs(e.prcc) >= CLEAR_DRIVER).slice(0, 2);
  const direction = top.prcc > 0 ? 'more' : 'fewer';
  const then = next.length === 0 ? '' : `; next ${next.length === 1 ? 'comes' : 'come'} ${next.map((e) => `${parameterLabel(e.parameter)} (${prccText(e.prcc)})`).join(' and ')}`;
  return `${parameterLabel(top.parameter)} explains most of the spread in ${what} under “${option}” (PRCC ${prccText(top.prcc)}: higher values, ${direction} ${what})${then}.`;
}

/** Horizontal bars of PRCC per input, from −1 to 1; positive bars dark, negative light and outlined (they differ in grey too). */
export function sensitivityChartConfig(entries: readonly SensitivityEntry[], outcomeKey: string): ChartConfiguration {
  const shown = entries.filter((e) => e.prcc !== null);
  return {
    type: 'bar',
    data: {
      labels: shown.map((e) => parameterLabel(e.parameter)),
      datasets: [
        {
          label: `PRCC with ${outcome(outcomeKey).label.toLowerCase()}`,
          data: shown.map((e) => e.prcc),
          backgroundColor: shown.map((e) => ((e.prcc ?? 0) >= 0 ? '#3b4148' : '#d5d9de')),
          borderColor: '#3b4148',
          borderWidth: 1,
        },
      ],
    },
    options: {
      indexAxis: 'y',
      scales: { x: { min: -1, max: 1, title: { display: true, text: 'Partial rank correlation (PRCC), −1 to +1' } }, y: { ticks: { autoSkip: false } } },
      plugins: { legend: { display: false } },
    },
  };
}

/** Chance text for a share of draws: "87 %". */
export const chanceText = (p: number | undefined | null): string => (p === undefined || p === null ? '—' : screen.percent(p));
