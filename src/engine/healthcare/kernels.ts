/**
 * Daily kernels for hospital demand: when admissions happen after infection, and how long a
 * patient keeps a bed.
 *
 * Day convention (as for the death series): an event "on day a" happens at mid-day, a + 0.5.
 *
 * Admission kernel: w_k = P(admitted on day a + k | infected on day a), the gamma delay
 * discretised by `dailyDelayWeights` (w_k = F(k + 0.5) - F(k - 0.5)).
 *
 * Bed-day kernel: b_k = expected beds in use on day a + k (mean over the day) per patient
 * admitted on day a. A patient admitted at a + 0.5 with stay T holds a bed on [a + 0.5, a + 0.5 + T),
 * so with G(u) = P(T > u) and Lambda(x) = int_0^x G(u) du:
 *   b_0 = Lambda(0.5),   b_k = Lambda(k + 0.5) - Lambda(k - 0.5)  (k >= 1).
 * The b_k add up to int_0^inf G = E[T] = L, so constant admissions A per day give occupancy A L in
 * steady state: Little's law (Little 1961, Operations Research 9:383) holds exactly, for any
 * shape. For a gamma stay (shape k, mean L, rate k/L), integrating by parts,
 *   Lambda(x) = x G(x) + L F_{k+1}(x),
 * F_{k+1} the CDF of the gamma with shape k + 1 and the same rate (mean L (k + 1) / k).
 *
 * Tails: a kernel is cut where the mass still to come is below TAIL_TOLERANCE of its total (and at
 * the horizon), which keeps the convolutions short; the cut changes results by less than that
 * fraction.
 *
 * Kernels are kept by delay and length (the newest KEPT_KERNELS): the uncertainty draws prepare a
 * scenario per draw, most with the same delays, and each kernel costs a few hundred incomplete
 * gamma functions. The arrays handed out are shared: read them, never write to them.
 */
import { dailyDelayWeights, gammaCdf } from '../distributions.ts';
import type { Delay } from '../scenario.ts';

/** Relative mass a kernel may drop at its tail. */
export const TAIL_TOLERANCE = 1e-10;

/** Length of `w` once trailing entries holding less than `tolerance` of the total are dropped. */
function trimmedLength(w: Float64Array, tolerance: number): number {
  let total = 0;
  for (let k = 0; k < w.length; k++) total += w[k];
  let tail = 0;
  let length = w.length;
  while (length > 0 && tail + w[length - 1] <= tolerance * total) tail += w[--length];
  return length;
}

/** Kernels kept, by kind, delay and length. */
const KEPT_KERNELS = 64;
const kept = new Map<string, Float64Array>();

/** The kernel under `key`, made by `make` when it is not kept. */
function keptKernel(key: string, make: () => Float64Array): Float64Array {
  let kernel = kept.get(key);
  if (kernel === undefined) {
    kernel = make();
    kept.set(key, kernel);
    if (kept.size > KEPT_KERNELS) kept.delete(kept.keys().next().value as string);
  }
  return kernel;
}

/** Daily weights of a delay (infection to admission, infection to death) over at most `days` days, tail trimmed; shared. */
export function delayKernel(delay: Delay, days: number): Float64Array {
  return keptKernel(`delay ${delay.meanDays} ${delay.shape} ${days}`, () => {
    const w = dailyDelayWeights(delay.meanDays, delay.shape, days);
    return w.slice(0, trimmedLength(w, TAIL_TOLERANCE));
  });
}

/** Lambda(x) = int_0^x P(T > u) du for a gamma stay T with the given mean (days) and shape. */
export function expectedTimeInBedBy(x: number, stay: Delay): number {
  const { meanDays: mean, shape } = stay;
  if (mean === 0 || x <= 0) return 0;
  // A mean so small that x / mean overflows: the whole stay lies before x.
  if (!Number.isFinite((shape * x) / mean)) return mean;
  return x * (1 - gammaCdf(x, mean, shape)) + mean * gammaCdf(x, (mean * (shape + 1)) / shape, shape + 1);
}

/** Bed-day kernel b_k (beds in use on day k per admission on day 0) over at most `days` days, tail trimmed; shared. */
export function bedDayKernel(stay: Delay, days: number): Float64Array {
  return keptKernel(`stay ${stay.meanDays} ${stay.shape} ${days}`, () => bedDays(stay, days));
}

function bedDays(stay: Delay, days: number): Float64Array {
  const b = new Float64Array(days);
  let previous = 0;
  for (let k = 0; k < days; k++) {
    const next = expectedTimeInBedBy(k + 0.5, stay);
    b[k] = Math.max(0, next - previous);
    previous = next;
  }
  return b.slice(0, trimmedLength(b, TAIL_TOLERANCE));
}
