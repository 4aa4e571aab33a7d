/**
 * The ODE integrator of every option run: Tsitouras 5(4), an explicit Runge-Kutta pair with
 * adaptive step size and dense output.
 *
 * Coefficients, the embedded 4th-order error estimate and the continuous extension of order 4
 * are those of Ch. Tsitouras 2011, "Runge-Kutta pairs of order 5(4) satisfying only the first
 * column simplifying assumption", Computers & Mathematics with Applications 62:770-775. Seven
 * stages, the last one at the new point (first same as last): six evaluations of the right-hand
 * side per step, like Dormand-Prince 5(4), with smaller error coefficients, so fewer steps reach
 * the same accuracy (the demo's "Schools closed 8 weeks": 116 steps instead of 136, at a smaller
 * worst error of the outcomes; test/engine/accuracy.test.ts). The order conditions (order 5 for the step, order 4 for the
 * continuous extension at every theta) are checked in test/engine/integrator.test.ts.
 *
 * Error norm: RMS of e_i / (atol + rtol * max(|y_i|, |y_new_i|)) with e = h sum_j E_j k_j;
 * step factor 0.9 * err^(-1/5), limited to [0.2, 5] (Hairer, Norsett & Wanner 1993, Solving
 * ODEs I, 2nd ed., section II.4). Works on Float64Arrays; no allocation per step. Units: the
 * caller's (days and persons in the engine).
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

/** A safety net: no realistic scenario needs more steps in one segment (the demo takes about 110). */
const MAX_STEPS = 1_000_000;

/**
 * The tolerances of every option run. rtol 5e-6 keeps attack rates, deaths, the peak of the
 * infected and peak bed occupancy within 1e-6 (relative) of an rtol 1e-10 solution on the demo and
 * on fast- and slow-growth variants, vaccination included, with a margin of about 3 (worst
 * 3.6e-7; test/engine/accuracy.test.ts). At 8e-6 the demo's vaccination option misses by 1.6e-6.
 * atol is in persons.
 */
export const DEFAULT_TOLERANCES: Tolerances = { relative: 5e-6, absolute: 1e-6, maxStep: 10, flushBelow: 1e-100 };

/**
 * Largest x with |R(-x')| <= 1 for every x' in [0, x], R the stability polynomial of the pair's
 * 5th-order solution: the method is stable for h * rate up to this on the negative real axis.
 * Computed from the coefficients below (test/engine/integrator.test.ts: 3.507).
 */
export const REAL_STABILITY_BOUNDARY = 3.5;

let attemptedSteps = 0;

/**
 * Steps attempted (accepted and rejected) by every `integrate` call so far in this realm: a
 * deterministic measure of the integrator's work, for step budgets in tests (never timings).
 */
export function integratorStepsSoFar(): number {
  return attemptedSteps;
}

/** Adds the steps attempted by the WebAssembly kernel (optionKernel.ts), which runs this integrator's steps. */
export function countAttemptedSteps(steps: number): void {
  attemptedSteps += steps;
}

/** The failure when the step size collapses or the step count explodes near day t. */
export function unsolvableNear(t: number): Error {
  return new Error(`the model could not be solved near day ${t.toFixed(2)}: its rates are too extreme`);
}

// Tsitouras 2011, Table 1 (a_i1 = c_i - sum_{j>1} a_ij, the row-sum condition of the paper).
const C2 = 0.161, C3 = 0.327, C4 = 0.9, C5 = 0.9800255409045097;
const A32 = 0.335480655492357;
const A42 = -6.359448489975075, A43 = 4.362295432869581;
const A52 = -11.74888356406283, A53 = 7.495539342889836, A54 = -0.09249506636175525;
const A62 = -12.92096931784711, A63 = 8.159367898576159, A64 = -0.071584973281401, A65 = -0.02826905039406838;
const A21 = C2;
const A31 = C3 - A32;
const A41 = C4 - A42 - A43;
const A51 = C5 - A52 - A53 - A54;
const A61 = 1 - A62 - A63 - A64 - A65;
/** 5th-order weights b_i (b_7 = 0): the new state, and stage 7 is evaluated at it. */
const B1 = 0.09646076681806523, B2 = 0.01, B3 = 0.4798896504144996, B4 = 1.379008574103742, B5 = -3.290069515436081, B6 = 2.324710524099774;
/** b_i - bhat_i: the difference to the embedded 4th-order solution (sum 0). */
const E1 = 0.001780011052226, E2 = 0.000816434459657, E3 = -0.007880878010262, E4 = 0.144711007173263;
const E5 = -0.582357165452555, E6 = 0.458082105929187, E7 = -1 / 66;

/**
 * Weights b_i(theta) of the continuous extension, y(t + theta h) = y + h sum_i b_i(theta) k_i,
 * in the factored form of Tsitouras 2011 (section 3), written into w[0..6]. b_i(1) = b_i.
 */
export function denseWeights(theta: number, w: Float64Array): void {
  const t = theta;
  const t2 = t * t;
  w[0] = -1.0530884977290216 * t * (t - 1.3299890189751412) * (t2 - 1.4364028541716351 * t + 0.7139816917074209);
  w[1] = 0.1017 * t2 * (t2 - 2.1966568338249754 * t + 1.2949852507374631);
  w[2] = 2.490627285651252793 * t2 * (t2 - 2.38535645472061657 * t + 1.57803468208092486);
  w[3] = -16.54810288924490272 * (t - 1.21712927295533244) * (t - 0.61620406037800089) * t2;
  w[4] = 47.37952196281928122 * (t - 1.203071208372362603) * (t - 0.658047292653547382) * t2;
  w[5] = -34.87065786149660974 * (t - 1.2) * (t - 0.666666666666666667) * t2;
  w[6] = 2.5 * (t - 1) * (t - 0.6) * t2;
}

