/**
 * Contact matrices: combining settings under measures, and reciprocity.
 *
 * C^s_ij = mean daily contacts one person in band i has with people in band j in setting s.
 * Under a phase, setting s is scaled by its multiplier m_s, and by age factors f_{s,i}:
 *
 *   C_ij = sum_s m_s * min(f_{s,i}, f_{s,j}) * C^s_ij.
 *
 * Rule for a contact between a scaled and an unscaled band: a contact needs both people, so it
 * happens only as often as the more restricted of the two allows (the smaller factor). The rule is
 * symmetric in i and j, so a reciprocal matrix (N_i C_ij = N_j C_ji) stays reciprocal. Factors
 * above 1 raise only contacts among bands that are all raised. Several factors for one band and
 * setting multiply.
 */
import type { Phase, Scenario, Setting } from './scenario.ts';

/** Per-setting, per-band factors f_{s,i} of a phase (1 where none is given). */
export function ageFactorsBySetting(settings: readonly Setting[], bands: number, phase: Phase | null): Float64Array[] {
  const factors = settings.map(() => new Float64Array(bands).fill(1));
  if (phase === null) return factors;
  for (const af of phase.ageFactors) {
    const s = settings.findIndex((x) => x.name === af.setting);
    if (s < 0) continue;
    for (const b of af.bands) if (b < bands) factors[s][b] *= af.factor;
  }
  return factors;
}

/** Multiplier m_s of each setting under a phase (1 where not named; all 1 without a phase). */
export function settingMultipliers(settings: readonly Setting[], phase: Phase | null): Float64Array {
  // Own keys only: a setting named like an object built-in (constructor, toString) is not a multiplier.
  return Float64Array.from(settings, (s) => (phase !== null && Object.hasOwn(phase.settingMultipliers, s.name) ? phase.settingMultipliers[s.name] : 1));
}

/**
 * Writes the combined contact matrix (contacts per day, row-major n x n) under `phase` into `out`.
 */
export function effectiveContactsInto(out: Float64Array, settings: readonly Setting[], bands: number, phase: Phase | null): Float64Array {
  return effectiveContactsOfPhasesInto(out, settings, bands, phase === null ? [] : [phase]);
}

/**
 * The combined contact matrix when several phases are in force at once (a triggered phase over a
 * fixed one): each phase scales what the others leave, so multipliers multiply and so do the
 * phases' pair factors,
 *
 *   C_ij = sum_s (prod_p m_{p,s}) * (prod_p min(f_{p,s,i}, f_{p,s,j})) * C^s_ij,
 *
 * which is symmetric in i and j like the one-phase rule, so reciprocity is kept. With one phase it
 * is exactly the one-phase rule above; with none, the usual contacts.
 */
export function effectiveContactsOfPhasesInto(out: Float64Array, settings: readonly Setting[], bands: number, phases: readonly Phase[]): Float64Array {
  out.fill(0);
  const multipliers = new Float64Array(settings.length).fill(1);
  const factorsByPhase = phases.map((phase) => {
    const m = settingMultipliers(settings, phase);
    for (let s = 0; s < settings.length; s++) multipliers[s] *= m[s];
    return ageFactorsBySetting(settings, bands, phase);
  });
  settings.forEach((setting, s) => {
    const m = multipliers[s];
    if (m === 0) return;
    for (let i = 0; i < bands; i++) {
      const row = setting.contactsPerDay[i];
      for (let j = 0; j < bands; j++) {
        let pair = 1;
        for (const f of factorsByPhase) pair *= Math.min(f[s][i], f[s][j]);
        out[i * bands + j] += m * pair * row[j];
      }
    }
  });
  return out;
}

/** The combined contact matrix under `phase` (null = no measures) as rows, contacts per day. */
export function effectiveContactMatrix(scenario: Scenario, phase: Phase | null): number[][] {
  const n = scenario.ageBands.length;
  const flat = effectiveContactsInto(new Float64Array(n * n), scenario.settings, n, phase);
  return Array.from({ length: n }, (_, i) => Array.from(flat.subarray(i * n, (i + 1) * n)));
}

/**
 * Relative imbalance up to which a contact matrix counts as reciprocal (0.1%): far above rounding
 * noise, far below what survey-based matrices can resolve (common practice). The app offers a
 * correction and the CLI writes a note only above it.
 */
export const RECIPROCITY_TOLERANCE = 1e-3;

/**
 * Largest relative reciprocity imbalance of a contact matrix:
 * max over i<j of |N_i C_ij - N_j C_ji| / max(N_i C_ij, N_j C_ji) (0 = balanced, 1 = one-sided).
 */
export function reciprocityCheck(matrix: readonly (readonly number[])[], population: readonly number[]): { largestRelativeImbalance: number; at: [number, number] } {
  let worst = 0;
  let at: [number, number] = [0, 0];
  for (let i = 0; i < matrix.length; i++) {
    for (let j = i + 1; j < matrix.length; j++) {
      const a = population[i] * matrix[i][j];
      const b = population[j] * matrix[j][i];
      const big = Math.max(a, b);
      const rel = big > 0 ? Math.abs(a - b) / big : 0;
      if (rel > worst) {
        worst = rel;
        at = [i, j];
      }
    }
  }
  return { largestRelativeImbalance: worst, at };
}

/**
 * Reciprocity correction: C'_ij = (C_ij N_i + C_ji N_j) / (2 N_i), contacts per day.
 * Source: Wallinga, Teunis & Kretzschmar 2006, Am J Epidemiol 164:936 (from memory).
 * A band with no people keeps its row.
 */
export function correctReciprocity(matrix: readonly (readonly number[])[], population: readonly number[]): number[][] {
  return matrix.map((row, i) =>
    row.map((c, j) => (population[i] > 0 ? (c * population[i] + matrix[j][i] * population[j]) / (2 * population[i]) : c)),
  );
}
