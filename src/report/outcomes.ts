/**
 * The catalogue of outcomes: every number Mixwise reports per policy option, once. The options
 * board, the printed options table, every CSV, the CLI table, Markdown and JSON all render from
 * this list, so an outcome is added by one entry here plus its computation in the engine
 * (see DEVELOPERS.md, "Adding an outcome").
 *
 * An entry only reads and formats what the engine returned (`OptionSummary`: a full or a summary run); averted
 * quantities and the reference option come from the engine's `comparison` and `referenceIndex`.
 * Pure TypeScript: no DOM, no Node.
 */
import type { BedDemand, OptionSummary, ScenarioSummary } from '../engine/index.ts';
import { dateOfDay, formatRange, type Interval, screen, type NumberStyle, type ValueContext, type ValueFormat, formatValue, numberFormatter, type NumberFormatter } from './numberFormat.ts';

export type OutcomeGroup = 'spread' | 'hospital' | 'vaccination' | 'measures';

/** Group headings, in the order groups are shown. */
export const OUTCOME_GROUP_TITLES: Record<OutcomeGroup, string> = {
  spread: 'Spread and deaths',
  hospital: 'Hospital and ICU',
  vaccination: 'Vaccination',
  measures: 'Measures and what they cost',
};

/**
 * What an option needs for an outcome to apply to it:
 * - `healthcare`: the scenario has a `healthcare` section (hospital results)
 * - `campaign`: the option has a vaccination campaign
 * - `constantMeasures`: the option's measures never change (final-size check)
 * - `surgeCapacity`: the scenario gives an ICU surge capacity
 * - `measures`: the option has at least one phase
 * - `triggers`: the option has at least one phase switched by a trigger
 */
export type Requirement = 'healthcare' | 'campaign' | 'constantMeasures' | 'surgeCapacity' | 'measures' | 'triggers';

/**
 * Where an outcome is shown besides CSV and JSON, which carry every outcome:
 * `board` (the app's options board), `table` (the printed options table: the report's, and the
 * CLI's table and Markdown).
 */
export type Surface = 'board' | 'table';

export interface Outcome extends ValueFormat {
  /** The JSON key of `mixwise run --format json` (camelCase); also the board's and report's row key. */
  key: string;
  /** The CSV column (snake_case). */
  column: string;
  /** Short name for the board. */
  label: string;
  /** Name with its unit for printed tables, where cells carry no unit. */
  printLabel: string;
  /** One sentence on what the number is (the board's tooltip). */
  hint: string;
  group: OutcomeGroup;
  /** Which way is better when compared with the reference option; null = neither (not shaded). */
  lowerIsBetter: boolean | null;
  /** Every requirement must hold for the outcome to apply to an option. */
  requires: readonly Requirement[];
  /** A comparison with the reference option: shown as "reference" in the reference's own column. */
  comparison?: boolean;
  /** Shade this row by another outcome's change against the reference (e.g. deaths averted by deaths). */
  shadeBy?: string;
  shownOn: readonly Surface[];
  /** The number, read from the engine's results; null when the option has none (see `whenNull`). */
  read(o: OptionSummary, results: ScenarioSummary): number | null;
  /** Text when the outcome applies but the engine gives null (e.g. "never", "flat"); default: not applicable. */
  whenNull?: string;
  /** Writes the cell itself instead of `formatValue` (e.g. doubling or halving time). */
  text?(o: OptionSummary, f: NumberFormatter, context: ValueContext): string;
  /** Beds available, for bed outcomes: the board marks options whose peak exceeds it. */
  capacity?(o: OptionSummary): number | null;
  /** A second line on the board (screen style). */
  detail?(o: OptionSummary, results: ScenarioSummary): string;
}

/** Shown where an outcome does not apply to an option (no campaign, no hospital section). */
export const NOT_APPLICABLE: Record<NumberStyle, string> = { screen: '—', print: 'n/a' };

/** Shown in the reference option's own column for comparison outcomes. */
export const REFERENCE_CELL = 'reference';

