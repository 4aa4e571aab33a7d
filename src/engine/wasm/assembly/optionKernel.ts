/**
 * WebAssembly kernel of an option run, in AssemblyScript (built by `npm run wasm` into
 * ../optionKernelBinary.ts; the host side is ../../optionKernel.ts): the Tsitouras 5(4) steps of
 * ../../integrator.ts, the right-hand side of ../../seir.ts without counters (S, E stages,
 * I stages, and with vaccination W, P | Xp, Q, V, the unvaccinated in closed form as in
 * ../../vaccination/unvaccinated.ts), dense output at whole days and the daily record of
 * ../../integrateOption.ts.
 *
 * Every floating-point operation is the one of the TypeScript path, in the same order, so the
 * results are identical bit for bit (test/engine/optionKernel.test.ts): sums over components stay
 * sequential; SIMD (f64x2) only computes two independent components at once, which is exact (no
 * fused multiply-add). x^(-1/5) of the step control comes from the host's Math.pow (imported),
 * for the same reason.
 *
 * Memory (byte offsets set by `configure` from `base`): bands are padded to an even count np
 * (zero rows and columns of the transmission matrix, zero components: a zero stays zero and adds
 * nothing to any sum). State blocks of np in seir.ts's order; the first mActive components are
 * the ones the right-hand side reads (stage values are formed for those only). Daily records:
 * rows of np, days 0..horizon. No allocation, no runtime.
 */

@external('env', 'pow')
declare function hostPow(x: f64, y: f64): f64;

/** Called after each day's record when `watchDays` is set: returns 1 to stop there. */
@external('env', 'day')
declare function hostDay(day: i32): i32;

// Tsitouras 2011, Table 1 (as in integrator.ts).
const C2: f64 = 0.161, C3: f64 = 0.327, C4: f64 = 0.9, C5: f64 = 0.9800255409045097;
const A32: f64 = 0.335480655492357;
const A42: f64 = -6.359448489975075, A43: f64 = 4.362295432869581;
const A52: f64 = -11.74888356406283, A53: f64 = 7.495539342889836, A54: f64 = -0.09249506636175525;
const A62: f64 = -12.92096931784711, A63: f64 = 8.159367898576159, A64: f64 = -0.071584973281401, A65: f64 = -0.02826905039406838;
const A21: f64 = C2;
const A31: f64 = C3 - A32;
const A41: f64 = C4 - A42 - A43;
const A51: f64 = C5 - A52 - A53 - A54;
const A61: f64 = 1 - A62 - A63 - A64 - A65;
const B1: f64 = 0.09646076681806523, B2: f64 = 0.01, B3: f64 = 0.4798896504144996, B4: f64 = 1.379008574103742, B5: f64 = -3.290069515436081, B6: f64 = 2.324710524099774;
const E1: f64 = 0.001780011052226, E2: f64 = 0.000816434459657, E3: f64 = -0.007880878010262, E4: f64 = 0.144711007173263;
const E5: f64 = -0.582357165452555, E6: f64 = 0.458082105929187, E7: f64 = -1.0 / 66.0;

const MAX_STEPS: i32 = 1_000_000;

// Model and tolerances (configure).
let n: i32 = 0; // bands
let np: i32 = 0; // bands padded to even
let kE: i32 = 1;
let kI: i32 = 1;
let m: i32 = 0; // components incl. padding: blocks x np
let mActive: i32 = 0; // the components the right-hand side reads: S, E.., I.. (and W, P)
let count: f64 = 0; // components without padding, for the RMS norm
let aE: f64 = 0;
let aI: f64 = 0;
let rtol: f64 = 0;
let atol: f64 = 0;
let maxStep: f64 = 0;
let flushBelow: f64 = 0;
let horizon: i32 = 0;
let watchDays: bool = false;
// Vaccination (seir.ts): 0 none, 1 leaky, 2 all-or-nothing; blocks W, P | Xp, Q (, V) after I.
let protection: i32 = 0;
let risk: f64 = 1;
let protect: f64 = 0;
let efficacy: f64 = 0;
let dosesFrom: f64 = 0; // start of the dose segment (vaccination/unvaccinated.ts)

