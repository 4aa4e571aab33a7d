/**
 * The design of the growth regression over a window of days:
 *
 *   ln E[y_t] = a + r (t - t̄) + sum_{k=1..6} d_k [weekday class of t = k]
 *
 * t in days, r per day, t̄ the mean day of the window (centring keeps the normal equations well
 * conditioned and does not change r). The weekday class of day t is (t - fromDay) mod 7, so class 0
 * (the reference, factor 1) is the weekday of the first day of the window; exp(d_k) is the
 * multiplicative reporting factor of class k relative to it.
 */

export interface GrowthDesign {
  /** Rows [1, t - t̄, class indicators...]; column 1 is the growth rate. */
  x: number[][];
  centreDay: number;
  dayOfWeek: boolean;
}

/** Weekday class 0..6 of `day`, counted from `fromDay`. */
export function weekdayClass(day: number, fromDay: number): number {
  return (((day - fromDay) % 7) + 7) % 7;
}

/** One design row for day `day`. */
export function designRow(day: number, centreDay: number, dayOfWeek: boolean, fromDay: number): number[] {
  const row = [1, day - centreDay];
  if (dayOfWeek) {
    const c = weekdayClass(day, fromDay);
    for (let k = 1; k < 7; k++) row.push(c === k ? 1 : 0);
  }
  return row;
}

export function growthDesign(days: readonly number[], fromDay: number, dayOfWeek: boolean): GrowthDesign {
  const centreDay = days.reduce((s, d) => s + d, 0) / days.length;
  return { x: days.map((d) => designRow(d, centreDay, dayOfWeek, fromDay)), centreDay, dayOfWeek };
}

/**
 * For profiling r: the design without the growth-rate column (the same at every r, so made once)
 * and, per r, the offset r (t - t̄) that takes its place.
 */
export function growthRateFixedDesign(design: GrowthDesign): { x: number[][]; offsetAt(r: number): number[] } {
  return {
    x: design.x.map((row) => [row[0], ...row.slice(2)]),
    offsetAt: (r) => design.x.map((row) => r * row[1]),
  };
}
