/**
 * The chart configuration of the "Fit from counts" panel: observed daily counts as points, the
 * fitted expected counts as a line with its pointwise 95% band, on a linear or log count axis,
 * with the fitting window shaded and pickable by dragging (windowPicker.ts).
 */
import type { ChartConfiguration } from 'chart.js';
import type { DailyCounts, FittedPoint } from '../../engine/index.ts';
import { windowPicker } from './windowPicker.ts';

export interface CountsChartInput {
  counts: DailyCounts;
  fitted: FittedPoint[] | null;
  fromDay: number;
  toDay: number;
  logScale: boolean;
  /** ISO date of day 0, for the axis title, or null. */
  startDate: string | null;
  onPick: (fromDay: number, toDay: number) => void;
}

const COUNT_COLOUR = '#444444';
const FIT_COLOUR = '#D55E00';
const BAND_FILL = 'rgba(213, 94, 0, 0.18)';

export function countsChartConfig(input: CountsChartInput): ChartConfiguration {
  const { counts, fitted } = input;
  const days = counts.day;
  const minDay = Math.min(...days);
  const maxDay = Math.max(...days);
  // A log axis cannot show 0: zero counts are left off it (said in the legend).
  const points = days.map((d, i) => ({ x: d, y: counts.count[i] })).filter((p) => !input.logScale || p.y > 0);
  const curve = (pick: (p: FittedPoint) => number) => (fitted ?? []).map((p) => ({ x: p.day, y: pick(p) }));
  return {
    type: 'line',
    data: {
      datasets: [
        { label: input.logScale ? 'Daily cases (zeros not shown on log scale)' : 'Daily cases', data: points, showLine: false, pointRadius: 3, pointBackgroundColor: COUNT_COLOUR, borderColor: COUNT_COLOUR },
        { label: '95% band (lower)', data: curve((p) => p.lower), borderWidth: 0, pointRadius: 0, fill: false },
        { label: 'Fitted 95% band', data: curve((p) => p.upper), borderWidth: 0, pointRadius: 0, backgroundColor: BAND_FILL, fill: '-1' },
        { label: 'Fitted expected cases', data: curve((p) => p.expected), borderColor: FIT_COLOUR, borderWidth: 2, pointRadius: 0, fill: false },
      ],
    },
    options: {
      parsing: false,
      events: ['mousedown', 'mousemove', 'mouseup', 'mouseout'],
      interaction: { mode: 'nearest', intersect: false },
      scales: {
        x: { type: 'linear', min: minDay - 0.5, max: maxDay + 0.5, title: { display: true, text: input.startDate ? `Day (day 0 = ${input.startDate})` : 'Day' }, ticks: { precision: 0, callback: (v) => (Number.isInteger(v) ? String(v) : '') } },
        y: { type: input.logScale ? 'logarithmic' : 'linear', ...(input.logScale ? {} : { min: 0 }), title: { display: true, text: 'Cases per day' } },
      },
      plugins: {
        legend: { labels: { filter: (item) => item.text !== '95% band (lower)' } },
        tooltip: { enabled: false },
        windowPicker: { fromDay: input.fromDay, toDay: input.toDay, minDay, maxDay, colour: 'rgba(0, 114, 178, 0.10)', onPick: input.onPick },
      },
    },
    plugins: [windowPicker],
  };
}