// Byte offsets (configure).
let pY: usize = 0; // state in and out
let pA: usize = 0; // state scratch (yNow / yNext swap)
let pB: usize = 0;
let pK: usize = 0; // 7 derivative blocks of m
let pStage: usize = 0;
let pDense: usize = 0; // dense-output state, read by the host's `day`
let pM: usize = 0; // transmission, n rows of np
let pInf: usize = 0; // np
let pS0: usize = 0; // np, initial susceptibles
let pAtStart: usize = 0; // np, unvaccinated at the dose segment's start
let pRates: usize = 0; // np, doses per day in the segment
let pPerUnit: usize = 0; // np, 1 / quadrature unit (seir.ts quadratureUnits)
let pUnit: usize = 0; // np, quadrature unit
let pOutS: usize = 0; // (horizon + 1) rows of np
let pOutPrev: usize = 0;
let pOutCum: usize = 0;
let pOutEff: usize = 0; // S + W + s P (vaccination only)
let pOutProt: usize = 0; // Xp in persons (vaccination only)

// Results of the last `integrate`.
let lastSteps: i32 = 0;
let lastRejected: i32 = 0;
let lastAttempted: i32 = 0;
let lastStoppedAt: f64 = NaN;
let lastFailedAt: f64 = NaN;

export function configure(
  bands: i32, latentStages: i32, infectiousStages: i32, latentRate: f64, infectiousRate: f64,
  relative: f64, absolute: f64, largestStep: f64, flush: f64, horizonDays: i32, vaccine: i32, base: usize,
): usize {
  n = bands;
  np = (bands + 1) & ~1;
  kE = latentStages;
  kI = infectiousStages;
  protection = vaccine;
  const active = 1 + kE + kI + (vaccine > 0 ? 2 : 0);
  const blocks = active + (vaccine > 0 ? 2 : 0) + (vaccine == 2 ? 1 : 0);
  mActive = active * np;
  m = blocks * np;
  count = <f64>(blocks * bands);
  aE = latentRate;
  aI = infectiousRate;
  rtol = relative;
  atol = absolute;
  maxStep = largestStep;
  flushBelow = flush;
  horizon = horizonDays;
  const block = <usize>m << 3;
  pY = base;
  pA = pY + block;
  pB = pA + block;
  pK = pB + block;
  pStage = pK + 7 * block;
  pDense = pStage + block;
  pM = pDense + block;
  pInf = pM + (<usize>(n * np) << 3);
  pS0 = pInf + (<usize>np << 3);
  pAtStart = pS0 + (<usize>np << 3);
  pRates = pAtStart + (<usize>np << 3);
  pPerUnit = pRates + (<usize>np << 3);
  pUnit = pPerUnit + (<usize>np << 3);
  pOutS = pUnit + (<usize>np << 3);
  const rows = <usize>((horizonDays + 1) * np) << 3;
  pOutPrev = pOutS + rows;
  pOutCum = pOutPrev + rows;
  pOutEff = pOutCum + rows;
  pOutProt = pOutEff + (vaccine > 0 ? rows : 0);
  const end = pOutProt + (vaccine > 0 ? rows : 0);
  const pages = <i32>((end + 65535) >> 16) - memory.size();
  if (pages > 0 && memory.grow(pages) < 0) unreachable();
  // The padding must be zero; everything else is written before it is read.
  memory.fill(pY, 0, block);
  memory.fill(pM, 0, pOutS - pM);
  return end;
}

/** The vaccine (seir.ts): relative risk in P, 1 / delay to protection, efficacy against infection. */
export function configureVaccine(protectedRisk: f64, protectionRate: f64, efficacyAgainstInfection: f64): void {
  risk = protectedRisk;
  protect = protectionRate;
  efficacy = efficacyAgainstInfection;
}

