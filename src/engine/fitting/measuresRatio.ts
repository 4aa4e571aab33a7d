/**
 * How much a phase's measures lower R: the measures ratio
 *
 *   ρ = λ(K with the phase's measures) / λ(K without measures),
 *
 * both next-generation matrices K = D diag(S) M (ngm.ts) taken at the scenario's initial
 * susceptibles S (day 0) and the same transmission rate, so beta cancels and is set to 1.
 * λ is the dominant eigenvalue (Diekmann, Heesterbeek & Roberts 2010, J R Soc Interface 7:873).
 * A growth rate fitted while the measures were in force gives R under measures; dividing by ρ
 * gives R0 (r0FromFit). Which phase: the one an option has in force on the window's first day,
 * on the fit's days, which are the scenario's when the counts are placed on them (scenarioDays.ts).
 */
import { initialSusceptibleOf } from '../initialState.ts';
import { PerronRootNotSettled } from '../perronRoot.ts';
import { phaseAt } from '../phases.ts';
import { reproductionAtUnitTransmission } from '../reproductionNumber.ts';
import { UNSETTLED_ROOT_HINT } from '../runRefusal.ts';
import type { Phase, Scenario } from '../scenario.ts';
import { bandParameters } from '../transmission.ts';

export interface MeasuresRatio {
  /** ρ (dimensionless); 1 when the option has no phase in force on `day`. */
  ratio: number;
  /** Name of the option whose measures were in force. */
  option: string;
  /** Day looked up (the window's first day). */
  day: number;
  /** The phase in force on `day`, or null. */
  phase: { fromDay: number; toDay: number } | null;
  /** One plain sentence for notes and the report. */
  note: string;
}

export type MeasuresRatioResult = { ok: true; value: MeasuresRatio } | { ok: false; problems: { field: string; rule: string; value?: string }[] };

/** ρ for an explicit phase (null gives 1); 0 / 0 (no transmission at all) gives NaN. Throws PerronRootNotSettled when either R cannot be pinned down. */
export function measuresRatioOfPhase(scenario: Scenario, phase: Phase | null): number {
  if (phase === null) return 1;
  const bands = bandParameters(scenario);
  const susceptible = initialSusceptibleOf(scenario);
  return reproductionAtUnitTransmission(scenario, bands, phase, susceptible) / reproductionAtUnitTransmission(scenario, bands, null, susceptible);
}

/** ρ for the phase option `optionName` has in force on `day` (the fitting window's first day). */
export function measuresRatioForOption(scenario: Scenario, optionName: string, day: number): MeasuresRatioResult {
  const option = scenario.options.find((o) => o.name === optionName);
  if (option === undefined) {
    return { ok: false, problems: [{ field: 'measuresOption', rule: `must name a policy option of the scenario (${scenario.options.map((o) => JSON.stringify(o.name)).join(', ')})`, value: optionName }] };
  }
  const phase = phaseAt(option, day);
  if (phase === null) {
    return { ok: true, value: { ratio: 1, option: option.name, day, phase: null, note: `Option "${option.name}" has no measures in force on day ${day}: nothing divided out (ratio 1).` } };
  }
  let ratio: number;
  try {
    ratio = measuresRatioOfPhase(scenario, phase);
  } catch (err) {
    if (!(err instanceof PerronRootNotSettled)) throw err;
    return { ok: false, problems: [{ field: 'measuresOption', rule: `its measures on day ${day} leave R uncomputable at the initial susceptibles: ${err.message}; ${UNSETTLED_ROOT_HINT}`, value: optionName }] };
  }
  if (!(Number.isFinite(ratio) && ratio > 0)) {
    return { ok: false, problems: [{ field: 'measuresOption', rule: `its measures on day ${day} stop all transmission (ratio ${ratio}), so R0 cannot be back-calculated`, value: optionName }] };
  }
  return {
    ok: true,
    value: {
      ratio,
      option: option.name,
      day,
      phase: { fromDay: phase.fromDay, toDay: phase.toDay },
      note: `Measures of option "${option.name}" (days ${phase.fromDay} to ${phase.toDay - 1}) were in force on day ${day}; they scale the dominant next-generation-matrix eigenvalue by ${ratio.toPrecision(4)}, so R0 = R in the window / ${ratio.toPrecision(4)}.`,
    },
  };
}
