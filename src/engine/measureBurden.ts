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
 *
 * Cost: c_s once per scenario; c_s(d) once per scenario, option and set of phases in force, over
 * stretches of days with the same set (not day by day); and an option without triggers (whose
 * burden depends on the scenario and the option alone) once per scenario and option. Scenarios and options are the
 * validated values, which nothing changes once validated.
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

/** Usual contacts per person by setting, once per scenario (every option's burden starts from them). */
const usualBySetting = new WeakMap<Scenario, number[]>();

function usualContactsPerPerson(s: Scenario): number[] {
  let usual = usualBySetting.get(s);
  if (usual === undefined) {
    usual = contactsPerPersonBySetting(s, []);
    usualBySetting.set(s, usual);
  }
  return usual;
}

/** Days [fromDay, toDay) with one set of phases in force (in the order `phasesInForce` lists them). */
interface Stretch {
  fromDay: number;
  toDay: number;
  phases: Phase[];
}

/**
 * The horizon 0..H-1 cut into stretches with the same phases in force: fixed phases by their days,
 * triggered ones by their periods. On each day the phases come in the option's order for fixed
 * phases, then the triggered ones in the order of `triggers` and of their periods.
 */
function phasesInForce(option: PolicyOption, triggers: readonly TriggerOutcome[], horizonDays: number): Stretch[] {
  const spans: { phase: Phase; from: number; to: number }[] = [];
  const add = (phase: Phase, from: number, to: number) => {
    const a = Math.max(0, from);
    const b = Math.min(horizonDays, to);
    if (a < b) spans.push({ phase, from: a, to: b });
  };
  for (const phase of option.phases) if (phase.trigger === undefined) add(phase, phase.fromDay, phase.toDay);
  for (const t of triggers) for (const p of t.periods) add(option.phases[t.phase], p.fromDay, p.toDay);
  // Days where a span starts or ends (whole days: scenario.ts `wholeDay`, trigger periods by day).
  const cuts = new Set<number>([0, horizonDays]);
  for (const span of spans) {
    cuts.add(span.from);
    cuts.add(span.to);
  }
  const sorted = [...cuts].sort((a, b) => a - b);
  const stretches: Stretch[] = [];
  for (let k = 0; k + 1 < sorted.length; k++) {
    const day = sorted[k];
    stretches.push({ fromDay: day, toDay: sorted[k + 1], phases: spans.filter((span) => span.from <= day && day < span.to).map((span) => span.phase) });
  }
  return stretches;
}

/** Days under measures and contact-days removed per person by setting (in the scenario's setting order). */
interface Removed {
  daysUnderMeasures: number;
  removed: number[];
}

/**
 * Contacts per person under each set of phases in force, per scenario and option, keyed by the
 * phases' indices: a triggered option's few sets are summed once, not on every run.
 */
const underBySet = new WeakMap<Scenario, WeakMap<PolicyOption, Map<string, number[]>>>();

function contactsUnderCache(s: Scenario, option: PolicyOption): Map<string, number[]> {
  let byOption = underBySet.get(s);
  if (byOption === undefined) {
    byOption = new WeakMap();
    underBySet.set(s, byOption);
  }
  let cache = byOption.get(option);
  if (cache === undefined) {
    cache = new Map();
    byOption.set(option, cache);
  }
  return cache;
}

function removedContacts(s: Scenario, option: PolicyOption, triggers: readonly TriggerOutcome[]): Removed {
  const usual = usualContactsPerPerson(s);
  const removed = usual.map(() => 0);
  const cache = contactsUnderCache(s, option);
  let daysUnderMeasures = 0;
  for (const { fromDay, toDay, phases } of phasesInForce(option, triggers, s.horizonDays)) {
    if (phases.length === 0) continue;
    daysUnderMeasures += toDay - fromDay;
    const key = phases.map((p) => option.phases.indexOf(p)).join(',');
    let under = cache.get(key);
    if (under === undefined) {
      under = contactsPerPersonBySetting(s, phases);
      cache.set(key, under);
    }
    // Day by day, as a sum over days: the same additions in the same order.
    for (let d = fromDay; d < toDay; d++) for (let k = 0; k < usual.length; k++) removed[k] += usual[k] - under[k];
  }
  return { daysUnderMeasures, removed };
}

/** What an option without triggered periods removes: a function of the scenario and the option alone, so kept per option. */
const fixedOptions = new WeakMap<Scenario, WeakMap<PolicyOption, Removed>>();

function removedByFixedPhases(s: Scenario, option: PolicyOption): Removed {
  let byOption = fixedOptions.get(s);
  if (byOption === undefined) {
    byOption = new WeakMap();
    fixedOptions.set(s, byOption);
  }
  let r = byOption.get(option);
  if (r === undefined) {
    r = removedContacts(s, option, []);
    byOption.set(option, r);
  }
  return r;
}

export function measureBurden(s: Scenario, option: PolicyOption, triggers: readonly TriggerOutcome[]): MeasureBurden {
  const usual = usualContactsPerPerson(s);
  const { daysUnderMeasures, removed } = triggers.length === 0 ? removedByFixedPhases(s, option) : removedContacts(s, option, triggers);
  const bySetting = <T>(f: (k: number) => T): Record<string, T> => Object.fromEntries(s.settings.map((setting, k) => [setting.name, f(k)]));
  return {
    daysUnderMeasures,
    contactDaysRemovedPerPerson: bySetting((k) => removed[k]),
    fullClosureDays: bySetting((k) => (usual[k] > 0 ? removed[k] / usual[k] : 0)),
  };
}