/** y + h sum_i w_i k_i at the components `dense`, into out. */
function denseState(
  out: Float64Array, y: Float64Array, h: number, w: Float64Array,
  k1: Float64Array, k2: Float64Array, k3: Float64Array, k4: Float64Array, k5: Float64Array, k6: Float64Array, k7: Float64Array,
  dense: Int32Array,
): void {
  const w1 = h * w[0], w2 = h * w[1], w3 = h * w[2], w4 = h * w[3], w5 = h * w[4], w6 = h * w[5], w7 = h * w[6];
  for (let c = 0; c < dense.length; c++) {
    const i = dense[c];
    out[i] = y[i] + w1 * k1[i] + w2 * k2[i] + w3 * k3[i] + w4 * k4[i] + w5 * k5[i] + w6 * k6[i] + w7 * k7[i];
  }
}

/** The pair's coefficients as arrays, for the order-condition checks (test/engine/integrator.test.ts). */
export const TABLEAU: { c: readonly number[]; a: readonly (readonly number[])[]; b: readonly number[]; e: readonly number[] } = {
  c: [0, C2, C3, C4, C5, 1, 1],
  a: [[], [A21], [A31, A32], [A41, A42, A43], [A51, A52, A53, A54], [A61, A62, A63, A64, A65], [B1, B2, B3, B4, B5, B6]],
  b: [B1, B2, B3, B4, B5, B6, 0],
  e: [E1, E2, E3, E4, E5, E6, E7],
};

/** Scratch space for one system size; reuse it across calls to avoid allocation. */
export class IntegratorWorkspace {
  readonly k1: Float64Array; readonly k2: Float64Array; readonly k3: Float64Array; readonly k4: Float64Array;
  readonly k5: Float64Array; readonly k6: Float64Array; readonly k7: Float64Array;
  readonly stage: Float64Array; readonly next: Float64Array; readonly state: Float64Array;
  readonly weights = new Float64Array(7);
  /** Accepted and rejected step counts of the last call. */
  steps = 0;
  rejected = 0;
  /** Where the last call stopped early at the sink's request, or null when it reached t1. */
  stoppedAt: number | null = null;
  constructor(readonly size: number) {
    const f = () => new Float64Array(size);
    this.k1 = f(); this.k2 = f(); this.k3 = f(); this.k4 = f(); this.k5 = f(); this.k6 = f(); this.k7 = f();
    this.stage = f(); this.next = f(); this.state = f();
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
 * the caller reads. Only components 0..active-1 are read by `rhs` (the others it only writes),
 * so only those get intermediate stage values. Returns the last accepted step size, to start the
 * next segment with.
 */
export function integrate(
  rhs: RightHandSide,
  y: Float64Array,
  t0: number,
  t1: number,
  outputTimes: ArrayLike<number>,
  sink: OutputSink,
  ws: IntegratorWorkspace,
  tol: Tolerances = DEFAULT_TOLERANCES,
  initialStep = 0.25,
  denseComponents: Int32Array | null = null,
  active = y.length,
): number {
  const n = y.length;
  const m = Math.min(n, active);
  const { k2, k3, k4, k5, k6, stage, weights: w } = ws;
  // The current state, its derivative, the candidate state and its derivative: swapped on
  // acceptance (first same as last: k7 of a step is k1 of the next) instead of copied.
  let yNow = ws.state;
  let yNext = ws.next;
  let k1 = ws.k1;
  let k7 = ws.k7;
  yNow.set(y);
  const { absolute, relative, maxStep } = tol;
  const flushBelow = tol.flushBelow ?? 0;
  const dense = denseComponents ?? Int32Array.from({ length: n }, (_, i) => i);
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
    for (let i = 0; i < n; i++) yNext[i] = yNow[i] + h * (B1 * k1[i] + B2 * k2[i] + B3 * k3[i] + B4 * k4[i] + B5 * k5[i] + B6 * k6[i]);
    rhs(t + h, yNext, k7);
    let err = 0;
    for (let i = 0; i < n; i++) {
      const a = yNow[i];
      const b = yNext[i];
      const scale = absolute + relative * Math.max(a < 0 ? -a : a, b < 0 ? -b : b);
      const e = (h * (E1 * k1[i] + E2 * k2[i] + E3 * k3[i] + E4 * k4[i] + E5 * k5[i] + E6 * k6[i] + E7 * k7[i])) / scale;
      err += e * e;
    }
    err = Math.sqrt(err / n);
    if (!(err <= 1)) {
      ws.rejected++;
      h *= Number.isFinite(err) ? Math.max(0.2, 0.9 * Math.pow(err, -0.2)) : 0.2;
      if (h < 1e-12) throw unsolvableNear(t);
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
    if (ws.steps > MAX_STEPS) throw unsolvableNear(t);
    const tNew = last ? t1 : t + h;
    if (out < outputs && outputTimes[out] <= tNew) {
      let stopAt = Number.NaN;
      while (out < outputs && outputTimes[out] <= tNew) {
        denseWeights((outputTimes[out] - t) / h, w);
        denseState(stage, yNow, h, w, k1, k2, k3, k4, k5, k6, k7, dense);
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
