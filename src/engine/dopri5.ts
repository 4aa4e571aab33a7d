/**
 * Dormand-Prince 5(4) with adaptive step size and dense output.
 *
 * Coefficients, error estimate and the 4th-order continuous extension are those of
 * Dormand & Prince 1980, J Comput Appl Math 6:19, as given by Hairer, Norsett & Wanner 1993,
 * Solving Ordinary Differential Equations I, 2nd ed., section II.5 and II.6 (code DOPRI5).
 * Error norm: RMS of e_i / (atol + rtol * max(|y_i|, |y_new_i|)); step factor
 * 0.9 * err^(-1/5), limited to [0.2, 5]. Works on Float64Arrays; no allocation per step.
 */

/** dy/dt = f(t, y), written into dydt. Must not keep references to y or dydt. */
export type RightHandSide = (t: number, y: Float64Array, dydt: Float64Array) => void;

export interface Tolerances {
  relative: number;
  absolute: number;
  /** Largest step, days. */
  maxStep: number;
  /**
   * Components of an accepted state smaller than this in size are set to 0. Compartments that
   * decay for years after an epidemic (many Erlang stages, long horizons) otherwise sink into
   * subnormal floats, where every operation costs about ten times more; 1e-100 persons changes
   * no sum in double precision. Default 0 (no flush).
   */
  flushBelow?: number;
}

/** A safety net: no realistic scenario needs more steps in one segment (the demo takes about 100). */
const MAX_STEPS = 1_000_000;

/**
 * The tolerances of every option run. rtol 4e-6 is the loosest round value that keeps attack
 * rates, deaths, the peak of the infected and peak bed occupancy within 1e-6 (relative) of an
 * rtol 1e-10 solution on the demo and on fast- and slow-growth variants, vaccination included
 * (test/engine/accuracy.test.ts; at 1e-5 a vaccination option and a fast epidemic missed by 1.3e-6
 * and 1.8e-6). atol is in persons.
 */
export const DEFAULT_TOLERANCES: Tolerances = { relative: 4e-6, absolute: 1e-6, maxStep: 10, flushBelow: 1e-100 };

let attemptedSteps = 0;

/**
 * Steps attempted (accepted and rejected) by every `integrate` call so far in this realm: a
 * deterministic measure of the integrator's work, for step budgets in tests (never timings).
 */
export function integratorStepsSoFar(): number {
  return attemptedSteps;
}

const C2 = 1 / 5, C3 = 3 / 10, C4 = 4 / 5, C5 = 8 / 9;
const A21 = 1 / 5;
const A31 = 3 / 40, A32 = 9 / 40;
const A41 = 44 / 45, A42 = -56 / 15, A43 = 32 / 9;
const A51 = 19372 / 6561, A52 = -25360 / 2187, A53 = 64448 / 6561, A54 = -212 / 729;
const A61 = 9017 / 3168, A62 = -355 / 33, A63 = 46732 / 5247, A64 = 49 / 176, A65 = -5103 / 18656;
const A71 = 35 / 384, A73 = 500 / 1113, A74 = 125 / 192, A75 = -2187 / 6784, A76 = 11 / 84;
const E1 = 71 / 57600, E3 = -71 / 16695, E4 = 71 / 1920, E5 = -17253 / 339200, E6 = 22 / 525, E7 = -1 / 40;
const D1 = -12715105075 / 11282082432, D3 = 87487479700 / 32700410799, D4 = -10690763975 / 1880347072;
const D5 = 701980252875 / 199316789632, D6 = -1453857185 / 822651844, D7 = 69997945 / 29380423;

