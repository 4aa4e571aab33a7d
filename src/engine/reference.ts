/**
 * The reference option of a scenario and each option's comparison with it. Apart from run.ts so
 * that a single draw (uncertainty/drawOutcomes.ts), which a pool job runs, does not import the
 * pool's orchestration.
 */
import type { Comparison, OptionSummary } from './results.ts';
import type { Scenario } from './scenario.ts';

/** Index of the reference option: the one named by `referenceOption`, else the first. */
export function referenceIndexOf(s: Scenario): number {
  const k = s.referenceOption === undefined ? 0 : s.options.findIndex((o) => o.name === s.referenceOption);
  return Math.max(0, k);
}

/** Averted = reference minus option; per 1,000 of the option's doses when it gives any. */
export function compareWithReference(option: OptionSummary, reference: OptionSummary): Comparison {
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
