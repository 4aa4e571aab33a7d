/**
 * The host side of the option kernel: option runs integrated in WebAssembly (source
 * wasm/assembly/optionKernel.ts, binary wasm/optionKernelBinary.ts, `npm run wasm`).
 *
 * The kernel runs the steps of integrator.ts on the right-hand side of seir.ts without counters
 * (with or without vaccination), with the dense output at whole days and the daily record of
 * integrateOption.ts, in the same floating-point operations in the same order: results identical
 * bit for bit to the TypeScript path, at a quarter to a third of its cost
 * (test/engine/optionKernel.test.ts; figures in DEVELOPERS.md).
 *
 * One instance per realm (thread), compiled synchronously on first use: Node, and the app's
 * engine workers (the renderer's main thread runs no option; Chromium refuses synchronous
 * compilation of more than 4 KB there). Pages that run it need 'wasm-unsafe-eval' in their
 * Content Security Policy (src/main/contentSecurity.ts). Where WebAssembly cannot compile it (no
 * WebAssembly as under node --jitless, no SIMD, a policy without it), `kernelAvailable()` is
 * false and integrateOption.ts takes the TypeScript path: the same numbers, slower.
 */
import { countAttemptedSteps, type Tolerances, unsolvableNear } from './integrator.ts';
import { protectedRisk, quadratureUnits, type StateLayout, type VaccineEffect } from './seir.ts';
import type { Unvaccinated } from './vaccination/unvaccinated.ts';
import { decodeBase64 } from './wasm/base64.ts';
import { instantiateWasm } from './wasm/instantiate.ts';
import { OPTION_KERNEL_BASE64 } from './wasm/optionKernelBinary.ts';

/** The kernel's exports (wasm/assembly/optionKernel.ts); offsets in bytes. */
interface KernelExports {
  memory: { buffer: ArrayBuffer };
  configure(
    bands: number, latentStages: number, infectiousStages: number, latentRate: number, infectiousRate: number,
    relative: number, absolute: number, largestStep: number, flush: number, horizonDays: number, vaccine: number, base: number,
  ): number;
  configureVaccine(protectedRisk: number, protectionRate: number, efficacyAgainstInfection: number): void;
  setDosesFrom(day: number): void;
  offsetOfUnvaccinatedAtStart(): number;
  offsetOfDoseRates(): number;
  offsetOfPerUnit(): number;
  offsetOfUnit(): number;
  offsetOfEffectiveSusceptible(): number;
  offsetOfProtectedCumulative(): number;
  offsetOfState(): number;
  offsetOfDense(): number;
  offsetOfTransmission(): number;
  offsetOfInitialSusceptible(): number;
  offsetOfSusceptible(): number;
  offsetOfPrevalence(): number;
  offsetOfCumulative(): number;
  attempted(): number;
  stoppedAt(): number;
  failedAt(): number;
  setWatchDays(on: number): void;
  recordState(day: number): void;
  integrate(t0: number, t1: number, initialStep: number): number;
}

let instance: KernelExports | null | undefined;
/** The day callback of the run in progress (a run never starts another inside it). */
let watching: ((day: number) => boolean) | null = null;

function instantiate(): KernelExports | null {
  const imports = { env: { pow: Math.pow, day: (day: number) => (watching !== null && watching(day) ? 1 : 0) } };
  return instantiateWasm(decodeBase64(OPTION_KERNEL_BASE64), imports) as KernelExports | null;
}

/** The kernel, compiled on first use in this thread, or null where WebAssembly cannot compile it. */
function kernel(): KernelExports | null {
  if (instance === undefined) instance = instantiate();
  return instance;
}

/** Whether the kernel runs here (compiles it on the first call). */
export function kernelAvailable(): boolean {
  return kernel() !== null;
}

/** Daily series the kernel records (integrateOption.ts DailyState): rows of n bands, days 0..H. */
export interface KernelRecord {
  susceptible: Float64Array;
  /** S + W + s P; only written with vaccination (without, the caller's array is `susceptible`). */
  effectiveSusceptible: Float64Array;
  prevalence: Float64Array;
  cumulative: Float64Array;
  /** Only written with vaccination. */
  protectedCumulative: Float64Array;
}

/**
 * One option run in the kernel, in the layout of seir.ts without counters (S, E.., I.., and with
 * vaccination W, P | Xp, Q, V); the kernel pads the bands to an even count, this class copies in
 * and out.
 */
export class KernelRun {
  private readonly k: KernelExports;
  private readonly n: number;
  private readonly np: number;
  private readonly blocks: number;
  private readonly horizon: number;
  private readonly vaccinated: boolean;
  private memory: Float64Array;
  /** The dense-output state of the day being watched, in the TypeScript layout. */
  private readonly state: Float64Array;
  /** Where the last `integrate` stopped at the watcher's request, or null when it reached its end. */
  stoppedAt: number | null = null;