/** Scratch space for one system size; reuse it across calls to avoid allocation. */
export class Dopri5Workspace {
  readonly k1: Float64Array; readonly k2: Float64Array; readonly k3: Float64Array; readonly k4: Float64Array;
  readonly k5: Float64Array; readonly k6: Float64Array; readonly k7: Float64Array;
  readonly stage: Float64Array; readonly next: Float64Array; readonly state: Float64Array;
  readonly r1: Float64Array; readonly r2: Float64Array; readonly r3: Float64Array; readonly r4: Float64Array; readonly r5: Float64Array;
  /** Accepted and rejected step counts of the last call. */
  steps = 0;
  rejected = 0;
  /** Where the last call stopped early at the sink's request, or null when it reached t1. */
  stoppedAt: number | null = null;
  constructor(readonly size: number) {
    const f = () => new Float64Array(size);
    this.k1 = f(); this.k2 = f(); this.k3 = f(); this.k4 = f(); this.k5 = f(); this.k6 = f(); this.k7 = f();
    this.stage = f(); this.next = f(); this.state = f();
    this.r1 = f(); this.r2 = f(); this.r3 = f(); this.r4 = f(); this.r5 = f();
  }
}

/**
 * Called for each requested output time inside an accepted step, with the dense-output state
 * (a scratch buffer: copy what you need). Returning `true` (exactly) stops the integration at that time:
 * the right-hand side is about to change there (a triggered measure). The step that passed it is
 * then redone to end exactly at that time, so y is the integrator's own solution there.
 */
export type OutputSink = (t: number, y: Float64Array) => unknown;

/**
 * Integrates y from t0 to t1 in place (y holds y(t_end) on return), calling `sink` at each time
 * of `outputTimes` (ascending, within (t0, t1]). t_end is t1, or the output time at which `sink`
 * asked to stop (in `ws.stoppedAt`). When `denseComponents` is given, only those components of
 * the sink's state are evaluated (the rest hold scratch values): the dense output then costs what
 * the caller reads. Returns the last accepted step size, to start the next
 * segment with.
 */