const days = (n: number) => `${n} ${n === 1 ? 'day' : 'days'}`;

/** Share of the reference's count that the option averts: "−23.4 % of reference". */
function shareOfReference(averted: number | null | undefined, referenceCount: number | null | undefined): string {
  if (averted == null || referenceCount == null || referenceCount === 0) return '';
  return `${screen.signedPercent(averted / referenceCount)} of reference`;
}

const referenceOf = (results: ScenarioSummary): OptionSummary => results.options[results.referenceIndex];

function beds(key: string, column: string, label: string, printLabel: string, hint: string, shownOn: readonly Surface[], pick: (o: OptionSummary) => BedDemand | undefined): Outcome {
  return {
    key,
    column,
    label,
    printLabel,
    hint,
    group: 'hospital',
    kind: 'count',
    unit: 'beds',
    lowerIsBetter: null,
    requires: ['healthcare'],
    shownOn,
    read: (o) => pick(o)?.peakOccupancy ?? null,
    text: (o, f) => {
      const b = pick(o)!;
      return f.style === 'screen' ? f.bedsAgainstCapacity(b.peakOccupancy, b.capacityBeds) : f.persons(b.peakOccupancy);
    },
    capacity: (o) => pick(o)?.capacityBeds ?? null,
    detail: (o, results) => {
      const b = pick(o);
      if (b === undefined) return '';
      const surge = b.surgeCapacityBeds === null ? '' : ` · surge ${screen.persons(b.surgeCapacityBeds)}`;
      return `peak on ${formatValue({ kind: 'day' }, b.peakDay, 'screen', valueContextOf(results))}${surge}`;
    },
  };
}

