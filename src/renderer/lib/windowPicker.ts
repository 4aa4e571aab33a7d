/**
 * chart.js plugin for picking a day window by dragging across a chart with a linear day axis:
 * shades the chosen window [fromDay, toDay] (both inclusive, so the shade runs to toDay + 1),
 * shows the range being dragged, and on release reports the whole days covered.
 * Configured per chart through `options.plugins.windowPicker`; the chart's `options.events`
 * must include mousedown, mousemove and mouseup.
 */
import type { Chart, ChartEvent, Plugin } from 'chart.js';

export interface WindowPickerOptions {
  fromDay: number;
  toDay: number;
  /** Lowest and highest day that may be picked. */
  minDay: number;
  maxDay: number;
  colour: string;
  onPick: (fromDay: number, toDay: number) => void;
}

declare module 'chart.js' {
  interface PluginOptionsByType<TType> {
    windowPicker?: WindowPickerOptions;
  }
}

/** The drag in progress on a chart: start and current day (fractional). */
const drags = new WeakMap<Chart, { start: number; current: number }>();

function dayAt(chart: Chart, event: ChartEvent): number | null {
  const x = chart.scales.x;
  if (x === undefined || event.x === null) return null;
  return x.getValueForPixel(event.x) ?? null;
}

function clampDay(day: number, o: WindowPickerOptions): number {
  return Math.max(o.minDay, Math.min(o.maxDay, Math.round(day)));
}

function shade(chart: Chart, from: number, toExclusive: number, colour: string): void {
  const x = chart.scales.x;
  const { top, bottom } = chart.chartArea;
  const left = x.getPixelForValue(from);
  const right = x.getPixelForValue(toExclusive);
  chart.ctx.fillStyle = colour;
  chart.ctx.fillRect(Math.min(left, right), top, Math.abs(right - left), bottom - top);
}

export const windowPicker: Plugin = {
  id: 'windowPicker',
  beforeDatasetsDraw(chart: Chart, _args, options: WindowPickerOptions) {
    if (chart.scales.x === undefined || options === undefined) return;
    chart.ctx.save();
    const drag = drags.get(chart);
    if (drag === undefined) shade(chart, options.fromDay - 0.5, options.toDay + 0.5, options.colour);
    else shade(chart, Math.min(drag.start, drag.current), Math.max(drag.start, drag.current), 'rgba(0, 114, 178, 0.28)');
    chart.ctx.restore();
  },
  afterEvent(chart: Chart, args, options: WindowPickerOptions) {
    if (options === undefined) return;
    const event = args.event;
    const day = dayAt(chart, event);
    const drag = drags.get(chart);
    if (event.type === 'mousedown' && day !== null && args.inChartArea) {
      drags.set(chart, { start: day, current: day });
      args.changed = true;
    } else if (event.type === 'mousemove' && drag !== undefined && day !== null) {
      drag.current = day;
      args.changed = true;
    } else if ((event.type === 'mouseup' || event.type === 'mouseout') && drag !== undefined) {
      drags.delete(chart);
      args.changed = true;
      const end = day ?? drag.current;
      const from = clampDay(Math.min(drag.start, end), options);
      const to = clampDay(Math.max(drag.start, end), options);
      if (to > from) options.onPick(from, to);
    }
  },
};
