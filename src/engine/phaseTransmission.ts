/**
 * What depends only on a prepared scenario and the measures of one phase (or none), computed once
 * per prepared scenario and shared by every run of every option that has that phase: the
 * transmission matrix M of the phase (transmission.ts: M_ij = beta u_i C_ij h_j (1 - c) / N_j,
 * per day) and R under the phase's measures alone, rho(D diag(N) M) (rByPhase.ts). And, per
 * matrix, R at the day-0 susceptibles and the final size (simulate.ts): numbers that depend on
 * nothing but that matrix and the scenario.
 *
 * Kept per preparation, keyed by its band parameters (one object per `prepareScenario` call, which
 * copies of a prepared scenario with other campaigns share: vaccination/orderEvaluation.ts), and
 * then by the phase objects of the validated scenario, which nothing changes once prepared. The
 * matrices handed out are shared and read-only.
 */
import { finalSizeByBand } from './finalSize.ts';
import { spectralRadius } from './ngm.ts';
import type { PreparedScenario } from './prepare.ts';
import { reproductionNumber } from './reproductionNumber.ts';
import type { Phase } from './scenario.ts';
import { type BandParameters, transmissionMatrixInto } from './transmission.ts';

interface PhaseEntry {
  transmission: Float64Array;
  /** rho(D diag(N) M), or null until asked for. */
  rMeasuresOnly: number | null;
}

interface MatrixEntry {
  rStart: number | null;
  finalSize: Float64Array | null;
}

const phasesOf = new WeakMap<BandParameters, Map<Phase | null, PhaseEntry>>();
const matricesOf = new WeakMap<BandParameters, WeakMap<Float64Array, MatrixEntry>>();

function entry(p: PreparedScenario, phase: Phase | null): PhaseEntry {
  let byPhase = phasesOf.get(p.bands);
  if (byPhase === undefined) {
    byPhase = new Map();
    phasesOf.set(p.bands, byPhase);
  }
  let e = byPhase.get(phase);
  if (e === undefined) {
    const n = p.bands.bands;
    e = { transmission: transmissionMatrixInto(new Float64Array(n * n), p.scenario, p.bands, p.beta, phase), rMeasuresOnly: null };
    byPhase.set(phase, e);
  }
  return e;
}

function matrixEntry(p: PreparedScenario, m: Float64Array): MatrixEntry {
  let byMatrix = matricesOf.get(p.bands);
  if (byMatrix === undefined) {
    byMatrix = new WeakMap();
    matricesOf.set(p.bands, byMatrix);
  }
  let e = byMatrix.get(m);
  if (e === undefined) {
    e = { rStart: null, finalSize: null };
    byMatrix.set(m, e);
  }
  return e;
}

/** M under `phase` (null: no measures), per day; shared, do not write to it. */
export function phaseTransmission(p: PreparedScenario, phase: Phase | null): Float64Array {
  return entry(p, phase).transmission;
}

/**
 * rho(D diag(N) m) for an n x n transmission matrix m, certified to 1e-10 relative (ngm.ts): R
 * under m's measures with everyone susceptible. Throws PerronRootNotSettled when it cannot be
 * pinned down (validation.ts refuses such a phase with this same computation).
 */
export function measuresOnlyRadius(m: Float64Array, n: number, infectiousPeriodDays: number, population: ArrayLike<number>): number {
  const scale = new Float64Array(n);
  for (let i = 0; i < n; i++) scale[i] = infectiousPeriodDays * population[i];
  return spectralRadius(m, n, new Float64Array(n).fill(1 / n), new Float64Array(n), 1e-10, scale);
}

/** R under `phase`'s measures with everyone susceptible (`measuresOnlyRadius`), once per prepared scenario. */
export function rMeasuresOnly(p: PreparedScenario, phase: Phase): number {
  const e = entry(p, phase);
  if (e.rMeasuresOnly === null) e.rMeasuresOnly = measuresOnlyRadius(e.transmission, p.bands.bands, p.periods.infectiousPeriodDays, p.bands.population);
  return e.rMeasuresOnly;
}

/** R at the day-0 susceptibles under transmission matrix `m` (reproductionNumber.ts), once per matrix. */
export function rAtDayZero(p: PreparedScenario, m: Float64Array): number {
  const e = matrixEntry(p, m);
  if (e.rStart === null) e.rStart = reproductionNumber(m, p.initialSusceptible, p.periods.infectiousPeriodDays);
  return e.rStart;
}

/**
 * Final attack rate by band under `m` held for ever (finalSize.ts), from the day-0 susceptible
 * fractions `s0`, once per matrix (s0 depends only on the scenario). Shared: do not write to it.
 */
export function finalSizeUnder(p: PreparedScenario, m: Float64Array, s0: ArrayLike<number>): Float64Array {
  const e = matrixEntry(p, m);
  if (e.finalSize === null) e.finalSize = finalSizeByBand(m, p.bands.population, s0, p.periods.infectiousPeriodDays);
  return e.finalSize;
}