/** The catalogue, in the order outcomes are shown (grouped: spread, hospital, vaccination). */
export const OUTCOMES: readonly Outcome[] = [
  {
    key: 'rStart',
    column: 'r_start',
    label: 'R at start',
    printLabel: 'R at start (day 0)',
    hint: 'Reproduction number on day 0 under the measures in force (next-generation matrix)',
    group: 'spread',
    kind: 'ratio',
    lowerIsBetter: true,
    requires: [],
    shownOn: ['board', 'table'],
    read: (o) => o.rStart,
  },
  {
    key: 'growthRatePerDay',
    column: 'growth_rate_per_day',
    label: 'Growth at start',
    printLabel: 'Growth rate at start, per day',
    hint: 'Exponential growth rate on day 0, per day; and the doubling or halving time',
    group: 'spread',
    kind: 'ratePerDay',
    lowerIsBetter: true,
    requires: [],
    shownOn: ['board', 'table'],
    read: (o) => o.growthRatePerDay,
    detail: (o) => screen.doublingOrHalving(o.doublingTimeDays, o.halvingTimeDays),
  },
  {
    key: 'doublingTimeDays',
    column: 'doubling_time_days',
    label: 'Doubling time at start',
    printLabel: 'Doubling time at start, days',
    hint: 'Days for infections to double at the day-0 growth rate (ln 2 / r); "halves in" when shrinking',
    group: 'spread',
    kind: 'days',
    lowerIsBetter: null,
    requires: [],
    shownOn: ['table'],
    read: (o) => o.doublingTimeDays,
    text: (o, f) => f.doublingOrHalving(o.doublingTimeDays, o.halvingTimeDays),
  },
  {
    key: 'halvingTimeDays',
    column: 'halving_time_days',
    label: 'Halving time at start',
    printLabel: 'Halving time at start, days',
    hint: 'Days for infections to halve at the day-0 growth rate (ln 2 / -r), when shrinking',
    group: 'spread',
    kind: 'days',
    lowerIsBetter: null,
    requires: [],
    shownOn: [],
    read: (o) => o.halvingTimeDays,
    whenNull: 'not shrinking',
  },
  {
    key: 'peakDay',
    column: 'peak_day',
    label: 'Peak day',
    printLabel: 'Peak day (most infected)',
    hint: 'Day on which the most people are infected (latent or infectious)',
    group: 'spread',
    kind: 'day',
    lowerIsBetter: null,
    requires: [],
    shownOn: ['board', 'table'],
    read: (o) => o.peakDay,
  },
  {
    key: 'peakDate',
    column: 'peak_date',
    label: 'Peak date',
    printLabel: 'Peak date (most infected)',
    hint: 'Calendar date of the peak day (the scenario\'s start date plus the peak day)',
    group: 'spread',
    kind: 'date',
    lowerIsBetter: null,
    requires: [],
    // The peak day's row already shows its date on the board and in the report.
    shownOn: [],
    read: (o) => o.peakDay,
  },
  {
    key: 'peakPrevalence',
    column: 'peak_prevalence',
    label: 'Peak prevalence',
    printLabel: 'Peak prevalence, % infected',
    hint: 'Share of the population infected on the peak day (persons below)',
    group: 'spread',
    kind: 'fraction',
    lowerIsBetter: true,
    requires: [],
    shownOn: ['board', 'table'],
    read: (o) => o.peakPrevalence,
    detail: (o) => `${screen.persons(o.peakInfectedPersons)} persons`,
  },
  {
    key: 'peakInfectedPersons',
    column: 'peak_infected_persons',
    label: 'Infected at peak',
    printLabel: 'Infected on the peak day, persons',
    hint: 'Persons infected (latent or infectious) on the peak day',
    group: 'spread',
    kind: 'count',
    unit: 'persons',
    lowerIsBetter: true,
    requires: [],
    shownOn: [],
    read: (o) => o.peakInfectedPersons,
  },
  {
    key: 'infections',
    column: 'infections',
    label: 'Infections',
    printLabel: 'Infections, persons',
    hint: 'Persons infected by the end of the horizon, including the initial infections',
    group: 'spread',
    kind: 'count',
    unit: 'persons',
    lowerIsBetter: true,
    requires: [],
    shownOn: ['board', 'table'],
    read: (o) => o.infections,
  },
  {
    key: 'attackRate',
    column: 'attack_rate',
    label: 'Attack rate',
    printLabel: 'Attack rate, % of population',
    hint: 'Infections divided by the population',
    group: 'spread',
    kind: 'fraction',
    lowerIsBetter: true,
    requires: [],
    shownOn: ['board', 'table'],
    read: (o) => o.attackRate,
  },
  {
    key: 'deaths',
    column: 'deaths',
    label: 'Deaths',
    printLabel: 'Deaths, persons',
    hint: 'Deaths eventually caused by the infections in the horizon (IFR by band)',
    group: 'spread',
    kind: 'count',
    unit: 'persons',
    lowerIsBetter: true,
    requires: [],
    shownOn: ['board', 'table'],
    read: (o) => o.deaths,
  },
  {
    key: 'yearsOfLifeLost',
    column: 'years_of_life_lost',
    label: 'Years of life lost',
    printLabel: 'Years of life lost, person-years',
    hint: 'Deaths by band times remaining life expectancy at the band mid-age, from the reference life table (scenario lifeTable, or GBD 2019 by default)',
    group: 'spread',
    kind: 'count',
    unit: 'years',
    lowerIsBetter: true,
    requires: [],
    shownOn: ['board', 'table'],
    read: (o) => o.yearsOfLifeLost,
  },
  {
    key: 'infectionsAverted',
    column: 'infections_averted',
    label: 'Infections averted',
    printLabel: 'Infections averted vs reference, persons',
    hint: 'Reference option minus this option (positive = fewer infections)',
    group: 'spread',
    kind: 'change',
    unit: 'persons',
    lowerIsBetter: false,
    requires: [],
    comparison: true,
    shadeBy: 'infections',
    shownOn: ['board'],
    read: (o) => o.comparison?.infectionsAverted ?? null,
    detail: (o, results) => shareOfReference(o.comparison?.infectionsAverted, referenceOf(results).infections),
  },
  {
    key: 'deathsAverted',
    column: 'deaths_averted',
    label: 'Deaths averted',
    printLabel: 'Deaths averted vs reference',
    hint: 'Reference option minus this option (positive = fewer deaths)',
    group: 'spread',
    kind: 'change',
    unit: 'persons',
    lowerIsBetter: false,
    requires: [],
    comparison: true,
    shadeBy: 'deaths',
    shownOn: ['board', 'table'],
    read: (o) => o.comparison?.deathsAverted ?? null,
    detail: (o, results) => shareOfReference(o.comparison?.deathsAverted, referenceOf(results).deaths),
  },
  {
    key: 'finalSizeAttackRate',
    column: 'final_size_attack_rate',
    label: 'Final-size attack rate',
    printLabel: 'Final-size attack rate (check)',
    hint: 'Attack rate from the multi-group final-size relation (Ma & Earn 2006), a cross-check for measures that never change',
    group: 'spread',
    kind: 'fraction',
    lowerIsBetter: true,
    requires: ['constantMeasures'],
    shownOn: ['table'],
    read: (o) => o.finalSize?.attackRate ?? null,
  },
  {
    key: 'admissions',
    column: 'hospital_admissions',
    label: 'Hospital admissions',
    printLabel: 'Hospital admissions, persons',
    hint: 'Admissions to hospital (ward or ICU) within the horizon (infection-hospitalisation ratio by band)',
    group: 'hospital',
    kind: 'count',
    unit: 'persons',
    lowerIsBetter: true,
    requires: ['healthcare'],
    shownOn: ['board', 'table'],
    read: (o) => o.healthcare?.admissions ?? null,
    detail: (o) => (o.healthcare === null ? '' : `${screen.persons(o.healthcare.icuAdmissions)} need ICU`),
  },
  {
    key: 'icuAdmissions',
    column: 'icu_admissions',
    label: 'ICU admissions',
    printLabel: 'ICU admissions, persons',
    hint: 'Admissions of patients who need ICU, within the horizon',
    group: 'hospital',
    kind: 'count',
    unit: 'persons',
    lowerIsBetter: true,
    requires: ['healthcare'],
    shownOn: ['table'],
    read: (o) => o.healthcare?.icuAdmissions ?? null,
  },
  beds('peakWardOccupancy', 'peak_ward_occupancy', 'Peak ward occupancy', 'Peak ward beds in use', 'Most ward beds in use on one day, against ward capacity', ['board', 'table'], (o) => o.healthcare?.ward),
  {
    key: 'peakWardDay',
    column: 'peak_ward_day',
    label: 'Peak ward day',
    printLabel: 'Peak ward day',
    hint: 'Day on which the most ward beds are in use',
    group: 'hospital',
    kind: 'day',
    lowerIsBetter: null,
    requires: ['healthcare'],
    shownOn: [],
    read: (o) => o.healthcare?.ward.peakDay ?? null,
  },
  {
    key: 'wardDaysOverCapacity',
    column: 'ward_days_over_capacity',
    label: 'Days ward over capacity',
    printLabel: 'Days ward over capacity',
    hint: 'Days on which ward beds in use exceed ward capacity',
    group: 'hospital',
    kind: 'days',
    lowerIsBetter: true,
    requires: ['healthcare'],
    shownOn: ['table'],
    read: (o) => o.healthcare?.ward.daysOverCapacity ?? null,
  },
  beds('peakIcuOccupancy', 'peak_icu_occupancy', 'Peak ICU occupancy', 'Peak ICU beds in use', 'Most ICU beds in use on one day, against ICU capacity', ['board', 'table'], (o) => o.healthcare?.icu),
  {
    key: 'peakIcuDay',
    column: 'peak_icu_day',
    label: 'Peak ICU day',
    printLabel: 'Peak ICU day',
    hint: 'Day on which the most ICU beds are in use',
    group: 'hospital',
    kind: 'day',
    lowerIsBetter: null,
    requires: ['healthcare'],
    shownOn: ['table'],
    read: (o) => o.healthcare?.icu.peakDay ?? null,
  },
  {
    key: 'daysIcuOverCapacity',
    column: 'icu_days_over_capacity',
    label: 'Days ICU over capacity',
    printLabel: 'Days ICU over capacity',
    hint: 'Days on which ICU beds in use exceed ICU capacity; patient-days above capacity below',
    group: 'hospital',
    kind: 'days',
    lowerIsBetter: true,
    requires: ['healthcare'],
    shownOn: ['board', 'table'],
    read: (o) => o.healthcare?.icu.daysOverCapacity ?? null,
    detail: (o) => {
      const icu = o.healthcare?.icu;
      if (icu === undefined) return '';
      const surge = icu.daysOverSurgeCapacity === null ? '' : ` · ${days(icu.daysOverSurgeCapacity)} over surge`;
      return `${screen.persons(icu.patientDaysOverCapacity)} patient-days over${surge}`;
    },
  },
  {
    key: 'icuFirstDayOverCapacity',
    column: 'icu_first_day_over_capacity',
    label: 'First day ICU over capacity',
    printLabel: 'First day ICU over capacity',
    hint: 'First day on which ICU beds in use exceed ICU capacity',
    group: 'hospital',
    kind: 'day',
    lowerIsBetter: null,
    requires: ['healthcare'],
    shownOn: ['table'],
    read: (o) => o.healthcare?.icu.firstDayOverCapacity ?? null,
    whenNull: 'never',
  },
  {
    key: 'icuDaysOverSurgeCapacity',
    column: 'icu_days_over_surge_capacity',
    label: 'Days ICU over surge capacity',
    printLabel: 'Days ICU over surge capacity',
    hint: 'Days on which ICU beds in use exceed ICU capacity at full surge',
    group: 'hospital',
    kind: 'days',
    lowerIsBetter: true,
    requires: ['healthcare', 'surgeCapacity'],
    shownOn: ['table'],
    read: (o) => o.healthcare?.icu.daysOverSurgeCapacity ?? null,
  },
  {
    key: 'admissionsAverted',
    column: 'hospital_admissions_averted',
    label: 'Admissions averted',
    printLabel: 'Hospital admissions averted vs reference, persons',
    hint: 'Reference option minus this option (positive = fewer admissions)',
    group: 'hospital',
    kind: 'change',
    unit: 'persons',
    lowerIsBetter: false,
    requires: ['healthcare'],
    comparison: true,
    shadeBy: 'admissions',
    shownOn: ['board'],
    read: (o) => o.comparison?.admissionsAverted ?? null,
    detail: (o, results) => shareOfReference(o.comparison?.admissionsAverted, referenceOf(results).healthcare?.admissions),
  },
  {
    key: 'doses',
    column: 'vaccine_doses',
    label: 'Doses given',
    printLabel: 'Vaccine doses given',
    hint: "Vaccine doses given within the horizon under the option's campaign",
    group: 'vaccination',
    kind: 'count',
    unit: 'doses',
    lowerIsBetter: null,
    requires: ['campaign'],
    shownOn: ['board', 'table'],
    read: (o) => o.vaccination?.doses ?? null,
    detail: (o) => o.vaccination?.campaign ?? 'no campaign',
  },
  {
    key: 'deathsAvertedPer1000Doses',
    column: 'deaths_averted_per_1000_doses',
    label: 'Deaths averted per 1,000 doses',
    printLabel: 'Deaths averted per 1,000 doses',
    hint: 'Deaths averted against the reference option for every 1,000 doses this option gives',
    group: 'vaccination',
    kind: 'ratio',
    unit: 'per 1,000 doses',
    digits: 1,
    lowerIsBetter: null,
    requires: ['campaign'],
    comparison: true,
    shownOn: ['board', 'table'],
    read: (o) => o.comparison?.deathsAvertedPer1000Doses ?? null,
    detail: (o) => (o.comparison?.infectionsAvertedPer1000Doses == null ? '' : `infections: ${screen.decimal(o.comparison.infectionsAvertedPer1000Doses, 1)}`),
  },
  {
    key: 'infectionsAvertedPer1000Doses',
    column: 'infections_averted_per_1000_doses',
    label: 'Infections averted per 1,000 doses',
    printLabel: 'Infections averted per 1,000 doses',
    hint: 'Infections averted against the reference option for every 1,000 doses this option gives',
    group: 'vaccination',
    kind: 'ratio',
    unit: 'per 1,000 doses',
    digits: 1,
    lowerIsBetter: null,
    requires: ['campaign'],
    comparison: true,
    shownOn: [],
    read: (o) => o.comparison?.infectionsAvertedPer1000Doses ?? null,
  },
  {
    key: 'dosesToNonSusceptibleShare',
    column: 'doses_to_non_susceptible_share',
    label: 'Doses to already-immune people',
    printLabel: 'Doses to already-immune people, %',
    hint: 'Share of doses given to people already infected or recovered (latent, infectious or recovered)',
    group: 'vaccination',
    kind: 'fraction',
    lowerIsBetter: null,
    requires: ['campaign'],
    shownOn: ['board'],
    read: (o) => o.vaccination?.dosesToNonSusceptibleShare ?? null,
  },
  {
    key: 'rUnderMeasures',
    column: 'r_under_measures',
    label: 'R under measures',
    printLabel: 'R when the first phase starts',
    hint: 'R with each phase\'s measures and the susceptibles on the day it starts (in brackets: at full susceptibility)',
    group: 'measures',
    kind: 'ratio',
    lowerIsBetter: true,
    requires: ['measures'],
    shownOn: ['board', 'table'],
    read: (o) => firstPhase(o)?.rAtPhaseStart ?? null,
    // On screen every phase; in print the first phase's R (the report's option summaries list every phase).
    text: (o, f, context) =>
      f.style === 'print'
        ? f.r(firstPhase(o)?.rAtPhaseStart ?? Number.NaN)
        : phasesByStart(o)
            .map((p) => `from ${formatValue({ kind: 'day' }, p.startDay, 'screen', context)}: ${f.r(p.rAtPhaseStart)} (${f.r(p.rMeasuresOnly)})`)
            .join(' · '),
  },
  {
    key: 'daysUnderMeasures',
    column: 'days_under_measures',
    label: 'Days under measures',
    printLabel: 'Days under measures',
    hint: 'Days on which any phase\'s measures were in force, fixed or switched by a trigger',
    group: 'measures',
    kind: 'days',
    lowerIsBetter: null,
    requires: ['measures'],
    shownOn: ['board', 'table'],
    read: (o) => o.daysUnderMeasures,
  },
  {
    key: 'switchesOn',
    column: 'switches_on',
    label: 'Times switched on',
    printLabel: 'Times triggered measures came into force',
    hint: 'How often the triggers put their measures in force over the horizon (all triggered phases)',
    group: 'measures',
    kind: 'count',
    lowerIsBetter: null,
    requires: ['triggers'],
    shownOn: ['board', 'table'],
    read: (o) => o.triggers.reduce((acc, t) => acc + t.switchesOn, 0),
  },
  {
    key: 'daysInForce',
    column: 'days_in_force',
    label: 'Days triggered measures held',
    printLabel: 'Days triggered measures were in force',
    hint: 'Days on which measures switched by a trigger were in force (all triggered phases together, days counted once per phase)',
    group: 'measures',
    kind: 'days',
    lowerIsBetter: null,
    requires: ['triggers'],
    shownOn: ['board', 'table'],
    read: (o) => o.triggers.reduce((acc, t) => acc + t.daysInForce, 0),
  },
  {
    key: 'contactsRemoved',
    column: 'contacts_removed_full_closure_days',
    label: 'Contacts removed',
    printLabel: 'Contacts removed, full-closure days by setting',
    hint: 'Usual contacts the measures removed over the horizon, by setting, counted as days of complete closure of that setting (negative: contacts added)',
    group: 'measures',
    kind: 'days',
    lowerIsBetter: null,
    requires: ['measures'],
    // The printed report gives these by setting in its option summaries.
    shownOn: ['board'],
    read: (o) => Object.values(o.measureBurden.fullClosureDays).reduce((acc, x) => acc + x, 0),
    text: (o, f) => {
      const parts = Object.entries(o.measureBurden.fullClosureDays)
        .filter(([, x]) => Math.abs(x) >= 0.05)
        .map(([setting, x]) => `${setting} ${f.days(x)}`);
      return parts.length === 0 ? f.days(0) : parts.join(f.style === 'screen' ? ' · ' : '; ');
    },
  },
];

