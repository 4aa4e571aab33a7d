/**
 * Hospital demand day by day, as the epidemic unfolds: what a trigger on admissions or bed
 * occupancy reads on a decision day. It applies the same kernels and the same formulas as
 * demand.ts (see there), one day at a time, so a trigger reads exactly the numbers the finished
 * run reports: admissions of day d and occupancy of day d depend only on infections of days <= d
 * (the convolutions are causal), so they are known once day d is over.
 *
 * Only what the triggers read is computed, and only when they read it. Each day's infections go
 * into the delay groups' sums (one multiply-add per band and series). A read of day e first brings
 * the admission series up to day e (one sum over the admission kernel per day: every day's
 * admissions feed later occupancy), then forms that day's occupancy alone (one sum over the
 * bed-day kernel; occupancy of a day nobody reads is never needed). An ICU trigger thus costs two
 * kernel sums a day (ICU admissions, ICU occupancy) instead of the five of the full demand; the
 * ward-only series are formed only for admissions and ward occupancy. On a day read right after
 * the one before, the day's admissions and occupancy are summed in one pass (`convolvedTwiceAt`).
 */
import type { TriggerQuantity } from '../scenario.ts';
import type { PreparedHealthcare } from './prepareHealthcare.ts';

/** The trigger quantities read from the hospital model. */
export type HospitalQuantity = Extract<TriggerQuantity, 'dailyAdmissions' | 'wardOccupancy' | 'icuOccupancy'>;

/** sum_{a <= d} x(a) w(d - a): day d of the causal convolution of x with w. */
export function convolvedAt(x: Float64Array, w: Float64Array, d: number): number {
  let acc = 0;
  const start = Math.max(0, d - w.length + 1);
  for (let a = start; a <= d; a++) acc += x[a] * w[d - a];
  return acc;
}

/**
 * Day e of y = x * w, stored in y[e], and returns day e of y * v: one pass, two sums. Each adds its
 * terms in the order `convolvedAt` does (a ascending, one accumulator: the same bits), but the two
 * chains of adds are independent, so they overlap instead of each waiting on its own previous add.
 * y's days before e must be formed; y[e] enters the second sum last, once the first has made it.
 */
export function convolvedTwiceAt(x: Float64Array, w: Float64Array, y: Float64Array, v: Float64Array, e: number): number {
  const fromW = Math.max(0, e - w.length + 1);
  const fromV = Math.max(0, e - v.length + 1);
  let sumW = 0;
  let sumV = 0;
  let a = Math.min(fromW, fromV);
  for (; a < fromW && a < e; a++) sumV += y[a] * v[e - a];
  for (; a < fromV && a < e; a++) sumW += x[a] * w[e - a];
  for (; a < e; a++) {
    sumW += x[a] * w[e - a];
    sumV += y[a] * v[e - a];
  }
  if (fromW <= e) sumW += x[e] * w[0];
  y[e] = sumW;
  if (fromV <= e) sumV += y[e] * v[0];
  return sumV;
}

/** One delay group's daily series (persons); null where no trigger needs them. */
interface GroupSeries {
  /** The group's bands, ascending. */
  bands: Int32Array;
  /** sum_{i in group} IHR_i (1 - c_i) x_i(d) and sum_{i in group} IHR_i c_i x_i(d). */
  wardOnlyInfections: Float64Array | null;
  icuInfections: Float64Array;
  wardOnlyAdmissions: Float64Array | null;
  icuAdmissions: Float64Array;
}

export class OnlineHospitalDemand {
  /** Days whose infections are known (days 0..infected-1). */
  private infected = 0;
  /** Days whose admissions are formed (days 0..admitted-1). */
  private admitted = 0;
  private readonly series: GroupSeries[];