/** The dose segment's start; the host writes U there and the rates (vaccination/unvaccinated.ts). */
export function setDosesFrom(day: f64): void { dosesFrom = day; }

export function offsetOfState(): usize { return pY; }
export function offsetOfUnvaccinatedAtStart(): usize { return pAtStart; }
export function offsetOfDoseRates(): usize { return pRates; }
export function offsetOfPerUnit(): usize { return pPerUnit; }
export function offsetOfUnit(): usize { return pUnit; }
export function offsetOfEffectiveSusceptible(): usize { return pOutEff; }
export function offsetOfProtectedCumulative(): usize { return pOutProt; }
export function offsetOfDense(): usize { return pDense; }
export function offsetOfTransmission(): usize { return pM; }
export function offsetOfInitialSusceptible(): usize { return pS0; }
export function offsetOfSusceptible(): usize { return pOutS; }
export function offsetOfPrevalence(): usize { return pOutPrev; }
export function offsetOfCumulative(): usize { return pOutCum; }
export function steps(): i32 { return lastSteps; }
export function rejected(): i32 { return lastRejected; }
export function attempted(): i32 { return lastAttempted; }
export function stoppedAt(): f64 { return lastStoppedAt; }
export function failedAt(): f64 { return lastFailedAt; }
export function setWatchDays(on: bool): void { watchDays = on; }

@inline function k(j: i32): usize {
  return pK + ((<usize>(j * m)) << 3);
}

/**
 * sum_j M[row, j] v[j] in four partial sums, as dot.ts rowTimes: lanes (a0, a1) and (a2, a3),
 * the rest into a0, then a0 + a1 + (a2 + a3).
 */
@inline function rowTimes(row: usize, v: usize): f64 {
  let lo = f64x2.splat(0);
  let hi = f64x2.splat(0);
  let j: i32 = 0;
  for (; j + 3 < n; j += 4) {
    const at = <usize>j << 3;
    lo = f64x2.add(lo, f64x2.mul(v128.load(row + at), v128.load(v + at)));
    hi = f64x2.add(hi, f64x2.mul(v128.load(row + at, 16), v128.load(v + at, 16)));
  }
  let a0 = f64x2.extract_lane(lo, 0);
  for (; j < n; j++) a0 += load<f64>(row + (<usize>j << 3)) * load<f64>(v + (<usize>j << 3));
  return a0 + f64x2.extract_lane(lo, 1) + (f64x2.extract_lane(hi, 0) + f64x2.extract_lane(hi, 1));
}