/** The option's phases in the order they start. */
function phasesByStart(o: OptionSummary): OptionSummary['rByPhase'] {
  return [...o.rByPhase].sort((a, b) => a.startDay - b.startDay);
}

function firstPhase(o: OptionSummary): OptionSummary['rByPhase'][number] | undefined {
  return phasesByStart(o)[0];
}

/** The outcome with this key; throws for an unknown key (a programming error). */
export function outcome(key: string): Outcome {
  const found = OUTCOMES.find((o) => o.key === key);
  if (found === undefined) throw new Error(`no outcome with key "${key}"`);
  return found;
}

/** Whether one requirement holds for an option. */
function holds(requirement: Requirement, o: OptionSummary): boolean {
  switch (requirement) {
    case 'healthcare':
      return o.healthcare !== null;
    case 'campaign':
      return o.vaccination !== null;
    case 'constantMeasures':
      return o.finalSize !== null;
    case 'surgeCapacity':
      return o.healthcare !== null && o.healthcare.icu.surgeCapacityBeds !== null;
    case 'measures':
      return o.rByPhase.length > 0;
    case 'triggers':
      return o.triggers.length > 0;
  }
}

/** Whether an outcome applies to an option (every requirement holds). */
export function appliesTo(entry: { requires: readonly Requirement[] }, o: OptionSummary): boolean {
  return entry.requires.every((r) => holds(r, o));
}

