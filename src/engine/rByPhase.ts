/**
 * R under each phase's measures, so that a phase starting on day 14 does not look like no
 * measures at all on the board (R at the start only sees day 0).
 *
 * For phase k with transmission matrix M_k (its own measures alone, contacts.ts):
 * - rAtPhaseStart = rho(D diag(S_eff(t_k)) M_k), with S_eff the risk-weighted susceptibles
 *   (vaccine protection included) on the day t_k the phase starts: fromDay for a fixed phase, the
 *   day its trigger first put it in force (fromDay when it never did) for a triggered one;
 * - rMeasuresOnly = rho(D diag(N) M_k): the phase's measures at full susceptibility, i.e.
 *   R0 times what the measures alone do.
 * M_k and rMeasuresOnly are computed once per prepared scenario (phaseTransmission.ts).
 * rho is the dominant eigenvalue of the next-generation matrix (Diekmann, Heesterbeek & Roberts
 * 2010, J R Soc Interface 7:873), by the certified power iteration of ngm.ts.
 */
import { spectralRadius } from './ngm.ts';
import type { PreparedScenario } from './prepare.ts';
import type { PhaseReproduction, TriggerOutcome } from './results.ts';
import type { PolicyOption } from './scenario.ts';
import { phaseTransmission, rMeasuresOnly } from './phaseTransmission.ts';

export function reproductionByPhase(p: PreparedScenario, option: PolicyOption, effectiveSusceptible: Float64Array, triggers: readonly TriggerOutcome[]): PhaseReproduction[] {
  const n = p.bands.bands;
  const H = p.scenario.horizonDays;
  const D = p.periods.infectiousPeriodDays;
  const scale = new Float64Array(n);
  const vector = new Float64Array(n);
  const scratch = new Float64Array(n);
  return option.phases.map((phase, k) => {
    const m = phaseTransmission(p, phase);
    const start = Math.min(H, phase.trigger === undefined ? phase.fromDay : (triggers.find((t) => t.phase === k)?.firstOnDay ?? phase.fromDay));
    for (let i = 0; i < n; i++) scale[i] = D * effectiveSusceptible[start * n + i];
    vector.fill(1 / n);
    return {
      fromDay: phase.fromDay,
      toDay: phase.toDay,
      startDay: start,
      rAtPhaseStart: spectralRadius(m, n, vector, scratch, 1e-10, scale),
      rMeasuresOnly: rMeasuresOnly(p, phase),
    };
  });
}
