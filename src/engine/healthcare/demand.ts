/**
 * Hospital and ICU demand of one option, from its daily infections by band.
 *
 * Model, for band i and day d (persons; day convention and kernels in kernels.ts):
 *   admissions needing ICU      a^icu_i(d)  = sum_{a <= d} IHR_i c_i       x_i(a) w_i(d - a)
 *   admissions not needing ICU  a^ward_i(d) = sum_{a <= d} IHR_i (1 - c_i) x_i(a) w_i(d - a)
 *   ICU occupancy   = sum_i sum_{a <= d} a^icu_i(a)  b^icu_i(d - a)
 *   ward occupancy  = sum_i sum_{a <= d} [a^ward_i(a) b^ward_i(d - a) + a^icu_i(a) b^icuWard(d - a)]
 * with x_i(a) the new infections on day a (seeds on day 0), c_i the share of admissions needing
 * ICU, w_i the infection-to-admission kernel, b the bed-day kernels (mean beds in use on day
 * d - a after admission on day a). ICU patients also spend days in a ward outside ICU; those are
 * counted in ward beds from the day of admission (`icuPatientWardStay`).
 *
 * Why discrete convolution rather than extra compartments in the ODE: the demand is a linear
 * function of the daily infections, so it is exact for any delay shape (gamma with non-integer
 * shape included), it does not depend on the integrator's step or tolerance, and the ODE keeps
 * its size (no hospital compartments per band and per Erlang stage).
 *
 * Cost: bands with the same delays are summed before convolving (prepareHealthcare.ts), so with
 * one set of delays an option costs five convolutions of the horizon with short (tail-trimmed)
 * kernels, in the register-blocked `convolveInto` (distributions.ts), plus one pass over the
 * daily infections by band that forms both group sums of every group and each band's admissions
 * within the horizon. The group sums and convolution results live in scratch arrays kept per
 * prepared scenario (one option runs at a time on a thread); only the four returned series are
 * allocated per run.
 *
 * Admissions and occupancy cover days 0..H-1; admissions of the horizon's infections that fall
 * after the horizon are not counted in `admissions` (see `OptionResults.healthcare`).
 */
import { convolveInto } from '../distributions.ts';
import type { HealthcareOutcomes } from '../results.ts';
import { bedDemand } from './capacity.ts';
import type { PreparedHealthcare } from './prepareHealthcare.ts';

/** Working arrays of one prepared hospital section, reused by every run on this thread. */
interface Scratch {
  /** Per delay group: sum_{i in group} IHR_i (1 - c_i) x_i(d) and sum_{i in group} IHR_i c_i x_i(d), by day. */
  wardOnlyInfections: Float64Array[];
  icuInfections: Float64Array[];
  /** Per band: sum_a x_i(a) admittedBy_g(H - 1 - a), infections weighted by their chance of admission within the horizon. */
  admittedWeight: Float64Array;
  /** Group of each band (index into `groups`). */
  groupOfBand: Int32Array;
  /** One day's sums by group, and each group's admittedBy at that day's lag. */
  wardOnlySum: Float64Array;
  icuSum: Float64Array;
  admittedByLag: Float64Array;
  /** One day's infections by band. */
  day: Float64Array;
  wardOnlyAdmissions: Float64Array;
  icuAdmissions: Float64Array;
  convolved: Float64Array;
}

const scratchOf = new WeakMap<PreparedHealthcare, Scratch>();

/** The scratch of `h`, with room for `days` days (the horizon, unless a caller passes a longer series). */
function scratch(h: PreparedHealthcare, days: number): Scratch {
  let s = scratchOf.get(h);
  if (s === undefined || s.convolved.length < days) {
    const groupOfBand = new Int32Array(h.bands);
    h.groups.forEach((g, k) => g.bands.forEach((i) => (groupOfBand[i] = k)));
    s = {
      wardOnlyInfections: h.groups.map(() => new Float64Array(days)),
      icuInfections: h.groups.map(() => new Float64Array(days)),
      admittedWeight: new Float64Array(h.bands),
      groupOfBand,
      wardOnlySum: new Float64Array(h.groups.length),
      icuSum: new Float64Array(h.groups.length),
      admittedByLag: new Float64Array(h.groups.length),
      day: new Float64Array(h.bands),
      wardOnlyAdmissions: new Float64Array(days),
      icuAdmissions: new Float64Array(days),
      convolved: new Float64Array(days),
    };
    scratchOf.set(h, s);
  }
  return s;
}

/**
 * Adds day d's infections by band (`x`, persons) to the group sums and to each band's admissions
 * within a horizon of `days` days. One pass over the bands in ascending order, so each group's sum
 * runs over its bands in ascending order, and each band's total over days in ascending order: the
 * same order whether the infections come as a whole array (`healthcareDemand`) or day by day from
 * the integrator's totals (`healthcareDemandOfRun`).
 */
