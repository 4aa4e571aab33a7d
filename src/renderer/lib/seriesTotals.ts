/**
 * Daily series summed over age bands, for the Curves view. The engine stores series
 * band-major per day (`[d * bands + i]`, see results.ts); this only adds the bands up.
 */
import { totalOverBands, type DailySeries, type OptionResults } from '../../engine/index.ts';

export type CurveMetric = 'prevalence' | 'incidence' | 'deaths' | 'rt' | 'wardOccupancy' | 'icuOccupancy';

/** Metrics read from the engine's hospital series (only when the scenario has a hospital section). */
export const OCCUPANCY_METRICS: readonly CurveMetric[] = ['wardOccupancy', 'icuOccupancy'];

/**
 * The curve of one option for a metric: persons (prevalence), persons per day (incidence, deaths) or R(t).
 * R(t) and deaths are already one value per day in the engine's series (deaths: all bands together).
 */
export function curveOf(series: DailySeries, metric: Exclude<CurveMetric, 'wardOccupancy' | 'icuOccupancy'>): number[] {
  if (metric === 'rt' || metric === 'deaths') return Array.from(series[metric]);
  return Array.from(totalOverBands(series[metric], series.bands));
}

/** The curve of one option for any metric; beds in use come from the engine's hospital series (empty without one). */
export function curveOfOption(o: OptionResults, metric: CurveMetric): number[] {
  if (metric === 'wardOccupancy' || metric === 'icuOccupancy') return o.healthcare === null ? [] : Array.from(o.healthcare.series[metric]);
  return curveOf(o.series, metric);
}

export const METRIC_LABELS: Record<CurveMetric, { title: string; axis: string; short: string }> = {
  prevalence: { title: 'Infected now (latent or infectious)', axis: 'persons', short: 'Infected now' },
  incidence: { title: 'New infections per day', axis: 'persons per day', short: 'New infections' },
  deaths: { title: 'Deaths per day', axis: 'persons per day', short: 'Deaths' },
  rt: { title: 'R(t): reproduction number with current susceptibles and measures', axis: 'R(t)', short: 'R(t)' },
  wardOccupancy: { title: 'Ward beds in use, against ward capacity', axis: 'beds in use', short: 'Ward beds' },
  icuOccupancy: { title: 'ICU beds in use, against ICU capacity', axis: 'beds in use', short: 'ICU beds' },
};
