/**
 * Daily series summed over age bands, for the Curves view. The engine stores series
 * band-major per day (`[d * bands + i]`, see results.ts); this only adds the bands up.
 */
import type { DailySeries } from '../../engine/results.ts';

export type CurveMetric = 'prevalence' | 'incidence' | 'deaths' | 'rt';

/** Total over bands for each day: a series of length days+1 (prevalence) or days (incidence, deaths). */
export function totalOverBands(values: Float64Array, bands: number): number[] {
  const days = values.length / bands;
  const out = new Array<number>(days);
  for (let d = 0; d < days; d++) {
    let sum = 0;
    for (let i = 0; i < bands; i++) sum += values[d * bands + i];
    out[d] = sum;
  }
  return out;
}

/** The curve of one option for a metric: persons (prevalence), persons per day (incidence, deaths) or R(t). */
export function curveOf(series: DailySeries, metric: CurveMetric): number[] {
  if (metric === 'rt') return Array.from(series.rt);
  return totalOverBands(series[metric], series.bands);
}

export const METRIC_LABELS: Record<CurveMetric, { title: string; axis: string }> = {
  prevalence: { title: 'Infected now (latent or infectious)', axis: 'persons' },
  incidence: { title: 'New infections per day', axis: 'persons per day' },
  deaths: { title: 'Deaths per day', axis: 'persons per day' },
  rt: { title: 'R(t): reproduction number with current susceptibles and measures', axis: 'R(t)' },
};
