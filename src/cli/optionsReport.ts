/**
 * `mixwise run --format json`: the engine's `ScenarioResults` reduced to the numbers of the
 * catalogue of outcomes (src/report/outcomes.ts). Each option carries its name, every outcome
 * under its key (null where it does not apply, e.g. hospital outcomes without a `healthcare`
 * section) and every by-band outcome as an array, one value per age band. Numbers are the
 * engine's, at full precision. Nothing here computes a model quantity.
 *
 * Units: rates per day, times in days, prevalence, attack rates and shares as fractions 0-1,
 * counts in persons (beds, doses).
 */
import type { OptionSummary, ScenarioSummary } from '../engine/index.ts';
import { BAND_OUTCOMES, OUTCOMES, outcomeDatum } from '../report/outcomes.ts';
import { CAUTION } from '../report/index.ts';
import { reciprocityRows, type ReciprocityRow } from './reciprocityNotes.ts';

/**
 * One option: `name`, one member per outcome key (number or null) and per by-band key (array),
 * and the structured details of its measures: `triggers` (what each triggered phase did, with the
 * stretches it was in force), `rByPhase` and `measureBurden` (see the engine's `OptionResults`).
 */
export type OptionRow = { name: string } & Record<string, string | number | null | number[] | MeasureDetails[keyof MeasureDetails]>;

type MeasureDetails = Pick<OptionSummary, 'triggers' | 'rByPhase' | 'measureBurden'>;

export interface OptionsReport {
  title: string;
  /** The scenario's day 0 (ISO 8601), null without one. */
  startDate: string | null;
  ageBands: string[];
  r0: number;
  horizonDays: number;
  referenceOption: string;
  options: OptionRow[];
  reciprocity: ReciprocityRow[];
  caution: string;
}

export function optionsReport(results: ScenarioSummary): OptionsReport {
  return {
    title: results.title,
    startDate: results.startDate,
    ageBands: results.ageBands,
    r0: results.r0,
    horizonDays: results.horizonDays,
    referenceOption: results.options[results.referenceIndex]?.name ?? '',
    options: results.options.map((o) => {
      const row: OptionRow = { name: o.name };
      for (const e of OUTCOMES) row[e.key] = outcomeDatum(e, o, results);
      for (const b of BAND_OUTCOMES) row[b.key] = b.read(o, results);
      row.triggers = o.triggers;
      row.rByPhase = o.rByPhase;
      row.measureBurden = o.measureBurden;
      return row;
    }),
    reciprocity: reciprocityRows(results.reciprocity, results.ageBands),
    caution: CAUTION,
  };
}
