/**
 * What the Curves view draws for an option's measures: the days each phase was in force (a fixed
 * phase over its days, a triggered phase over the stretches its trigger kept it in force, from the
 * engine's results) and the trigger thresholds on the chart of the quantity they watch.
 */
import type { OptionResults, PolicyOption, TriggerQuantity } from '../../engine/index.ts';
import type { ShadedSpan } from './chartPlugins.ts';
import type { CurveMetric } from './seriesTotals.ts';

const FIXED_SHADE = 'rgba(120, 130, 145, 0.13)';
const TRIGGERED_SHADE = 'rgba(190, 120, 40, 0.16)';

/** Shaded stretches of one option's phases; triggered phases only where the run had them in force. */
export function phaseSpans(option: PolicyOption, result: OptionResults | null): ShadedSpan[] {
  return option.phases.flatMap((p, k): ShadedSpan[] => {
    const label = `${option.name} · phase ${k + 1}`;
    if (p.trigger === undefined) return [{ fromDay: p.fromDay, toDay: p.toDay, colour: FIXED_SHADE, label }];
    const periods = result?.triggers.find((t) => t.phase === k)?.periods ?? [];
    return periods.map((s) => ({ fromDay: s.fromDay, toDay: s.toDay, colour: TRIGGERED_SHADE, label: `${label} (triggered)` }));
  });
}

/** The chart a trigger quantity can be drawn on, and the factor from the trigger's unit to the chart's. */
function chartOf(quantity: TriggerQuantity, totalPopulation: number): { metric: CurveMetric; scale: number } | null {
  switch (quantity) {
    case 'icuOccupancy':
      return { metric: 'icuOccupancy', scale: 1 };
    case 'wardOccupancy':
      return { metric: 'wardOccupancy', scale: 1 };
    case 'dailyInfectionsPer100k':
      return { metric: 'incidence', scale: totalPopulation / 1e5 };
    default:
      // People infectious (I alone) and admissions have no chart of their own here.
      return null;
  }
}

export interface ThresholdLine {
  label: string;
  /** In the chart's unit. */
  y: number;
  dash: number[];
}

/** Switch-on and switch-off levels of the option's triggers that watch the charted quantity. */
export function thresholdLines(option: PolicyOption, metric: CurveMetric, totalPopulation: number): ThresholdLine[] {
  return option.phases.flatMap((p, k): ThresholdLine[] => {
    if (p.trigger === undefined) return [];
    const chart = chartOf(p.trigger.quantity, totalPopulation);
    if (chart === null || chart.metric !== metric) return [];
    return [
      { label: `Phase ${k + 1} switches on above`, y: p.trigger.onAbove * chart.scale, dash: [10, 3, 2, 3] },
      { label: `Phase ${k + 1} switches off below`, y: p.trigger.offBelow * chart.scale, dash: [1, 3] },
    ];
  });
}

/** Trigger quantities of the option that none of the Curves charts shows. */
export function unchartedTriggers(option: PolicyOption): TriggerQuantity[] {
  return [...new Set(option.phases.flatMap((p) => (p.trigger !== undefined && chartOf(p.trigger.quantity, 1) === null ? [p.trigger.quantity] : [])))];
}