/** seir.ts's right-hand side without counters at time t, into dy. */
function rhs(t: f64, y: usize, dy: usize): void {
  const zero = f64x2.splat(0);
  const stride = <usize>np << 3;
  const oE = stride;
  const oI = stride * <usize>(1 + kE);
  const lastE = oI - stride;
  const vE = f64x2.splat(aE);
  const vI = f64x2.splat(aI);
  // Infectious persons by band, negative dips clipped.
  for (let j: i32 = 0; j < np; j += 2) {
    const at = <usize>j << 3;
    let sum = zero;
    for (let s: i32 = 0; s < kI; s++) sum = f64x2.add(sum, v128.load(y + oI + stride * <usize>s + at));
    v128.store(pInf + at, f64x2.pmax(zero, sum));
  }
  for (let i: i32 = 0; i < np; i += 2) {
    const at = <usize>i << 3;
    let lambda = zero;
    if (i < n) lambda = f64x2.replace_lane(lambda, 0, rowTimes(pM + ((<usize>(i * np)) << 3), pInf));
    if (i + 1 < n) lambda = f64x2.replace_lane(lambda, 1, rowTimes(pM + ((<usize>((i + 1) * np)) << 3), pInf));
    const susceptible = f64x2.pmax(zero, v128.load(y + at));
    let flow = f64x2.mul(lambda, susceptible);
    if (protection > 0) {
      const oW = oI + stride * <usize>kI;
      const oP = oW + stride;
      const oXp = oP + stride;
      const oQ = oXp + stride;
      const w = f64x2.max(zero, v128.load(y + oW + at));
      const p = f64x2.max(zero, v128.load(y + oP + at));
      const rates = v128.load(pRates + at);
      const u = f64x2.sub(v128.load(pAtStart + at), f64x2.mul(rates, f64x2.splat(t - dosesFrom)));
      const some = f64x2.gt(u, zero);
      const v = v128.bitselect(rates, zero, some);
      const share = v128.bitselect(f64x2.min(f64x2.splat(1), f64x2.div(susceptible, u)), zero, some);
      const toWaiting = f64x2.mul(v, share);
      const protecting = f64x2.mul(f64x2.splat(protect), w);
      const protectedFlow = f64x2.mul(f64x2.mul(f64x2.splat(risk), lambda), p);
      const perUnit = v128.load(pPerUnit + at);
      v128.store(dy + at, f64x2.sub(f64x2.neg(flow), toWaiting));
      v128.store(dy + oW + at, f64x2.sub(f64x2.sub(toWaiting, f64x2.mul(lambda, w)), protecting));
      if (protection == 1) {
        v128.store(dy + oP + at, f64x2.sub(protecting, protectedFlow));
      } else {
        v128.store(dy + oP + at, f64x2.sub(f64x2.mul(f64x2.splat(1 - efficacy), protecting), protectedFlow));
        v128.store(dy + oQ + stride + at, f64x2.mul(f64x2.splat(efficacy), protecting));
      }
      v128.store(dy + oXp + at, f64x2.mul(perUnit, protectedFlow));
      v128.store(dy + oQ + at, f64x2.mul(perUnit, f64x2.sub(v, toWaiting)));
      flow = f64x2.add(flow, f64x2.add(f64x2.mul(lambda, w), protectedFlow));
    } else {
      v128.store(dy + at, f64x2.neg(flow));
    }
    v128.store(dy + oE + at, f64x2.sub(flow, f64x2.mul(vE, v128.load(y + oE + at))));
    for (let s: i32 = 1; s < kE; s++) {
      const c = oE + stride * <usize>s + at;
      v128.store(dy + c, f64x2.mul(vE, f64x2.sub(v128.load(y + c - stride), v128.load(y + c))));
    }
    v128.store(dy + oI + at, f64x2.sub(f64x2.mul(vE, v128.load(y + lastE + at)), f64x2.mul(vI, v128.load(y + oI + at))));
    for (let s: i32 = 1; s < kI; s++) {
      const c = oI + stride * <usize>s + at;
      v128.store(dy + c, f64x2.mul(vI, f64x2.sub(v128.load(y + c - stride), v128.load(y + c))));
    }
  }
}

/** Daily record of integrateOption.ts (S, E + I, S(0) - S, each clipped at 0) from the state at y. */
function record(day: i32, y: usize): void {
  const zero = f64x2.splat(0);
  const stride = <usize>np << 3;
  const row = (<usize>(day * np)) << 3;
  const blocks = kE + kI;
  for (let i: i32 = 0; i < np; i += 2) {
    const at = <usize>i << 3;
    const s = v128.load(y + at);
    let infected = zero;
    for (let b: i32 = 0; b < blocks; b++) infected = f64x2.add(infected, v128.load(y + stride * <usize>(1 + b) + at));
    v128.store(pOutS + row + at, f64x2.pmax(zero, s));
    v128.store(pOutPrev + row + at, f64x2.pmax(zero, infected));
    let x = f64x2.sub(v128.load(pS0 + at), s);
    if (protection > 0) {
      // X = (S + W + P + V)(0) - (S + W + P + V): integrateOption.ts's record.
      const oW = stride * <usize>(1 + blocks);
      const w = v128.load(y + oW + at);
      const pr = v128.load(y + oW + stride + at);
      const immune = protection == 2 ? v128.load(y + oW + 4 * stride + at) : zero;
      x = f64x2.sub(x, f64x2.add(f64x2.add(w, pr), immune));
      const eff = f64x2.add(f64x2.add(s, w), f64x2.mul(f64x2.splat(risk), pr));
      v128.store(pOutEff + row + at, f64x2.pmax(zero, eff));
      const xp = f64x2.mul(v128.load(y + oW + 2 * stride + at), v128.load(pUnit + at));
      v128.store(pOutProt + row + at, f64x2.pmax(zero, xp));
    }
    v128.store(pOutCum + row + at, f64x2.pmax(zero, x));
  }
}

