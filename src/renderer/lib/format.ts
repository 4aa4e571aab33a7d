/**
 * Number formatting for views: sensible units and precision, one place for all views.
 * Views never compute model quantities; they only format what the engine returned.
 */

const grouped = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });

/** R values: two decimals (e.g. "1.23"). */
export function formatR(r: number): string {
  return Number.isFinite(r) ? r.toFixed(2) : '–';
}

/** A fraction as a percentage: "12.3 %" (one decimal; below 0.1 % two significant digits). */
export function formatPercent(fraction: number): string {
  if (!Number.isFinite(fraction)) return '–';
  const pct = fraction * 100;
  if (pct !== 0 && Math.abs(pct) < 0.001) return pct > 0 ? '< 0.001 %' : '> −0.001 %';
  if (pct !== 0 && Math.abs(pct) < 0.1) return `${pct.toPrecision(2)} %`;
  return `${pct.toFixed(1)} %`;
}

/** Persons, rounded to whole people and grouped: "12,345"; millions shortened: "1.23 M". */
export function formatPersons(persons: number): string {
  if (!Number.isFinite(persons)) return '–';
  if (Math.abs(persons) >= 1e6) return `${(persons / 1e6).toFixed(2)} M`;
  return grouped.format(Math.round(persons));
}

/** Growth rate per day as a percentage per day: "+8.4 %/day". */
export function formatGrowthRate(perDay: number): string {
  if (!Number.isFinite(perDay)) return '–';
  const pct = perDay * 100;
  return `${pct >= 0 ? '+' : '−'}${Math.abs(pct).toFixed(1)} %/day`;
}

/** Days with one decimal: "8.3 days". */
export function formatDays(days: number): string {
  return Number.isFinite(days) ? `${days.toFixed(1)} days` : '–';
}

/** Doubling or halving time, whichever applies. */
export function formatDoublingOrHalving(doubling: number | null, halving: number | null): string {
  if (doubling !== null) return `doubles in ${formatDays(doubling)}`;
  if (halving !== null) return `halves in ${formatDays(halving)}`;
  return 'flat';
}

/** A signed change in persons: "−1,234" / "+56". */
export function formatSignedPersons(delta: number): string {
  if (!Number.isFinite(delta)) return '–';
  const sign = delta > 0.5 ? '+' : delta < -0.5 ? '−' : '±';
  return `${sign}${formatPersons(Math.abs(delta))}`;
}

/** A signed relative change: "−23.4 %". */
export function formatSignedPercent(relative: number | null): string {
  if (relative === null || !Number.isFinite(relative)) return '–';
  const pct = relative * 100;
  const sign = pct > 0.05 ? '+' : pct < -0.05 ? '−' : '±';
  return `${sign}${Math.abs(pct).toFixed(1)} %`;
}

/** Relative change of `value` against `reference`: (v − ref) / |ref|; null when ref is 0. */
export function relativeChange(value: number, reference: number): number | null {
  return reference === 0 ? (value === 0 ? 0 : null) : (value - reference) / Math.abs(reference);
}

/** Beds in use against beds available: "4,311 / 110 beds". */
export function formatBedsAgainstCapacity(inUse: number, capacity: number): string {
  return `${formatPersons(inUse)} / ${formatPersons(capacity)} beds`;
}

/** A count per 1,000 doses, one decimal: "4.1 per 1,000 doses". */
export function formatPer1000Doses(value: number | null): string {
  return value === null || !Number.isFinite(value) ? '—' : `${value.toFixed(1)} per 1,000 doses`;
}