  /**
   * y0: the initial state in layout L, s0 the initial susceptibles; with a vaccine, `doses` is the
   * run's Unvaccinated (read at every `integrate`). Records day 0. maxStep in `tolerances` is the
   * stability cap.
   */
  constructor(
    L: StateLayout, latentPeriodDays: number, infectiousPeriodDays: number, horizonDays: number,
    y0: Float64Array, s0: Float64Array, tolerances: Tolerances, vaccine: VaccineEffect | null, doses: Unvaccinated | null,
  ) {
    const k = kernel();
    if (k === null) throw new Error('the option kernel cannot run here: WebAssembly did not compile it');
    const { bands, latentStages, infectiousStages } = L;
    this.k = k;
    this.n = bands;
    this.np = (bands + 1) & ~1;
    // Without vaccination the state stops at L.active (R and X are not integrated; seir.ts).
    this.blocks = y0.length / bands;
    this.horizon = horizonDays;
    this.vaccinated = vaccine !== null;
    this.state = new Float64Array(y0.length);
    const protection = vaccine === null ? 0 : vaccine.protection === 'leaky' ? 1 : 2;
    k.configure(
      bands, latentStages, infectiousStages, latentStages / latentPeriodDays, infectiousStages / infectiousPeriodDays,
      tolerances.relative, tolerances.absolute, tolerances.maxStep, tolerances.flushBelow ?? 0, horizonDays, protection, 0,
    );
    this.memory = new Float64Array(k.memory.buffer);
    const f = this.memory;
    const at = k.offsetOfState() / 8;
    for (let b = 0; b < this.blocks; b++) f.set(y0.subarray(b * bands, (b + 1) * bands), at + b * this.np);
    f.set(s0.subarray(0, bands), k.offsetOfInitialSusceptible() / 8);
    if (vaccine !== null) {
      if (doses === null) throw new Error('a vaccination run needs its doses');
      k.configureVaccine(protectedRisk(vaccine), 1 / vaccine.delayToProtectionDays, vaccine.efficacyAgainstInfection);
      // As seir.ts and integrateOption.ts compute them.
      const unit = quadratureUnits(doses.population);
      f.set(unit, k.offsetOfUnit() / 8);
      f.set(unit.map((u) => 1 / u), k.offsetOfPerUnit() / 8);
    }
    k.recordState(0);
  }

  /**
   * Integrates from t0 to t1 with this transmission matrix (n x n, per day) and, with vaccination,
   * the doses' current segment, starting with step `initialStep`; returns the last accepted step
   * size. With `watch`, it is called at each whole day after its record (copied into `record`)
   * with the state then (a scratch buffer); `true` stops the integration there (`stoppedAt`), as
   * integrator.ts's sink does.
   */
  integrate(
    t0: number, t1: number, initialStep: number, transmission: Float64Array, doses: Unvaccinated | null,
    watch: ((day: number, state: Float64Array) => boolean) | null, record: KernelRecord,
  ): number {
    const { k, n, np, memory: f } = this;
    const m = k.offsetOfTransmission() / 8;
    for (let i = 0; i < n; i++) f.set(transmission.subarray(i * n, (i + 1) * n), m + i * np);
    if (this.vaccinated && doses !== null) {
      f.set(doses.atStart, k.offsetOfUnvaccinatedAtStart() / 8);
      f.set(doses.rates, k.offsetOfDoseRates() / 8);
      k.setDosesFrom(doses.fromDay);
    }
    k.setWatchDays(watch === null ? 0 : 1);
    const dense = k.offsetOfDense() / 8;
    const state = this.state;
    watching = watch === null ? null : (day) => {
      this.copyDay(day, record);
      for (let b = 0; b < this.blocks; b++) for (let i = 0; i < n; i++) state[b * n + i] = f[dense + b * np + i];
      return watch(day, state);
    };
    let step: number;
    try {
      step = k.integrate(t0, t1, initialStep);
    } finally {
      watching = null;
      countAttemptedSteps(k.attempted());
    }
    if (!Number.isNaN(k.failedAt())) throw unsolvableNear(k.failedAt());
    const stop = k.stoppedAt();
    this.stoppedAt = Number.isNaN(stop) ? null : stop;
    return step;
  }

  /** The series of the record and where the kernel keeps them. */
  private series(record: KernelRecord): [Float64Array, number][] {
    const k = this.k;
    const pairs: [Float64Array, number][] = [
      [record.susceptible, k.offsetOfSusceptible() / 8],
      [record.prevalence, k.offsetOfPrevalence() / 8],
      [record.cumulative, k.offsetOfCumulative() / 8],
    ];
    if (this.vaccinated) {
      pairs.push([record.effectiveSusceptible, k.offsetOfEffectiveSusceptible() / 8], [record.protectedCumulative, k.offsetOfProtectedCumulative() / 8]);
    }
    return pairs;
  }

  /** Day d's record into `record`. */
  copyDay(d: number, record: KernelRecord): void {
    const { n, np, memory: f } = this;
    // Element by element: no view object per day.
    for (const [into, at] of this.series(record)) for (let i = 0, from = at + d * np, to = d * n; i < n; i++) into[to + i] = f[from + i];
  }

  /** Every day's record into `record`. */
  copyAll(record: KernelRecord): void {
    const { n, np, horizon, memory: f } = this;
    const rows = (horizon + 1) * n;
    for (const [into, at] of this.series(record)) {
      if (np === n) into.set(f.subarray(at, at + rows));
      else for (let d = 0; d <= horizon; d++) into.set(f.subarray(at + d * np, at + d * np + n), d * n);
    }
  }

  /** The state at the end of the last `integrate` into y (layout L). */
  copyState(y: Float64Array): void {
    const { k, n, np, memory: f } = this;
    const at = k.offsetOfState() / 8;
    for (let b = 0; b < this.blocks; b++) y.set(f.subarray(at + b * np, at + b * np + n), b * n);
  }
}
