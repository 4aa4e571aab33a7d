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
 * daily infections, band by band, that forms both group sums of every group and each band's
 * admissions within the horizon. The group sums and convolution results live in scratch arrays kept per
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
  /** Per band: sum_a x_i(a) admittedBy_g(days - 1 - a), infections weighted by their chance of admission within the horizon. */
  admittedWeight: Float64Array;
  /** Group of each band (index into `groups`). */
  groupOfBand: Int32Array;
  /** Per group, by day a: admittedBy_g(lagDays - 1 - a), the last entry beyond the kernel, 0 for an empty kernel. */
  admittedByDay: Float64Array[];
  /** The horizon `admittedByDay` was written for. */
  lagDays: number;
  /** One band's infections by day. */
  column: Float64Array;
  wardOnlyAdmissions: Float64Array;
  icuAdmissions: Float64Array;
  convolved: Float64Array;
}

const scratchOf = new WeakMap<PreparedHealthcare, Scratch>();

/**
 * The scratch of `h` for a series of `days` days (the horizon, unless a caller passes a longer or
 * shorter series), its group sums zeroed for `addBand`.
 */
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
      admittedByDay: h.groups.map(() => new Float64Array(days)),
      lagDays: -1,
      column: new Float64Array(days),
      wardOnlyAdmissions: new Float64Array(days),
      icuAdmissions: new Float64Array(days),
      convolved: new Float64Array(days),
    };
    scratchOf.set(h, s);
  }
  if (s.lagDays !== days) {
    h.groups.forEach(({ admittedBy }, k) => {
      const byDay = s.admittedByDay[k];
      for (let a = 0; a < days; a++) {
        const lag = days - 1 - a;
        byDay[a] = admittedBy.length === 0 ? 0 : lag < admittedBy.length ? admittedBy[lag] : admittedBy[admittedBy.length - 1];
      }
    });
    s.lagDays = days;
  }
  for (let k = 0; k < h.groups.length; k++) {
    s.wardOnlyInfections[k].fill(0, 0, days);
    s.icuInfections[k].fill(0, 0, days);
  }
  return s;
}

/**
 * Adds band i's daily infections (`x`, days 0..days-1, persons) to its group's sums and sets the
 * band's admissions weight within the horizon. Called for the bands in ascending order: each
 * day's group sum then runs over the group's bands in ascending order, starting from 0, and each
 * band's weight over the days in ascending order, whatever the caller (`healthcareDemand` from a
 * daily array, `healthcareDemandOfRun` from the integrator's totals). Band by band rather than
 * day by day, so that no running sum is loaded back right after being stored.
 */
function addBand(h: PreparedHealthcare, s: Scratch, i: number, x: Float64Array, days: number): void {
  const k = s.groupOfBand[i];
  const wardOnly = s.wardOnlyInfections[k];
  const icu = s.icuInfections[k];
  const admittedBy = s.admittedByDay[k];
  const wardOnlyRatio = h.wardOnlyRatio[i];
  const icuRatio = h.icuRatio[i];
  let weight = 0;
  for (let a = 0; a < days; a++) {
    const v = x[a];
    wardOnly[a] += v * wardOnlyRatio;
    icu[a] += v * icuRatio;
    weight += v * admittedBy[a];
  }
  s.admittedWeight[i] = weight;
}

/** target += x, element by element. */
function addInto(target: Float64Array, x: Float64Array): void {
  for (let d = 0; d < target.length; d++) target[d] += x[d];
}

/** The convolutions and totals, once `addBand` has seen every band. */
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
  const x = s.column;
  for (let i = 0; i < n; i++) {
    for (let d = 0; d < days; d++) x[d] = incidence[d * n + i];
    addBand(h, s, i, x, days);
  }
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
  const x = s.column;
  const unprotected = 1 - factor;
  for (let i = 0; i < n; i++) {
    let before = cumulative[i];
    for (let d = 0; d < days; d++) {
      const after = cumulative[(d + 1) * n + i];
      x[d] = Math.max(0, after - before);
      before = after;
    }
    if (days > 0) x[0] += seeds[i];
    if (protectedCumulative !== null) {
      let protectedBefore = protectedCumulative[i];
      for (let d = 0; d < days; d++) {
        const protectedAfter = protectedCumulative[(d + 1) * n + i];
        x[d] = Math.max(0, x[d] - unprotected * Math.max(0, protectedAfter - protectedBefore));
        protectedBefore = protectedAfter;
      }
    }
    addBand(h, s, i, x, days);
  }
  return demandOfGroups(h, s, days);
}
