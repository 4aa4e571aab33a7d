/**
 * Model quantities written out in tests from the published formulas, without the engine's code,
 * so that engine results can be compared with something the engine did not compute.
 */
import { eigs } from 'mathjs';
import type { Phase, Scenario } from '../../src/engine/scenario.ts';

/**
 * Contacts per day under the phases in force (DESIGN.md section 2): for one phase
 * C_ij = sum_s m_s min(f_si, f_sj) C^s_ij, m_s the setting's multiplier (1 when not named), f_si the
 * product of the phase's age factors for band i in setting s (1 when none). Phases in force
 * together multiply: each contributes its own m_s min(f_si, f_sj). `null` or `[]` is no measures.
 */
export function contactsUnder(s: Scenario, phases: Phase | null | readonly Phase[]): number[][] {
  const inForce: readonly Phase[] = phases === null ? [] : 'fromDay' in phases ? [phases] : phases;
  const n = s.ageBands.length;
  const factor = (phase: Phase, setting: string, band: number) =>
    phase.ageFactors.filter((a) => a.setting === setting && a.bands.includes(band)).reduce((f, a) => f * a.factor, 1);
  return Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => s.settings.reduce((acc, st) => {
    const w = inForce.reduce((prod, ph) => prod * (ph.settingMultipliers[st.name] ?? 1) * Math.min(factor(ph, st.name, i), factor(ph, st.name, j)), 1);
    return acc + w * st.contactsPerDay[i][j];
  }, 0)));
}

/**
 * Next-generation matrix K_ij = beta D u_i C_ij h_j (1 - c) S_i / N_j (Diekmann, Heesterbeek &
 * Roberts 2010, J R Soc Interface 7:873) at susceptibles S, under `phase`.
 */
export function nextGenerationMatrixByHand(s: Scenario, beta: number, susceptible: readonly number[], phase: Phase | null): number[][] {
  const N = s.populationPersons;
  const u = s.disease.relativeSusceptibility ?? N.map(() => 1);
  const h = s.disease.relativeInfectiousness ?? N.map(() => 1);
  const keep = 1 - (phase?.caseIsolation ?? 0);
  const C = contactsUnder(s, phase);
  return C.map((row, i) => row.map((c, j) => (beta * s.disease.infectiousPeriodDays * u[i] * c * h[j] * keep * susceptible[i]) / N[j]));
}

/** Largest real part among mathjs's eigenvalues (which may be complex numbers). */
export function dominantByMathjs(rows: number[][], precision?: number): number {
  const { values } = eigs(rows, { eigenvectors: false, precision }) as unknown as { values: unknown };
  const list = (Array.isArray(values) ? values : (values as { toArray(): unknown[] }).toArray()) as (number | { re: number })[];
  return Math.max(...list.map((v) => (typeof v === 'number' ? v : v.re)));
}

/**
 * Root of z = 1 - exp(-R0 z) in (0, 1) by bisection: the one-group final size (Kermack &
 * McKendrick 1927, Proc R Soc Lond A 115:700), solved independently of the engine.
 */
export function oneGroupFinalSize(r0: number): number {
  let lo = 1e-9;
  let hi = 1;
  for (let k = 0; k < 200; k++) {
    const mid = (lo + hi) / 2;
    if (mid - (1 - Math.exp(-r0 * mid)) < 0) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}