/** Outcomes that apply to at least one option of these results, in catalogue order; only those shown on `surface` when given. Dates need the scenario's start date. */
export function outcomesFor(results: ScenarioSummary, surface?: Surface): Outcome[] {
  return OUTCOMES.filter(
    (e) => (surface === undefined || e.shownOn.includes(surface)) && (e.kind !== 'date' || results.startDate !== null) && results.options.some((o) => appliesTo(e, o)),
  );
}

/** How the results write dates: day numbers as calendar dates from the scenario's start date. */
export function valueContextOf(results: ScenarioSummary): ValueContext {
  return { startDate: results.startDate };
}

/**
 * An outcome as data (JSON and CSV): the number, or for a `date` outcome its ISO 8601 date
 * (null without a start date); null where the engine gives none.
 */
export function outcomeDatum(entry: Outcome, o: OptionSummary, results: ScenarioSummary): number | string | null {
  const value = entry.read(o, results);
  if (entry.kind !== 'date' || value === null) return value;
  return results.startDate === null ? null : dateOfDay(results.startDate, value);
}

/** Whether this option is the one the others are compared with. */
export function isReference(o: OptionSummary, results: ScenarioSummary): boolean {
  return results.options[results.referenceIndex] === o;
}

/** A comparison outcome in the reference option's own column (shown as "reference"). */
export function isReferenceCell(entry: Outcome, o: OptionSummary, results: ScenarioSummary): boolean {
  return entry.comparison === true && appliesTo(entry, o) && isReference(o, results);
}

