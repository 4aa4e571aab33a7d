/**
 * Entry point: a validated scenario in, every option's results out. Deterministic: the same
 * scenario gives the same numbers, bit for bit.
 */
import { reciprocityCheck } from './contacts.ts';
import type { Calibration } from './calibration.ts';
import { prepareScenario } from './prepare.ts';
import type { Comparison, OptionResults, ReciprocityCheck, ScenarioResults } from './results.ts';
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

/** Averted = reference minus option; per 1,000 of the option's doses when it gives any. */
export function compareWithReference(option: OptionResults, reference: OptionResults): Comparison {
  const doses = option.vaccination?.doses ?? 0;
  const per1000 = (averted: number | null) => (doses > 0 && averted !== null ? (1000 * averted) / doses : null);
  const infectionsAverted = reference.infections - option.infections;
  const deathsAverted = reference.deaths - option.deaths;
  const admissionsAverted = option.healthcare !== null && reference.healthcare !== null ? reference.healthcare.admissions - option.healthcare.admissions : null;
  return {
    reference: reference.name,
    infectionsAverted,
    deathsAverted,
    admissionsAverted,
    infectionsAvertedPer1000Doses: per1000(infectionsAverted),
    deathsAvertedPer1000Doses: per1000(deathsAverted),
    admissionsAvertedPer1000Doses: per1000(admissionsAverted),
  };
}

/**
 * Runs the options at `optionIndices` (all by default). Comparisons with the reference option are
 * filled when the reference is among them. `calibration`: the one `validateScenario` returned.
 */
export function runOptions(s: Scenario, optionIndices: readonly number[] = s.options.map((_, k) => k), calibration?: Calibration): ScenarioResults {
  const prepared = prepareScenario(s, calibration);
  const referenceIndex = referenceIndexOf(s);
  const options = optionIndices.map((k) => simulateOption(prepared, s.options[k]));
  const reference = options[optionIndices.indexOf(referenceIndex)];
  if (reference !== undefined) for (const o of options) o.comparison = compareWithReference(o, reference);
  return {
    title: s.title,
    ageBands: s.ageBands.map((b) => b.label),
    r0: prepared.r0,
    beta: prepared.beta,
    referenceIndex,
    options,
    reciprocity: reciprocityBySetting(s),
  };
}

/** Runs every option of a validated scenario (`calibration`: the one `validateScenario` returned). */
export function runScenario(s: Scenario, calibration?: Calibration): ScenarioResults {
  return runOptions(s, undefined, calibration);
}
