/**
 * chart.js plugin that shades day ranges (an option's phases) behind the lines.
 * Configured per chart through `options.plugins.phaseShading.spans`.
 */
import type { Chart, Plugin } from 'chart.js';

export interface ShadedSpan {
  fromDay: number;
  toDay: number;
  colour: string;
  label: string;
}

export interface PhaseShadingOptions {
  spans: ShadedSpan[];
}

declare module 'chart.js' {
  interface PluginOptionsByType<TType> {
    phaseShading?: PhaseShadingOptions;
  }
}

export const phaseShading: Plugin = {
  id: 'phaseShading',
  beforeDatasetsDraw(chart: Chart, _args, options: PhaseShadingOptions) {
    const spans = options?.spans ?? [];
    const x = chart.scales.x;
    const { top, bottom } = chart.chartArea;
    if (x === undefined || spans.length === 0) return;
    const ctx = chart.ctx;
    ctx.save();
    for (const span of spans) {
      const left = x.getPixelForValue(span.fromDay);
      const right = x.getPixelForValue(span.toDay);
      ctx.fillStyle = span.colour;
      ctx.fillRect(left, top, right - left, bottom - top);
      ctx.fillStyle = '#333';
      ctx.font = '12px system-ui, sans-serif';
      ctx.fillText(span.label, left + 4, top + 12);
    }
    ctx.restore();
  },
};
