/**
 * Hospital demand day by day, as the epidemic unfolds: what a trigger on admissions or bed
 * occupancy reads on a decision day. It applies the same kernels and the same formulas as
 * demand.ts (see there), one day at a time, so a trigger reads exactly the numbers the finished
 * run reports: admissions of day d and occupancy of day d depend only on infections of days <= d
 * (the convolutions are causal), so they are known once day d is over.
 *
 * Cost: one day costs a sum over each kernel's length per delay group, O(H x K) for a horizon.
 */
import type { PreparedHealthcare } from './prepareHealthcare.ts';

/** sum_{a <= d} x(a) w(d - a): day d of the causal convolution of x with w. */
function convolvedAt(x: Float64Array, w: Float64Array, d: number): number {
  let acc = 0;
  const start = Math.max(0, d - w.length + 1);
  for (let a = start; a <= d; a++) acc += x[a] * w[d - a];
  return acc;
}

export class OnlineHospitalDemand {
  /** Days completed so far (days 0..completed-1 are known). */
  completed = 0;
  readonly admissions: Float64Array;
  readonly wardOccupancy: Float64Array;
  readonly icuOccupancy: Float64Array;
  private readonly wardOnlyInfections: Float64Array[];
  private readonly icuInfections: Float64Array[];
  private readonly wardOnlyAdmissions: Float64Array[];
  private readonly icuAdmissions: Float64Array[];

  constructor(private readonly h: PreparedHealthcare) {
    const days = h.days;
    const perGroup = () => h.groups.map(() => new Float64Array(days));
    this.admissions = new Float64Array(days);
    this.wardOccupancy = new Float64Array(days);
    this.icuOccupancy = new Float64Array(days);
    this.wardOnlyInfections = perGroup();
    this.icuInfections = perGroup();
    this.wardOnlyAdmissions = perGroup();
    this.icuAdmissions = perGroup();
  }

  /**
   * Adds the next day's infections by band (persons, already weighted by the risk of admission of
   * protected people) and computes that day's admissions and occupancy.
   */
  addDay(infectionsByBand: Float64Array): void {
    const d = this.completed;
    if (d >= this.h.days) return;
    const { h } = this;
    let admissions = 0;
    let ward = 0;
    let icu = 0;
    h.groups.forEach((g, k) => {
      let wardOnly = 0;
      let needIcu = 0;
      for (const i of g.bands) {
        wardOnly += infectionsByBand[i] * h.wardOnlyRatio[i];
        needIcu += infectionsByBand[i] * h.icuRatio[i];
      }
      this.wardOnlyInfections[k][d] = wardOnly;
      this.icuInfections[k][d] = needIcu;
      const a = convolvedAt(this.wardOnlyInfections[k], g.admission, d);
      const b = convolvedAt(this.icuInfections[k], g.admission, d);
      this.wardOnlyAdmissions[k][d] = a;
      this.icuAdmissions[k][d] = b;
      admissions += a + b;
      ward += convolvedAt(this.wardOnlyAdmissions[k], g.wardBedDays, d) + convolvedAt(this.icuAdmissions[k], g.icuPatientWardBedDays, d);
      icu += convolvedAt(this.icuAdmissions[k], g.icuBedDays, d);
    });
    this.admissions[d] = admissions;
    this.wardOccupancy[d] = ward;
    this.icuOccupancy[d] = icu;
    this.completed = d + 1;
  }
}
