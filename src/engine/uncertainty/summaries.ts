/**
 * What the draws say, per option and outcome.
 *
 * - Sample quantile: definition 7 of Hyndman & Fan 1996 (Am Stat 50:361), linear interpolation
 *   between order statistics: h = (n - 1) p, Q(p) = x_(floor h) + (h - floor h)(x_(floor h + 1) - x_(floor h))
 *   on the sorted values (0-based).
 * - Interval at level L: { median: Q(1/2), low: Q((1 - L)/2), high: Q((1 + L)/2) }.
 * - Probability better than the reference: share of draws in which the option's value is strictly
 *   lower (lower is better for the outcomes compared) than the reference's in the same draw.
 * - Probability best: share of draws in which the option's value is the lowest of all options; a
 *   draw in which k options tie for the lowest counts 1/k for each, so the shares add up to 1.
 */

export interface Interval {
  median: number;
  low: number;
  high: number;
}

/** Q(p) of values sorted ascending (definition 7). */
export function sortedQuantile(sorted: ArrayLike<number>, p: number): number {
  const h = (sorted.length - 1) * p;
  const k = Math.floor(h);
  if (k + 1 >= sorted.length) return sorted[sorted.length - 1];
  return sorted[k] + (h - k) * (sorted[k + 1] - sorted[k]);
}

/** The interval of `values` at `level`; null when there are none or any is NaN (the outcome does not exist in every draw). */
export function intervalOf(values: ArrayLike<number>, level: number): Interval | null {
  if (values.length === 0) return null;
  const sorted = Float64Array.from(values).sort();
  if (Number.isNaN(sorted[sorted.length - 1])) return null;
  return { median: sortedQuantile(sorted, 0.5), low: sortedQuantile(sorted, (1 - level) / 2), high: sortedQuantile(sorted, (1 + level) / 2) };
}

/** Share of paired draws with option < reference. */
export function probabilityLower(option: ArrayLike<number>, reference: ArrayLike<number>): number {
  let lower = 0;
  for (let i = 0; i < option.length; i++) if (option[i] < reference[i]) lower++;
  return option.length === 0 ? 0 : lower / option.length;
}

/** For each option, the share of draws in which it is lowest (ties split evenly). `byOption[k][i]` = option k, draw i. */
export function probabilityLowest(byOption: readonly ArrayLike<number>[]): number[] {
  const draws = byOption[0]?.length ?? 0;
  const share = byOption.map(() => 0);
  for (let i = 0; i < draws; i++) {
    let best = Infinity;
    for (const values of byOption) best = Math.min(best, values[i]);
    const winners = byOption.map((values, k) => (values[i] === best ? k : -1)).filter((k) => k >= 0);
    for (const k of winners) share[k] += 1 / winners.length;
  }
  return share.map((x) => (draws === 0 ? 0 : x / draws));
}
