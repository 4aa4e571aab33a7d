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
 * ward-only series are formed only for admissions and ward occupancy.
 */
import type { TriggerQuantity } from '../scenario.ts';
import type { PreparedHealthcare } from './prepareHealthcare.ts';

/** The trigger quantities read from the hospital model. */
export type HospitalQuantity = Extract<TriggerQuantity, 'dailyAdmissions' | 'wardOccupancy' | 'icuOccupancy'>;

/** sum_{a <= d} x(a) w(d - a): day d of the causal convolution of x with w. */
function convolvedAt(x: Float64Array, w: Float64Array, d: number): number {
  let acc = 0;
  const start = Math.max(0, d - w.length + 1);
  for (let a = start; a <= d; a++) acc += x[a] * w[d - a];
  return acc;
}

/** One delay group's daily series (persons); null where no trigger needs them. */
interface GroupSeries {
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
  private readonly groupOfBand: Int32Array;

  /** `reads`: the quantities the triggers will ask for. */
  constructor(
    private readonly h: PreparedHealthcare,
    reads: readonly HospitalQuantity[],
  ) {
    const wardOnly = reads.some((q) => q !== 'icuOccupancy');
    const days = h.days;
    this.series = h.groups.map(() => ({
      wardOnlyInfections: wardOnly ? new Float64Array(days) : null,
      icuInfections: new Float64Array(days),
      wardOnlyAdmissions: wardOnly ? new Float64Array(days) : null,
      icuAdmissions: new Float64Array(days),
    }));
    this.groupOfBand = new Int32Array(h.bands);
    h.groups.forEach((g, k) => {
      for (const i of g.bands) this.groupOfBand[i] = k;
    });
  }

  /**
   * Adds the next day's infections by band (persons, already weighted by the risk of admission of
   * protected people). Each group sums its bands in ascending order, as demand.ts does.
   */
  addDay(infectionsByBand: Float64Array): void {
    const d = this.infected;
    if (d >= this.h.days) return;
    const { wardOnlyRatio, icuRatio } = this.h;
    for (let i = 0; i < this.h.bands; i++) {
      const g = this.series[this.groupOfBand[i]];
      const x = infectionsByBand[i];
      if (g.wardOnlyInfections !== null) g.wardOnlyInfections[d] += x * wardOnlyRatio[i];
      g.icuInfections[d] += x * icuRatio[i];
    }
    this.infected = d + 1;
  }

  /**
   * Admissions of day e (persons), or mean beds in use over day e (ward outside ICU, or ICU),
   * from the infections added so far (days 0..e must have been added).
   */
  valueOn(quantity: HospitalQuantity, e: number): number {
    if (e >= this.infected) throw new Error(`hospital demand of day ${e} asked before its infections were added`);
    this.admitUpTo(e);
    const { groups } = this.h;
    let total = 0;
    for (let k = 0; k < groups.length; k++) {
      const g = groups[k];
      const s = this.series[k];
      if (quantity === 'icuOccupancy') total += convolvedAt(s.icuAdmissions, g.icuBedDays, e);
      else if (quantity === 'dailyAdmissions') total += (s.wardOnlyAdmissions as Float64Array)[e] + s.icuAdmissions[e];
      else total += convolvedAt(s.wardOnlyAdmissions as Float64Array, g.wardBedDays, e) + convolvedAt(s.icuAdmissions, g.icuPatientWardBedDays, e);
    }
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