export function integrate(
  rhs: RightHandSide,
  y: Float64Array,
  t0: number,
  t1: number,
  outputTimes: ArrayLike<number>,
  sink: OutputSink,
  ws: Dopri5Workspace,
  tol: Tolerances = DEFAULT_TOLERANCES,
  initialStep = 0.25,
  denseComponents: Int32Array | null = null,
  active = y.length,
): number {
  const n = y.length;
  // Intermediate stages only for the components the right-hand side reads.
  const m = Math.min(n, active);
  const { k2, k3, k4, k5, k6, stage, r1, r2, r3, r4, r5 } = ws;
  // The current state, its derivative, the candidate state and its derivative: swapped on
  // acceptance (first same as last: k7 of a step is k1 of the next) instead of copied.
  let yNow = ws.state;
  let yNext = ws.next;
  let k1 = ws.k1;
  let k7 = ws.k7;
  yNow.set(y);
  const { absolute, relative, maxStep } = tol;
  const flushBelow = tol.flushBelow ?? 0;
  ws.steps = 0;
  ws.rejected = 0;
  ws.stoppedAt = null;
  let t = t0;
  let h = Math.min(initialStep, maxStep, t1 - t0);
  let out = 0;
  const outputs = outputTimes.length;
  while (out < outputs && outputTimes[out] <= t0) out++;
  rhs(t, yNow, k1);
  while (t < t1) {
    attemptedSteps++;
    const last = t + 1.01 * h >= t1;
    if (last) h = t1 - t;
    for (let i = 0; i < m; i++) stage[i] = yNow[i] + h * A21 * k1[i];
    rhs(t + C2 * h, stage, k2);
    for (let i = 0; i < m; i++) stage[i] = yNow[i] + h * (A31 * k1[i] + A32 * k2[i]);
    rhs(t + C3 * h, stage, k3);
    for (let i = 0; i < m; i++) stage[i] = yNow[i] + h * (A41 * k1[i] + A42 * k2[i] + A43 * k3[i]);
    rhs(t + C4 * h, stage, k4);
    for (let i = 0; i < m; i++) stage[i] = yNow[i] + h * (A51 * k1[i] + A52 * k2[i] + A53 * k3[i] + A54 * k4[i]);
    rhs(t + C5 * h, stage, k5);
    for (let i = 0; i < m; i++) stage[i] = yNow[i] + h * (A61 * k1[i] + A62 * k2[i] + A63 * k3[i] + A64 * k4[i] + A65 * k5[i]);
    rhs(t + h, stage, k6);
    for (let i = 0; i < n; i++) yNext[i] = yNow[i] + h * (A71 * k1[i] + A73 * k3[i] + A74 * k4[i] + A75 * k5[i] + A76 * k6[i]);
    rhs(t + h, yNext, k7);
    let err = 0;
    for (let i = 0; i < n; i++) {
      const a = yNow[i];
      const b = yNext[i];
      const scale = absolute + relative * Math.max(a < 0 ? -a : a, b < 0 ? -b : b);
      const e = (h * (E1 * k1[i] + E3 * k3[i] + E4 * k4[i] + E5 * k5[i] + E6 * k6[i] + E7 * k7[i])) / scale;
      err += e * e;
    }
    err = Math.sqrt(err / n);
    if (!(err <= 1)) {
      ws.rejected++;
      h *= Number.isFinite(err) ? Math.max(0.2, 0.9 * Math.pow(err, -0.2)) : 0.2;
      if (h < 1e-12) throw new Error(`the model could not be solved near day ${t.toFixed(2)}: its rates are too extreme`);
      continue;
    }
    ws.steps++;
    // Tiny components set to 0; the derivative there is then evaluated again (first same as last).
    let flushed = false;
    for (let i = 0; i < n; i++) {
      if (yNext[i] !== 0 && Math.abs(yNext[i]) < flushBelow) {
        yNext[i] = 0;
        flushed = true;
      }
    }
    if (flushed) rhs(t + h, yNext, k7);
    if (ws.steps > MAX_STEPS) throw new Error(`the model could not be solved near day ${t.toFixed(2)}: its rates are too extreme`);
    const tNew = last ? t1 : t + h;
    if (out < outputs && outputTimes[out] <= tNew) {
      const dense = denseComponents === null ? n : denseComponents.length;
      for (let c = 0; c < dense; c++) {
        const i = denseComponents === null ? c : denseComponents[c];
        const ydiff = yNext[i] - yNow[i];
        const bspl = h * k1[i] - ydiff;
        r1[i] = yNow[i];
        r2[i] = ydiff;
        r3[i] = bspl;
        r4[i] = ydiff - h * k7[i] - bspl;
        r5[i] = h * (D1 * k1[i] + D3 * k3[i] + D4 * k4[i] + D5 * k5[i] + D6 * k6[i] + D7 * k7[i]);
      }
      let stopAt = Number.NaN;
      while (out < outputs && outputTimes[out] <= tNew) {
        const theta = (outputTimes[out] - t) / h;
        const theta1 = 1 - theta;
        for (let c = 0; c < dense; c++) {
          const i = denseComponents === null ? c : denseComponents[c];
          stage[i] = r1[i] + theta * (r2[i] + theta1 * (r3[i] + theta * (r4[i] + theta1 * r5[i])));
        }
        const stop = sink(outputTimes[out], stage);
        out++;
        if (stop === true) {
          stopAt = outputTimes[out - 1];
          break;
        }
      }
      if (!Number.isNaN(stopAt)) {
        ws.stoppedAt = stopAt;
        t1 = stopAt;
        if (stopAt < tNew) {
          // Redo this step so that it ends exactly where the right-hand side changes.
          ws.steps--;
          h = stopAt - t;
          continue;
        }
      }
    }
    let swap = yNow;
    yNow = yNext;
    yNext = swap;
    swap = k1;
    k1 = k7;
    k7 = swap;
    t = tNew;
    const factor = err === 0 ? 5 : Math.min(5, Math.max(0.2, 0.9 * Math.pow(err, -0.2)));
    h = Math.min(h * factor, maxStep);
  }
  y.set(yNow);
  return h;
}