  /** `reads`: the quantities the triggers will ask for. */
  constructor(
    private readonly h: PreparedHealthcare,
    reads: readonly HospitalQuantity[],
  ) {
    const wardOnly = reads.some((q) => q !== 'icuOccupancy');
    const days = h.days;
    this.series = h.groups.map((g) => ({
      bands: Int32Array.from(g.bands),
      wardOnlyInfections: wardOnly ? new Float64Array(days) : null,
      icuInfections: new Float64Array(days),
      wardOnlyAdmissions: wardOnly ? new Float64Array(days) : null,
      icuAdmissions: new Float64Array(days),
    }));
  }

  /**
   * Adds the next day's infections by band (persons, already weighted by the risk of admission of
   * protected people). Each group sums its bands in ascending order, as demand.ts does, in a
   * local sum (not in the stored day, whose every add would wait on the store before it).
   */
  addDay(infectionsByBand: Float64Array): void {
    const d = this.infected;
    if (d >= this.h.days) return;
    const { wardOnlyRatio, icuRatio } = this.h;
    for (const g of this.series) {
      const { bands, wardOnlyInfections } = g;
      let icu = 0;
      for (let b = 0; b < bands.length; b++) icu += infectionsByBand[bands[b]] * icuRatio[bands[b]];
      g.icuInfections[d] = icu;
      if (wardOnlyInfections === null) continue;
      let wardOnly = 0;
      for (let b = 0; b < bands.length; b++) wardOnly += infectionsByBand[bands[b]] * wardOnlyRatio[bands[b]];
      wardOnlyInfections[d] = wardOnly;
    }
    this.infected = d + 1;
  }

  /**
   * Admissions of day e (persons), or mean beds in use over day e (ward outside ICU, or ICU),
   * from the infections added so far (days 0..e must have been added).
   */
  valueOn(quantity: HospitalQuantity, e: number): number {
    if (e >= this.infected) throw new Error(`hospital demand of day ${e} asked before its infections were added`);
    // Occupancy read on the first day whose admissions are not formed yet: both in one pass.
    const fused = quantity !== 'dailyAdmissions' && this.admitted === e;
    this.admitUpTo(fused ? e - 1 : e);
    const { groups } = this.h;
    let total = 0;
    for (let k = 0; k < groups.length; k++) {
      const g = groups[k];
      const s = this.series[k];
      const wardOnlyInfections = s.wardOnlyInfections as Float64Array;
      const wardOnlyAdmissions = s.wardOnlyAdmissions as Float64Array;
      if (quantity === 'dailyAdmissions') {
        total += wardOnlyAdmissions[e] + s.icuAdmissions[e];
      } else if (quantity === 'icuOccupancy') {
        if (fused && s.wardOnlyAdmissions !== null) wardOnlyAdmissions[e] = convolvedAt(wardOnlyInfections, g.admission, e);
        total += fused ? convolvedTwiceAt(s.icuInfections, g.admission, s.icuAdmissions, g.icuBedDays, e) : convolvedAt(s.icuAdmissions, g.icuBedDays, e);
      } else {
        total += fused
          ? convolvedTwiceAt(wardOnlyInfections, g.admission, wardOnlyAdmissions, g.wardBedDays, e) + convolvedTwiceAt(s.icuInfections, g.admission, s.icuAdmissions, g.icuPatientWardBedDays, e)
          : convolvedAt(wardOnlyAdmissions, g.wardBedDays, e) + convolvedAt(s.icuAdmissions, g.icuPatientWardBedDays, e);
      }
    }
    if (fused) this.admitted = e + 1;
    return total;
  }

  /** Forms the admissions of days admitted..e. */
  private admitUpTo(e: number): void {
    const { groups } = this.h;
    for (let d = this.admitted; d <= e; d++) {
      for (let k = 0; k < groups.length; k++) {
        const w = groups[k].admission;
        const s = this.series[k];
        if (s.wardOnlyInfections !== null && s.wardOnlyAdmissions !== null) s.wardOnlyAdmissions[d] = convolvedAt(s.wardOnlyInfections, w, d);
        s.icuAdmissions[d] = convolvedAt(s.icuInfections, w, d);
      }
    }
    this.admitted = Math.max(this.admitted, e + 1);
  }
}
