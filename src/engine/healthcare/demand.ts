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
 * Cost: bands with the same delays are summed before convolving (prepare.ts), so with one set of
 * delays an option costs five convolutions of the horizon with short (tail-trimmed) kernels, the
 * two admission convolutions in one pass (`convolveTwo`).
 *
 * Admissions and occupancy cover days 0..H-1; admissions of the horizon's infections that fall
 * after the horizon are not counted in `admissions` (see `OptionResults.healthcare`).
 */
import { convolve, convolveTwo } from '../distributions.ts';
import type { HealthcareOutcomes } from '../results.ts';
import { bedDemand } from './capacity.ts';
import type { DelayGroup, PreparedHealthcare } from './prepareHealthcare.ts';

/** sum_{i in bands} scale_i x series[d][i] for each day d (band-major rows of width `width`). */
function groupSum(series: Float64Array, width: number, bands: readonly number[], scale: Float64Array): Float64Array {
  const days = series.length / width;
  const out = new Float64Array(days);
  for (let d = 0; d < days; d++) {
    let acc = 0;
    for (const i of bands) acc += series[d * width + i] * scale[i];
    out[d] = acc;
  }
  return out;
}

/** target += x, element by element. */
function addInto(target: Float64Array, x: Float64Array): void {
  for (let d = 0; d < target.length; d++) target[d] += x[d];
}

/** sum_a ratio_i x_i(a) admittedBy(H - 1 - a): band i's admissions that fall within the horizon. */
function admittedWithinHorizon(incidence: Float64Array, n: number, i: number, ratio: number, group: DelayGroup): number {
  const days = incidence.length / n;
  const k = group.admittedBy;
  if (k.length === 0 || ratio === 0) return 0;
  const complete = k[k.length - 1];
  let total = 0;
  for (let a = 0; a < days; a++) {
    const lag = days - 1 - a;
    total += incidence[a * n + i] * (lag < k.length ? k[lag] : complete);
  }
  return ratio * total;
}

/** Hospital demand of one option; `incidence` is the band-major daily infections (length H x n). */
export function healthcareDemand(h: PreparedHealthcare, incidence: Float64Array): HealthcareOutcomes {
  const n = h.bands;
  const days = incidence.length / n;
  const admissions = new Float64Array(days);
  const icuAdmissions = new Float64Array(days);
  const wardOccupancy = new Float64Array(days);
  const icuOccupancy = new Float64Array(days);
  const icuAdmissionsByBand = new Array<number>(n).fill(0);
  const wardOnlyAdmissionsByBand = new Array<number>(n).fill(0);

  for (const g of h.groups) {
    const [wardOnly, icu] = convolveTwo(groupSum(incidence, n, g.bands, h.wardOnlyRatio), groupSum(incidence, n, g.bands, h.icuRatio), g.admission);
    addInto(admissions, wardOnly);
    addInto(admissions, icu);
    addInto(icuAdmissions, icu);
    addInto(wardOccupancy, convolve(wardOnly, g.wardBedDays));
    addInto(wardOccupancy, convolve(icu, g.icuPatientWardBedDays));
    addInto(icuOccupancy, convolve(icu, g.icuBedDays));
    for (const i of g.bands) {
      wardOnlyAdmissionsByBand[i] = admittedWithinHorizon(incidence, n, i, h.wardOnlyRatio[i], g);
      icuAdmissionsByBand[i] = admittedWithinHorizon(incidence, n, i, h.icuRatio[i], g);
    }
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
