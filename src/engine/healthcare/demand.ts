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
  /** Runs of at most RUN consecutive bands of one group, as (first band, count) pairs, in band order. */
  runs: Int32Array;
  /** A run's daily infections by band (band-major rows, as `healthcareDemand`'s input), read from the integrator's totals. */
  incidence: Float64Array;
  wardOnlyAdmissions: Float64Array;
  icuAdmissions: Float64Array;
  convolved: Float64Array;
}

const scratchOf = new WeakMap<PreparedHealthcare, Scratch>();

/** Bands summed together in one pass over the days. */
const RUN = 4;

/** The bands cut into runs of at most RUN consecutive bands with the same group: (first, count) pairs. */
function bandRuns(groupOfBand: Int32Array): Int32Array {
  const runs: number[] = [];
  for (let i = 0; i < groupOfBand.length; ) {
    let count = 1;
    while (count < RUN && i + count < groupOfBand.length && groupOfBand[i + count] === groupOfBand[i]) count++;
    runs.push(i, count);
    i += count;
  }
  return Int32Array.from(runs);
}

/**
 * The scratch of `h` for a series of `days` days (the horizon, unless a caller passes a longer or
 * shorter series), its group sums zeroed for `addBands`.
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
      runs: bandRuns(groupOfBand),
      incidence: new Float64Array(days * h.bands),
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
 * Adds the daily infections of bands first..first+count-1 (`x`, band-major rows of n bands,
 * persons) to their group's sums and sets each band's admissions weight within the horizon.
 * Called for the runs in band order: each day's group sum then runs over the group's bands in
 * ascending order, starting from 0, and each band's weight over the days in ascending order,
 * whatever the caller (`healthcareDemand` from a daily array, `healthcareDemandOfRun` from the
 * integrator's totals). By runs of bands rather than day by day, so that no running sum is loaded
 * back right after being stored; four bands at a time, so that four weights add up side by side.
 */
function addBands(h: PreparedHealthcare, s: Scratch, first: number, count: number, x: Float64Array, days: number): void {
  const n = h.bands;
  const k = s.groupOfBand[first];
  const wardOnly = s.wardOnlyInfections[k];
  const icu = s.icuInfections[k];
  const admittedBy = s.admittedByDay[k];
  if (count === RUN) {
    const [r0, r1, r2, r3] = [h.wardOnlyRatio[first], h.wardOnlyRatio[first + 1], h.wardOnlyRatio[first + 2], h.wardOnlyRatio[first + 3]];
    const [c0, c1, c2, c3] = [h.icuRatio[first], h.icuRatio[first + 1], h.icuRatio[first + 2], h.icuRatio[first + 3]];
    let w0 = 0;
    let w1 = 0;
    let w2 = 0;
    let w3 = 0;
    for (let a = 0; a < days; a++) {
      const row = a * n + first;
      const v0 = x[row];
      const v1 = x[row + 1];
      const v2 = x[row + 2];
      const v3 = x[row + 3];
      let sum = wardOnly[a];
      sum += v0 * r0;
      sum += v1 * r1;
      sum += v2 * r2;
      sum += v3 * r3;
      wardOnly[a] = sum;
      sum = icu[a];
      sum += v0 * c0;
      sum += v1 * c1;
      sum += v2 * c2;
      sum += v3 * c3;
      icu[a] = sum;
      const lag = admittedBy[a];
      w0 += v0 * lag;
      w1 += v1 * lag;
      w2 += v2 * lag;
      w3 += v3 * lag;
    }
    s.admittedWeight[first] = w0;
    s.admittedWeight[first + 1] = w1;
    s.admittedWeight[first + 2] = w2;
    s.admittedWeight[first + 3] = w3;
    return;
  }
  for (let j = 0; j < count; j++) {
    const wardOnlyRatio = h.wardOnlyRatio[first + j];
    const icuRatio = h.icuRatio[first + j];
    let weight = 0;
    for (let a = 0; a < days; a++) {
      const v = x[a * n + first + j];
      wardOnly[a] += v * wardOnlyRatio;
      icu[a] += v * icuRatio;
      weight += v * admittedBy[a];
    }
    s.admittedWeight[first + j] = weight;
  }
}

/** Math.max(0, x) for every x (-0 gives +0, NaN stays NaN), written out: the call's general case costs more here. */
function positivePart(x: number): number {
  return x > 0 ? x : x === x ? 0 : x;
}

/** target += x, element by element. */
function addInto(target: Float64Array, x: Float64Array): void {
  for (let d = 0; d < target.length; d++) target[d] += x[d];
}

/** The convolutions and totals, once `addBands` has seen every band. */
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
  for (let r = 0; r < s.runs.length; r += 2) addBands(h, s, s.runs[r], s.runs[r + 1], incidence, days);
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
  const x = s.incidence;
  const cells = days * n;
  for (let k = 0; k < cells; k++) x[k] = positivePart(cumulative[k + n] - cumulative[k]);
  if (days > 0) for (let i = 0; i < n; i++) x[i] += seeds[i];
  if (protectedCumulative !== null) {
    const unprotected = 1 - factor;
    for (let k = 0; k < cells; k++) x[k] = positivePart(x[k] - unprotected * positivePart(protectedCumulative[k + n] - protectedCumulative[k]));
  }
  for (let r = 0; r < s.runs.length; r += 2) addBands(h, s, s.runs[r], s.runs[r + 1], x, days);
  return demandOfGroups(h, s, days);
}