function addDay(h: PreparedHealthcare, s: Scratch, x: Float64Array, d: number, days: number): void {
  const lag = days - 1 - d;
  const groups = h.groups.length;
  const { wardOnlySum, icuSum, admittedByLag, groupOfBand, admittedWeight } = s;
  for (let k = 0; k < groups; k++) {
    const admittedBy = h.groups[k].admittedBy;
    wardOnlySum[k] = 0;
    icuSum[k] = 0;
    admittedByLag[k] = admittedBy.length === 0 ? 0 : lag < admittedBy.length ? admittedBy[lag] : admittedBy[admittedBy.length - 1];
  }
  const wardOnlyRatio = h.wardOnlyRatio;
  const icuRatio = h.icuRatio;
  for (let i = 0; i < h.bands; i++) {
    const k = groupOfBand[i];
    const v = x[i];
    wardOnlySum[k] += v * wardOnlyRatio[i];
    icuSum[k] += v * icuRatio[i];
    admittedWeight[i] += v * admittedByLag[k];
  }
  for (let k = 0; k < groups; k++) {
    s.wardOnlyInfections[k][d] = wardOnlySum[k];
    s.icuInfections[k][d] = icuSum[k];
  }
}

/** target += x, element by element. */
function addInto(target: Float64Array, x: Float64Array): void {
  for (let d = 0; d < target.length; d++) target[d] += x[d];
}

/** The convolutions and totals, once `addDay` has seen days 0..days-1. */
function demandOfGroups(h: PreparedHealthcare, s: Scratch, days: number): HealthcareOutcomes {
  const n = h.bands;
  const admissions = new Float64Array(days);
  const icuAdmissions = new Float64Array(days);
  const wardOccupancy = new Float64Array(days);
  const icuOccupancy = new Float64Array(days);
  const sized = (a: Float64Array): Float64Array => (a.length === days ? a : a.subarray(0, days));
  const wardOnly = sized(s.wardOnlyAdmissions);
  const icu = sized(s.icuAdmissions);
  const convolved = sized(s.convolved);
  h.groups.forEach((g, k) => {
    convolveInto(wardOnly, sized(s.wardOnlyInfections[k]), g.admission);
    convolveInto(icu, sized(s.icuInfections[k]), g.admission);
    addInto(admissions, wardOnly);
    addInto(admissions, icu);
    addInto(icuAdmissions, icu);
    addInto(wardOccupancy, convolveInto(convolved, wardOnly, g.wardBedDays));
    addInto(wardOccupancy, convolveInto(convolved, icu, g.icuPatientWardBedDays));
    addInto(icuOccupancy, convolveInto(convolved, icu, g.icuBedDays));
  });

  // Band i's admissions within the horizon: ratio_i x sum_a x_i(a) admittedBy(H - 1 - a).
  const wardOnlyAdmissionsByBand = new Array<number>(n);
  const icuAdmissionsByBand = new Array<number>(n);
  for (let i = 0; i < n; i++) {
    const w = s.admittedWeight[i];
    wardOnlyAdmissionsByBand[i] = h.wardOnlyRatio[i] === 0 ? 0 : h.wardOnlyRatio[i] * w;
    icuAdmissionsByBand[i] = h.icuRatio[i] === 0 ? 0 : h.icuRatio[i] * w;
  }
  const admissionsByBand = wardOnlyAdmissionsByBand.map((x, i) => x + icuAdmissionsByBand[i]);
  const sum = (xs: readonly number[]): number => xs.reduce((a, b) => a + b, 0);
  return {
    admissions: sum(admissionsByBand),
    admissionsByBand,
    wardOnlyAdmissions: sum(wardOnlyAdmissionsByBand),
    icuAdmissions: sum(icuAdmissionsByBand),
    icuAdmissionsByBand,
    ward: bedDemand(wardOccupancy, h.wardBeds, h.wardSurgeBeds),
    icu: bedDemand(icuOccupancy, h.icuBeds, h.icuSurgeBeds),
    series: { admissions, icuAdmissions, wardOccupancy, icuOccupancy },
  };
}

/** Hospital demand of one option; `incidence` is the band-major daily infections (length days x n, days <= h.days). */
export function healthcareDemand(h: PreparedHealthcare, incidence: Float64Array): HealthcareOutcomes {
  const n = h.bands;
  const days = incidence.length / n;
  const s = scratch(h, days);
  s.admittedWeight.fill(0);
  for (let d = 0; d < days; d++) addDay(h, s, incidence.subarray(d * n, (d + 1) * n), d, days);
  return demandOfGroups(h, s, days);
}

/**
 * `healthcareDemand` of an option run, reading its daily infections straight from the
 * integrator's cumulative infections by band (days 0..H, band-major), without an H x n array:
 *   x_i(d) = max(0, cum_i(d + 1) - cum_i(d)) (+ seeds_i on day 0), and with protected people
 *   x_i(d) <- max(0, x_i(d) - (1 - f) max(0, pcum_i(d + 1) - pcum_i(d))),
 * f their relative risk of admission; the same numbers, bit for bit, as simulate.ts's daily
 * incidence weighted the same way.
 */
export function healthcareDemandOfRun(h: PreparedHealthcare, cumulative: Float64Array, seeds: Float64Array, protectedCumulative: Float64Array | null, factor: number): HealthcareOutcomes {
  const n = h.bands;
  const days = h.days;
  const s = scratch(h, days);
  const x = s.day;
  s.admittedWeight.fill(0);
  for (let d = 0; d < days; d++) {
    const row = d * n;
    for (let i = 0; i < n; i++) {
      let v = Math.max(0, cumulative[row + n + i] - cumulative[row + i]);
      if (d === 0) v += seeds[i];
      if (protectedCumulative !== null) v = Math.max(0, v - (1 - factor) * Math.max(0, protectedCumulative[row + n + i] - protectedCumulative[row + i]));
      x[i] = v;
    }
    addDay(h, s, x, d, days);
  }
  return demandOfGroups(h, s, days);
}
