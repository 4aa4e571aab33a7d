/**
 * The cost side of measures: how many of the usual contacts they remove, by setting.
 *
 * Usual contacts per person per day in setting s (population mean):
 *   c_s = sum_i N_i sum_j C^s_ij / sum_i N_i.
 * Under the measures in force on day d (contacts.ts, several phases combine):
 *   c_s(d) = sum_i N_i sum_j w_s(d, i, j) C^s_ij / sum_i N_i,
 * with w_s the phase multipliers times the age-factor rule. Contact-days removed per person over
 * the horizon: sum_{d=0}^{H-1} (c_s - c_s(d)); negative where measures raise contacts (e.g. more
 * contacts at home). Divided by c_s this is the same count in "full-closure days": 38 means the
 * setting lost as many contacts as 38 days of complete closure.
 */
import { effectiveContactsOfPhasesInto } from './contacts.ts';
import type { MeasureBurden, TriggerOutcome } from './results.ts';
import type { Phase, PolicyOption, Scenario } from './scenario.ts';

/** Population-mean contacts per person per day in each setting under `phases` (none = usual). */
function contactsPerPersonBySetting(s: Scenario, phases: readonly Phase[]): number[] {
  const n = s.ageBands.length;
  const N = s.populationPersons;
  let total = 0;
  for (const x of N) total += x;
  const matrix = new Float64Array(n * n);
  return s.settings.map((setting) => {
    effectiveContactsOfPhasesInto(matrix, [setting], n, phases);
    let acc = 0;
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) acc += N[i] * matrix[i * n + j];
    return acc / total;
  });
}

/** The phases in force on each day 0..H-1: fixed phases by their days, triggered ones by their periods. */
export function phasesInForceByDay(option: PolicyOption, triggers: readonly TriggerOutcome[], horizonDays: number): Phase[][] {
  const byDay: Phase[][] = Array.from({ length: horizonDays }, () => []);
  const add = (phase: Phase, from: number, to: number) => {
    for (let d = Math.max(0, from); d < Math.min(horizonDays, to); d++) byDay[d].push(phase);
  };
  for (const phase of option.phases) if (phase.trigger === undefined) add(phase, phase.fromDay, phase.toDay);
  for (const t of triggers) for (const p of t.periods) add(option.phases[t.phase], p.fromDay, p.toDay);
  return byDay;
}

export function measureBurden(s: Scenario, option: PolicyOption, triggers: readonly TriggerOutcome[]): MeasureBurden {
  const H = s.horizonDays;
  const usual = contactsPerPersonBySetting(s, []);
  const removed = usual.map(() => 0);
  const cache = new Map<string, number[]>();
  let daysUnderMeasures = 0;
  for (const phases of phasesInForceByDay(option, triggers, H)) {
    if (phases.length === 0) continue;
    daysUnderMeasures++;
    const key = phases.map((p) => option.phases.indexOf(p)).join(',');
    let under = cache.get(key);
    if (under === undefined) {
      under = contactsPerPersonBySetting(s, phases);
      cache.set(key, under);
    }
    for (let k = 0; k < usual.length; k++) removed[k] += usual[k] - under[k];
  }
  const bySetting = <T>(f: (k: number) => T): Record<string, T> => Object.fromEntries(s.settings.map((setting, k) => [setting.name, f(k)]));
  return {
    daysUnderMeasures,
    contactDaysRemovedPerPerson: bySetting((k) => removed[k]),
    fullClosureDays: bySetting((k) => (usual[k] > 0 ? removed[k] / usual[k] : 0)),
  };
}