/**
 * The text of one cell: "—" (screen) or "n/a" (print) where the outcome does not apply,
 * "reference" for a comparison in the reference's own column, else the value in the style (with its unit
 * on screen).
 */
export function outcomeText(entry: Outcome, o: OptionSummary, results: ScenarioSummary, style: NumberStyle, context: ValueContext = valueContextOf(results)): string {
  if (!appliesTo(entry, o)) return NOT_APPLICABLE[style];
  if (isReferenceCell(entry, o, results)) return REFERENCE_CELL;
  if (entry.text !== undefined) return entry.text(o, numberFormatter(style), context);
  const value = entry.read(o, results);
  if (value === null) return entry.whenNull ?? NOT_APPLICABLE[style];
  return formatValue(entry, value, style, context);
}

/**
 * The cell of an outcome with the interval of the uncertainty draws beside it: "8,298 (6,900 to
 * 9,700)" in print, "8,298 persons (6,900–9,700)" on screen. The value is the point estimate (the
 * run at the central inputs); the bracket the interval of the draws. Without an interval (none
 * given, the outcome missing in some draws, not applicable, the reference's own comparison cell)
 * the cell is `outcomeText` alone.
 */
export function outcomeTextWithInterval(entry: Outcome, o: OptionSummary, results: ScenarioSummary, style: NumberStyle, interval: Interval | null | undefined, context: ValueContext = valueContextOf(results)): string {
  const text = outcomeText(entry, o, results, style, context);
  if (interval == null || !appliesTo(entry, o) || isReferenceCell(entry, o, results)) return text;
  return `${text} (${formatRange(entry, interval, style, context)})`;
}

