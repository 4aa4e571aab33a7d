/**
 * The outcome catalogue as the reader of uncertainty draws: every outcome of the catalogue is kept
 * for every draw and option, under its JSON key, so intervals cover every number of the options
 * table and are keyed as `mixwise run --format json` keys its outcomes.
 */
import type { OptionSummary, OutcomeReader, ScenarioSummary } from '../engine/index.ts';
import { OUTCOMES } from './outcomes.ts';

export const DRAW_OUTCOME_KEYS: readonly string[] = OUTCOMES.map((o) => o.key);

/** The results of one draw in the shape the catalogue reads (only options and reference are used). */
function drawResults(options: readonly OptionSummary[], referenceIndex: number): ScenarioSummary {
  return { title: '', ageBands: [], horizonDays: 0, r0: Number.NaN, beta: Number.NaN, referenceIndex, options: [...options], reciprocity: [], revision: '', startDate: null };
}

export const catalogueReader: OutcomeReader = {
  keys: DRAW_OUTCOME_KEYS,
  read(options, k, referenceIndex) {
    const results = drawResults(options, referenceIndex);
    return Float64Array.from(OUTCOMES, (entry) => entry.read(options[k], results) ?? Number.NaN);
  },
};
