/**
 * Entry point: a validated scenario in, every option's results out. Deterministic: the same
 * scenario gives the same numbers, bit for bit.
 */
import { reciprocityCheck } from './contacts.ts';
import { prepareScenario } from './prepare.ts';
import type { ReciprocityCheck, ScenarioResults } from './results.ts';
import type { Scenario } from './scenario.ts';
import { simulateOption } from './simulate.ts';

/** Index of the reference option: the one named by `referenceOption`, else the first. */
export function referenceIndexOf(s: Scenario): number {
  const k = s.referenceOption === undefined ? 0 : s.options.findIndex((o) => o.name === s.referenceOption);
  return Math.max(0, k);
}

/** Reciprocity of each setting's matrix against the population. */
export function reciprocityBySetting(s: Scenario): ReciprocityCheck[] {
  return s.settings.map((setting) => ({ setting: setting.name, ...reciprocityCheck(setting.contactsPerDay, s.populationPersons) }));
}

/** Runs the options at `optionIndices` (all by default). */
export function runOptions(s: Scenario, optionIndices: readonly number[] = s.options.map((_, k) => k)): ScenarioResults {
  const prepared = prepareScenario(s);
  return {
    title: s.title,
    ageBands: s.ageBands.map((b) => b.label),
    r0: prepared.r0,
    beta: prepared.beta,
    referenceIndex: referenceIndexOf(s),
    options: optionIndices.map((k) => simulateOption(prepared, s.options[k])),
    reciprocity: reciprocityBySetting(s),
  };
}

/** Runs every option of a validated scenario. */
export function runScenario(s: Scenario): ScenarioResults {
  return runOptions(s);
}
