/**
 * The policy options table as data: the engine's `ScenarioResults` reduced to the numbers
 * the command line prints. This is the `--format json` output; the table, Markdown and CSV
 * formats render the same object. Nothing here computes a model quantity.
 *
 * Units: rates per day, times in days, prevalence and attack rates as fractions 0-1,
 * infections and deaths in persons.
 */
import type { OptionResults, ScenarioResults } from '../engine/results.ts';
import { CAUTION } from './caution.ts';
import { reciprocityRows, type ReciprocityRow } from './reciprocity-notes.ts';

/** The engine's headline numbers kept as they are (units and meaning in `OptionResults`). */
type EngineFields =
  | 'name'
  | 'rStart'
  | 'growthRatePerDay'
  | 'doublingTimeDays'
  | 'halvingTimeDays'
  | 'peakDay'
  | 'peakPrevalence'
  | 'peakInfectedPersons'
  | 'infections'
  | 'infectionsByBand'
  | 'attackRate'
  | 'attackRateByBand'
  | 'deaths'
  | 'deathsByBand';

export interface OptionRow extends Pick<OptionResults, EngineFields> {
  /** Multi-group final-size attack rate, when the option's measures are constant; else null. */
  finalSizeAttackRate: number | null;
  /** Hospital demand (persons, days); null when the scenario has no `healthcare` section. */
  peakWardOccupancy: number | null;
  peakIcuOccupancy: number | null;
  peakIcuDay: number | null;
  daysIcuOverCapacity: number | null;
  /** Hospital admissions (ICU or not) within the horizon. */
  admissions: number | null;
  /** Vaccine doses given within the horizon by band (zeros without a campaign). */
  dosesByBand: number[];
  /** Against the reference option (reference minus this option); null when not compared. */
  infectionsAverted: number | null;
  deathsAverted: number | null;
  /** Deaths averted per 1,000 doses of this option's campaign; null without doses. */
  deathsAvertedPer1000Doses: number | null;
  /** Share of doses given to people already infected or immune, fraction; null without a campaign. */
  dosesToNonSusceptibleShare: number | null;
}

export interface OptionsReport {
  title: string;
  ageBands: string[];
  r0: number;
  horizonDays: number;
  referenceOption: string;
  options: OptionRow[];
  reciprocity: ReciprocityRow[];
  caution: string;
}

export function optionsReport(results: ScenarioResults): OptionsReport {
  return {
    title: results.title,
    ageBands: results.ageBands,
    r0: results.r0,
    horizonDays: results.options[0]?.series.days ?? 0,
    referenceOption: results.options[results.referenceIndex]?.name ?? '',
    options: results.options.map((o) => ({
      name: o.name,
      rStart: o.rStart,
      growthRatePerDay: o.growthRatePerDay,
      doublingTimeDays: o.doublingTimeDays,
      halvingTimeDays: o.halvingTimeDays,
      peakDay: o.peakDay,
      peakPrevalence: o.peakPrevalence,
      peakInfectedPersons: o.peakInfectedPersons,
      infections: o.infections,
      infectionsByBand: o.infectionsByBand,
      attackRate: o.attackRate,
      attackRateByBand: o.attackRateByBand,
      deaths: o.deaths,
      deathsByBand: o.deathsByBand,
      finalSizeAttackRate: o.finalSize?.attackRate ?? null,
      peakWardOccupancy: o.healthcare?.ward.peakOccupancy ?? null,
      peakIcuOccupancy: o.healthcare?.icu.peakOccupancy ?? null,
      peakIcuDay: o.healthcare?.icu.peakDay ?? null,
      daysIcuOverCapacity: o.healthcare?.icu.daysOverCapacity ?? null,
      admissions: o.healthcare?.admissions ?? null,
      dosesByBand: o.vaccination?.dosesByBand ?? results.ageBands.map(() => 0),
      infectionsAverted: o.comparison?.infectionsAverted ?? null,
      deathsAverted: o.comparison?.deathsAverted ?? null,
      deathsAvertedPer1000Doses: o.comparison?.deathsAvertedPer1000Doses ?? null,
      dosesToNonSusceptibleShare: o.vaccination?.dosesToNonSusceptibleShare ?? null,
    })),
    reciprocity: reciprocityRows(results.reciprocity, results.ageBands),
    caution: CAUTION,
  };
}