/** The number a row is shaded by (its own, or that of `shadeBy`). */
export function shadeValue(entry: Outcome, o: OptionSummary, results: ScenarioSummary): { value: number | null; lowerIsBetter: boolean | null } {
  const by = entry.shadeBy === undefined ? entry : outcome(entry.shadeBy);
  return { value: by.read(o, results), lowerIsBetter: by.lowerIsBetter };
}

/** True when a bed outcome's peak exceeds the beds available. */
export function overCapacity(entry: Outcome, o: OptionSummary, results: ScenarioSummary): boolean {
  const capacity = entry.capacity?.(o) ?? null;
  const value = entry.read(o, results);
  return capacity !== null && value !== null && value > capacity;
}

/** Outcomes given per age band (JSON arrays; CSV columns `<column> <band>`). */
export interface BandOutcome extends ValueFormat {
  key: string;
  column: string;
  label: string;
  requires: readonly Requirement[];
  /** Zeros where the outcome does not apply, so JSON arrays always have one value per band. */
  read(o: OptionSummary, results: ScenarioSummary): number[];
  /** Printed as a by-band table in the CLI's table and Markdown. */
  printTable: boolean;
}

export const BAND_OUTCOMES: readonly BandOutcome[] = [
  { key: 'infectionsByBand', column: 'infections', label: 'Infections by age band', kind: 'count', unit: 'persons', printTable: false, requires: [], read: (o) => o.infectionsByBand },
  { key: 'attackRateByBand', column: 'attack_rate', label: 'Attack rate by age band', kind: 'fraction', printTable: true, requires: [], read: (o) => o.attackRateByBand },
  { key: 'deathsByBand', column: 'deaths', label: 'Deaths by age band', kind: 'count', unit: 'persons', printTable: true, requires: [], read: (o) => o.deathsByBand },
  { key: 'yearsOfLifeLostByBand', column: 'years_of_life_lost', label: 'Years of life lost by age band', kind: 'count', unit: 'years', printTable: false, requires: [], read: (o) => o.yearsOfLifeLostByBand },
  {
    key: 'dosesByBand',
    column: 'vaccine_doses',
    label: 'Vaccine doses by age band',
    kind: 'count',
    unit: 'doses',
    printTable: false,
    requires: ['campaign'],
    read: (o, results) => o.vaccination?.dosesByBand ?? results.ageBands.map(() => 0),
  },
];

/** One band's value of a by-band outcome as text ("—"/"n/a" where the outcome does not apply to the option). */
export function formatBandValue(entry: BandOutcome, o: OptionSummary, results: ScenarioSummary, band: number, style: NumberStyle): string {
  return appliesTo(entry, o) ? formatValue(entry, entry.read(o, results)[band], style) : NOT_APPLICABLE[style];
}
