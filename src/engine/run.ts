/**
 * The engine's orchestration: every option of a scenario, on this thread or over a worker pool,
 * assembled into one `ScenarioResults` with the reference option, every averted quantity and the
 * scenario's revision. Deterministic: the same scenario gives the same numbers, bit for bit, on
 * one thread or many.
 */
import { reciprocityCheck } from './contacts.ts';
import { calibrateTransmission, type Calibration } from './calibration.ts';
import { mapPrepared, type MapOptions, type WorkerPool } from './pool/pool.ts';
import { prepareScenario, type PreparedScenario } from './prepare.ts';
import { compareWithReference, referenceIndexOf } from './reference.ts';
import type { OptionSummary, ReciprocityCheck, ScenarioResults, ScenarioSummary } from './results.ts';
import { scenarioRevision } from './revision.ts';
import type { Scenario } from './scenario.ts';

// Kept importable from here: the reference option is part of a scenario's results.
export { compareWithReference, referenceIndexOf };

/** Reciprocity of each setting's matrix against the population. */
export function reciprocityBySetting(s: Scenario): ReciprocityCheck[] {
  return s.settings.map((setting) => ({ setting: setting.name, ...reciprocityCheck(setting.contactsPerDay, s.populationPersons) }));
}

/**
 * The results of a scenario from its options' results (one per option, in option order): the
 * reference index, each option's comparison with the reference, and the revision they belong to.
 */
export function assembleResults<O extends OptionSummary>(s: Scenario, prepared: Pick<PreparedScenario, 'r0' | 'beta'>, options: O[]): ScenarioResults<O> {
  if (options.length !== s.options.length) throw new Error(`expected results for ${s.options.length} options, got ${options.length}`);
  const referenceIndex = referenceIndexOf(s);
  for (const o of options) o.comparison = compareWithReference(o, options[referenceIndex]);
  return {
    title: s.title,
    revision: scenarioRevision(s),
    startDate: s.startDate ?? null,
    ageBands: s.ageBands.map((b) => b.label),
    horizonDays: s.horizonDays,
    r0: prepared.r0,
    beta: prepared.beta,
    referenceIndex,
    options,
    reciprocity: reciprocityBySetting(s),
  };
}

/** The option indices of a scenario, the task list of the `optionRuns` and `optionSummaries` jobs. */
function everyOption(s: Scenario): number[] {
  return s.options.map((_, k) => k);
}

/**
 * Runs every option of a validated scenario on this thread, one after another (`calibration`: the
 * one `validateScenario` returned); `options` reports progress after each option and can cancel
 * between options (pool/pool.ts, `mapPrepared`).
 */
export function runScenario(s: Scenario, calibration?: Calibration, options: MapOptions = {}): ScenarioResults {
  const prepared = prepareScenario(s, calibration);
  return assembleResults(s, prepared, mapPrepared('optionRuns', prepared, everyOption(s), options));
}

/** As `runScenario`, with the options spread over a worker pool; the same results, byte for byte. */
export async function runScenarioOnPool(pool: WorkerPool, s: Scenario, calibration?: Calibration, options: MapOptions = {}): Promise<ScenarioResults> {
  const runs = pool.map('optionRuns', s, everyOption(s), options);
  // R0 and beta for the results, on this thread while the workers run (the calibration alone, not a whole preparation).
  const c = calibration ?? calibrateTransmission(s);
  return assembleResults(s, c, await runs);
}

/**
 * As `runScenario` without the daily series (simulate.ts, `series: 'summary'`): every outcome of
 * the catalogue, bit for bit the full run's, for the options table and other outcome-only readers.
 */
export function runScenarioSummary(s: Scenario, calibration?: Calibration, options: MapOptions = {}): ScenarioSummary {
  const prepared = prepareScenario(s, calibration);
  return assembleResults(s, prepared, mapPrepared('optionSummaries', prepared, everyOption(s), options));
}

/** As `runScenarioSummary`, over a worker pool. */
export async function runScenarioSummaryOnPool(pool: WorkerPool, s: Scenario, calibration?: Calibration, options: MapOptions = {}): Promise<ScenarioSummary> {
  const runs = pool.map('optionSummaries', s, everyOption(s), options);
  const c = calibration ?? calibrateTransmission(s);
  return assembleResults(s, c, await runs);
}