export function recordState(day: i32): void {
  record(day, pY);
}

/**
 * Integrates the state at pY from t0 to t1 with the transmission at pM, recording whole days in
 * (t0, t1]; returns the last accepted step size. See integrator.ts `integrate`.
 */
export function integrate(t0: f64, t1: f64, initialStep: f64): f64 {
  const size = <usize>m << 3;
  const activeSize = <usize>mActive << 3;
  const k2 = k(1), k3 = k(2), k4 = k(3), k5 = k(4), k6 = k(5);
  let k1 = k(0);
  let k7 = k(6);
  let yNow = pA;
  let yNext = pB;
  memory.copy(yNow, pY, size);
  lastSteps = 0;
  lastRejected = 0;
  lastAttempted = 0;
  lastStoppedAt = NaN;
  lastFailedAt = NaN;
  let accepted: i32 = 0;
  let t = t0;
  let h = Math.min(Math.min(initialStep, maxStep), t1 - t0);
  let day: i32 = 1;
  while (day <= horizon && <f64>day <= t0) day++;
  rhs(t, yNow, k1);
  while (t < t1) {
    lastAttempted++;
    const last = t + 1.01 * h >= t1;
    if (last) h = t1 - t;
    const vh = f64x2.splat(h);
    {
      const c1 = f64x2.splat(h * A21);
      for (let i: usize = 0; i < activeSize; i += 16) {
        v128.store(pStage + i, f64x2.add(v128.load(yNow + i), f64x2.mul(c1, v128.load(k1 + i))));
      }
    }
    rhs(t + C2 * h, pStage, k2);
    {
      const c1 = f64x2.splat(A31), c2 = f64x2.splat(A32);
      for (let i: usize = 0; i < activeSize; i += 16) {
        const s = f64x2.add(f64x2.mul(c1, v128.load(k1 + i)), f64x2.mul(c2, v128.load(k2 + i)));
        v128.store(pStage + i, f64x2.add(v128.load(yNow + i), f64x2.mul(vh, s)));
      }
    }
    rhs(t + C3 * h, pStage, k3);
    {
      const c1 = f64x2.splat(A41), c2 = f64x2.splat(A42), c3 = f64x2.splat(A43);
      for (let i: usize = 0; i < activeSize; i += 16) {
        let s = f64x2.add(f64x2.mul(c1, v128.load(k1 + i)), f64x2.mul(c2, v128.load(k2 + i)));
        s = f64x2.add(s, f64x2.mul(c3, v128.load(k3 + i)));
        v128.store(pStage + i, f64x2.add(v128.load(yNow + i), f64x2.mul(vh, s)));
      }
    }
    rhs(t + C4 * h, pStage, k4);
    {
      const c1 = f64x2.splat(A51), c2 = f64x2.splat(A52), c3 = f64x2.splat(A53), c4 = f64x2.splat(A54);
      for (let i: usize = 0; i < activeSize; i += 16) {
        let s = f64x2.add(f64x2.mul(c1, v128.load(k1 + i)), f64x2.mul(c2, v128.load(k2 + i)));
        s = f64x2.add(s, f64x2.mul(c3, v128.load(k3 + i)));
        s = f64x2.add(s, f64x2.mul(c4, v128.load(k4 + i)));
        v128.store(pStage + i, f64x2.add(v128.load(yNow + i), f64x2.mul(vh, s)));
      }
    }
    rhs(t + C5 * h, pStage, k5);
    {
      const c1 = f64x2.splat(A61), c2 = f64x2.splat(A62), c3 = f64x2.splat(A63), c4 = f64x2.splat(A64), c5 = f64x2.splat(A65);
      for (let i: usize = 0; i < activeSize; i += 16) {
        let s = f64x2.add(f64x2.mul(c1, v128.load(k1 + i)), f64x2.mul(c2, v128.load(k2 + i)));
        s = f64x2.add(s, f64x2.mul(c3, v128.load(k3 + i)));
        s = f64x2.add(s, f64x2.mul(c4, v128.load(k4 + i)));
        s = f64x2.add(s, f64x2.mul(c5, v128.load(k5 + i)));
        v128.store(pStage + i, f64x2.add(v128.load(yNow + i), f64x2.mul(vh, s)));
      }
    }
    rhs(t + h, pStage, k6);
    {
      const c1 = f64x2.splat(B1), c2 = f64x2.splat(B2), c3 = f64x2.splat(B3), c4 = f64x2.splat(B4), c5 = f64x2.splat(B5), c6 = f64x2.splat(B6);
      for (let i: usize = 0; i < size; i += 16) {
        let s = f64x2.add(f64x2.mul(c1, v128.load(k1 + i)), f64x2.mul(c2, v128.load(k2 + i)));
        s = f64x2.add(s, f64x2.mul(c3, v128.load(k3 + i)));
        s = f64x2.add(s, f64x2.mul(c4, v128.load(k4 + i)));
        s = f64x2.add(s, f64x2.mul(c5, v128.load(k5 + i)));
        s = f64x2.add(s, f64x2.mul(c6, v128.load(k6 + i)));
        v128.store(yNext + i, f64x2.add(v128.load(yNow + i), f64x2.mul(vh, s)));
      }
    }
    rhs(t + h, yNext, k7);
    let err: f64 = 0;
    {
      const c1 = f64x2.splat(E1), c2 = f64x2.splat(E2), c3 = f64x2.splat(E3), c4 = f64x2.splat(E4), c5 = f64x2.splat(E5), c6 = f64x2.splat(E6), c7 = f64x2.splat(E7);
      const va = f64x2.splat(atol), vr = f64x2.splat(rtol);
      for (let i: usize = 0; i < size; i += 16) {
        const scale = f64x2.add(va, f64x2.mul(vr, f64x2.max(f64x2.abs(v128.load(yNow + i)), f64x2.abs(v128.load(yNext + i)))));
        let s = f64x2.add(f64x2.mul(c1, v128.load(k1 + i)), f64x2.mul(c2, v128.load(k2 + i)));
        s = f64x2.add(s, f64x2.mul(c3, v128.load(k3 + i)));
        s = f64x2.add(s, f64x2.mul(c4, v128.load(k4 + i)));
        s = f64x2.add(s, f64x2.mul(c5, v128.load(k5 + i)));
        s = f64x2.add(s, f64x2.mul(c6, v128.load(k6 + i)));
        s = f64x2.add(s, f64x2.mul(c7, v128.load(k7 + i)));
        const e = f64x2.div(f64x2.mul(vh, s), scale);
        const e2 = f64x2.mul(e, e);
        err += f64x2.extract_lane(e2, 0);
        err += f64x2.extract_lane(e2, 1);
      }
    }
    err = Math.sqrt(err / count);
    if (!(err <= 1)) {
      lastRejected++;
      h *= isFinite(err) ? Math.max(0.2, 0.9 * hostPow(err, -0.2)) : 0.2;
      if (h < 1e-12) {
        lastFailedAt = t;
        return h;
      }
      continue;
    }
    accepted++;
    lastSteps = accepted;
    let flushed = false;
    for (let i: usize = 0; i < size; i += 8) {
      const v = load<f64>(yNext + i);
      if (v != 0 && Math.abs(v) < flushBelow) {
        store<f64>(yNext + i, 0);
        flushed = true;
      }
    }
    if (flushed) rhs(t + h, yNext, k7);
    if (accepted > MAX_STEPS) {
      lastFailedAt = t;
      return h;
    }
    const tNew = last ? t1 : t + h;
    if (day <= horizon && <f64>day <= tNew) {
      let stopAt: f64 = NaN;
      while (day <= horizon && <f64>day <= tNew) {
        dense((<f64>day - t) / h, yNow, h, k1, k7);
        record(day, pDense);
        const stop = watchDays && hostDay(day) == 1;
        day++;
        if (stop) {
          stopAt = <f64>(day - 1);
          break;
        }
      }
      if (!isNaN(stopAt)) {
        lastStoppedAt = stopAt;
        t1 = stopAt;
        if (stopAt < tNew) {
          // Redo this step so that it ends exactly where the right-hand side changes.
          accepted--;
          lastSteps = accepted;
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
    const factor = err == 0 ? 5 : Math.min(5, Math.max(0.2, 0.9 * hostPow(err, -0.2)));
    h = Math.min(h * factor, maxStep);
  }
  memory.copy(pY, yNow, size);
  return h;
}

/** y + h sum_i b_i(theta) k_i into pDense: integrator.ts denseWeights and denseState. */
function dense(theta: f64, y: usize, h: f64, k1: usize, k7: usize): void {
  const t = theta;
  const t2 = t * t;
  const w0 = -1.0530884977290216 * t * (t - 1.3299890189751412) * (t2 - 1.4364028541716351 * t + 0.7139816917074209);
  const w1 = 0.1017 * t2 * (t2 - 2.1966568338249754 * t + 1.2949852507374631);
  const w2 = 2.490627285651252793 * t2 * (t2 - 2.38535645472061657 * t + 1.57803468208092486);
  const w3 = -16.54810288924490272 * (t - 1.21712927295533244) * (t - 0.61620406037800089) * t2;
  const w4 = 47.37952196281928122 * (t - 1.203071208372362603) * (t - 0.658047292653547382) * t2;
  const w5 = -34.87065786149660974 * (t - 1.2) * (t - 0.666666666666666667) * t2;
  const w6 = 2.5 * (t - 1) * (t - 0.6) * t2;
  const c1 = f64x2.splat(h * w0), c2 = f64x2.splat(h * w1), c3 = f64x2.splat(h * w2), c4 = f64x2.splat(h * w3);
  const c5 = f64x2.splat(h * w4), c6 = f64x2.splat(h * w5), c7 = f64x2.splat(h * w6);
  const size = <usize>m << 3;
  const k2 = k(1), k3 = k(2), k4 = k(3), k5 = k(4), k6 = k(5);
  for (let i: usize = 0; i < size; i += 16) {
    let s = f64x2.add(v128.load(y + i), f64x2.mul(c1, v128.load(k1 + i)));
    s = f64x2.add(s, f64x2.mul(c2, v128.load(k2 + i)));
    s = f64x2.add(s, f64x2.mul(c3, v128.load(k3 + i)));
    s = f64x2.add(s, f64x2.mul(c4, v128.load(k4 + i)));
    s = f64x2.add(s, f64x2.mul(c5, v128.load(k5 + i)));
    s = f64x2.add(s, f64x2.mul(c6, v128.load(k6 + i)));
    s = f64x2.add(s, f64x2.mul(c7, v128.load(k7 + i)));
    v128.store(pDense + i, s);
  }
}
