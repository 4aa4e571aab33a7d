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
 * 2010, J R Soc Interface 7:873), by the certified power iteration of ngm.ts. A root it cannot pin
 * down ends the run in a RunRefused naming the phase (runRefusal.ts); `validateScenario` refuses
 * the rMeasuresOnly ones beforehand, with the same computation (`measuresOnlyProblems`).
 */
import { spectralRadius } from './ngm.ts';
import type { PreparedScenario } from './prepare.ts';
import type { Problem } from './problems.ts';
import type { PhaseReproduction, TriggerOutcome } from './results.ts';
import { optionPath, rootOrRefusal, RunRefused } from './runRefusal.ts';
import type { PolicyOption, Scenario } from './scenario.ts';
import { measuresOnlyRadius, phaseTransmission, rMeasuresOnly } from './phaseTransmission.ts';
import { type BandParameters, transmissionMatrixInto } from './transmission.ts';

/** When rMeasuresOnly is computed, in a refusal's words. */
const MEASURES_ONLY = 'with everyone susceptible';

/**
 * The phases whose R under their measures alone, at full susceptibility (rMeasuresOnly, the very
 * computation of a run), cannot be pinned down: one problem each at `options[o].phases[k]`, what
 * `validateScenario` reports before any run (beta: the calibrated transmission rate).
 */
export function measuresOnlyProblems(s: Scenario, bands: BandParameters, beta: number): Problem[] {
  const n = bands.bands;
  const m = new Float64Array(n * n);
  const problems: Problem[] = [];
  s.options.forEach((option, o) =>
    option.phases.forEach((phase, k) => {
      transmissionMatrixInto(m, s, bands, beta, phase);
      try {
        rootOrRefusal(() => measuresOnlyRadius(m, n, s.disease.infectiousPeriodDays, bands.population), `options[${o}].phases[${k}]`, option.name, MEASURES_ONLY);
      } catch (err) {
        if (!(err instanceof RunRefused)) throw err;
        problems.push(err.problem);
      }
    }),
  );
  return problems;
}

export function reproductionByPhase(p: PreparedScenario, option: PolicyOption, effectiveSusceptible: Float64Array, triggers: readonly TriggerOutcome[]): PhaseReproduction[] {
  const n = p.bands.bands;
  const H = p.scenario.horizonDays;
  const D = p.periods.infectiousPeriodDays;
  const scale = new Float64Array(n);
  const vector = new Float64Array(n);
  const scratch = new Float64Array(n);
  const at = optionPath(p.scenario.options, option.name);
  return option.phases.map((phase, k) => {
    const m = phaseTransmission(p, phase);
    const start = Math.min(H, phase.trigger === undefined ? phase.fromDay : (triggers.find((t) => t.phase === k)?.firstOnDay ?? phase.fromDay));
    for (let i = 0; i < n; i++) scale[i] = D * effectiveSusceptible[start * n + i];
    vector.fill(1 / n);
    const path = `${at}.phases[${k}]`;
    return {
      fromDay: phase.fromDay,
      toDay: phase.toDay,
      startDay: start,
      rAtPhaseStart: rootOrRefusal(() => spectralRadius(m, n, vector, scratch, 1e-10, scale), path, option.name, `on day ${start}, when the phase starts,`),
      rMeasuresOnly: rootOrRefusal(() => rMeasuresOnly(p, phase), path, option.name, MEASURES_ONLY),
    };
  });
}
