/**
 * The scenario file: what an analyst writes down, validated with zod.
 *
 * Format name "mixwise-scenario", version 1. Units are in the field names
 * (Days, PerDay, Persons, Fraction). Every validation problem names its JSON
 * path, the rule and the value (see `validation.ts`).
 */
import { z } from 'zod';
import {
  MAX_AGE_YEARS,
  MAX_BEDS,
  MAX_CONTACT_MULTIPLIER,
  MAX_CONTACTS_PER_DAY,
  MAX_DAY_NUMBER,
  MAX_DELAY_MEAN_DAYS,
  MAX_DELAY_SHAPE,
  MAX_DOUBLING_TIME_DAYS,
  MAX_ERLANG_STAGES,
  MAX_HORIZON_DAYS,
  MAX_PERIOD_DAYS,
  MAX_TRIGGER_LEVEL_PERSONS,
  EARLIEST_START_DATE,
  LATEST_START_DATE,
  MAX_POPULATION_PERSONS,
  MAX_R0,
  MAX_RELATIVE_FACTOR,
  MIN_DELAY_SHAPE,
  MIN_DOUBLING_TIME_DAYS,
  MIN_PERIOD_DAYS,
  aboveZero,
  between,
} from './limits.ts';
import { campaignSchema } from './vaccination/schema.ts';
import { fitRecordSchema } from './fitting/fitRecordSchema.ts';
import { lifeTableSchema } from './lifeExpectancy.ts';
import { uncertaintySchema } from './uncertainty/schema.ts';
import { DEFAULT_ICU_PATIENT_WARD_STAY } from './healthcare/defaults.ts';
import { isoDateToEpochDay } from './fitting/isoDate.ts';

export const SCENARIO_FORMAT = 'mixwise-scenario';
export const SCENARIO_VERSION = 1;

const nonNegative = z.number({ message: 'must be a number' }).min(0, { message: 'must be >= 0' });
const fraction = z.number({ message: 'must be a number' }).min(0, { message: 'must be a fraction between 0 and 1' }).max(1, { message: 'must be a fraction between 0 and 1' });
const wholeDay = z
  .number()
  .int({ message: 'must be a whole number of days' })
  .min(0, { message: 'must be >= 0' })
  .max(MAX_DAY_NUMBER, { message: `must be at most ${MAX_DAY_NUMBER} (a day number)` });

const erlangStages = z
  .number({ message: 'must be a number' })
  .int({ message: 'must be a whole number' })
  .min(1, { message: 'must be at least 1' })
  .max(MAX_ERLANG_STAGES, { message: `must be at most ${MAX_ERLANG_STAGES}` });

/** One age band: a label for display and the lower age bound in years. */
export const ageBandSchema = z.object({
  label: z.string().min(1, { message: 'must not be empty' }),
  lowerAgeYears: between(0, MAX_AGE_YEARS, 'years'),
});

/** A setting (home, school, work, other, or the scenario's own) and its contact matrix. */
export const settingSchema = z.object({
  name: z.string().min(1, { message: 'must not be empty' }),
  /** C^s_ij: mean daily contacts one person in band i has with people in band j here (contacts per day). */
  contactsPerDay: z.array(z.array(between(0, MAX_CONTACTS_PER_DAY, 'contacts per day'))),
});

/** Transmission is fixed by R0, or by an observed doubling time before any measure. */
export const transmissionSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('r0'), r0: aboveZero(MAX_R0, '') }),
  z.object({ kind: z.literal('doublingTime'), doublingTimeDays: between(MIN_DOUBLING_TIME_DAYS, MAX_DOUBLING_TIME_DAYS, 'days') }),
]);

/** A delay distribution: gamma with the given mean (days) and shape (1 = exponential). */
export const delaySchema = z.object({
  meanDays: between(0, MAX_DELAY_MEAN_DAYS, 'days'),
  shape: between(MIN_DELAY_SHAPE, MAX_DELAY_SHAPE, '').default(1),
});

export const diseaseSchema = z.object({
  transmission: transmissionSchema,
  /** Mean latent (exposed, not yet infectious) period, days. */
  latentPeriodDays: between(MIN_PERIOD_DAYS, MAX_PERIOD_DAYS, 'days'),
  /** Mean infectious period D, days. */
  infectiousPeriodDays: between(MIN_PERIOD_DAYS, MAX_PERIOD_DAYS, 'days'),
  /** Erlang stage counts: change timing and growth, not R0. */
  latentStages: erlangStages.default(1),
  infectiousStages: erlangStages.default(1),
  /** u_i, relative susceptibility by band (1 = reference). */
  relativeSusceptibility: z.array(between(0, MAX_RELATIVE_FACTOR, '')).optional(),
  /** h_j, relative infectiousness by band (1 = reference). */
  relativeInfectiousness: z.array(between(0, MAX_RELATIVE_FACTOR, '')).optional(),
  source: z.string().default(''),
  /** Optional: how R0 was fitted to daily case counts (see src/engine/fitting/fitRecordSchema.ts). */
  fitRecord: fitRecordSchema.optional(),
});

export const severitySchema = z.object({
  /** IFR by band, fraction 0-1. */
  infectionFatalityRatio: z.array(fraction),
  /** Delay from infection to death, for the daily death series. */
  deathDelay: delaySchema.default({ meanDays: 21, shape: 4 }),
  source: z.string().min(1, { message: 'must cite where the IFR values come from' }),
});

export const initialStateSchema = z.object({
  /** Persons infected on day 0, by band. */
  infectedPersons: z.array(between(0, MAX_POPULATION_PERSONS, 'persons')),
  /** Where the initial infections sit: just infected (latent) or already infectious. */
  infectedCompartment: z.enum(['latent', 'infectious']).default('latent'),
  /** Fraction of each band immune on day 0 (prior infection), 0-1. */
  priorImmunityFraction: z.array(fraction).optional(),
});

/** Scale one setting's contacts for chosen bands (e.g. shielding older people). */
export const ageFactorSchema = z.object({
  setting: z.string().min(1),
  /** Band indices (0-based) the factor applies to. */
  bands: z.array(z.number().int().min(0)).min(1, { message: 'must name at least one band' }),
  /** Multiplier on those bands' contacts in that setting, 0 = none. */
  factor: between(0, MAX_CONTACT_MULTIPLIER, ''),
});

/** What a trigger watches (see src/engine/triggers.ts for how each is read on a decision day). */
export const TRIGGER_QUANTITIES = ['infectiousPer100k', 'dailyInfectionsPer100k', 'dailyAdmissions', 'wardOccupancy', 'icuOccupancy'] as const;
export type TriggerQuantity = (typeof TRIGGER_QUANTITIES)[number];
/** Quantities read from the hospital model: a trigger on them needs a `healthcare` section. */
export const HOSPITAL_TRIGGER_QUANTITIES: readonly TriggerQuantity[] = ['dailyAdmissions', 'wardOccupancy', 'icuOccupancy'];

/**
 * Switches a phase's measures on and off by what the epidemic does (rule in src/engine/triggers.ts):
 * on a decision day the measures come into force (after `lagDays`) when the quantity is above
 * `onAbove`, and lift (after `lagDays`) when it is below `offBelow` and they have been in force at
 * least `minimumDaysOn` days. Thresholds are in the quantity's unit (per 100,000 population, or persons).
 */
export const triggerSchema = z.object({
  quantity: z.enum(TRIGGER_QUANTITIES),
  /** Per 100,000 population (at most 100,000, validation.ts) or persons. */
  onAbove: between(0, MAX_TRIGGER_LEVEL_PERSONS, ''),
  offBelow: between(0, MAX_TRIGGER_LEVEL_PERSONS, ''),
  minimumDaysOn: wholeDay.default(0),
  lagDays: wholeDay.default(0),
});

/**
 * A phase: from `fromDay` (inclusive) to `toDay` (exclusive) the measures apply — on every day
 * when the phase has no `trigger`, on the days its trigger keeps them in force when it has one.
 * Outside every phase contacts are as usual.
 */
export const phaseSchema = z.object({
  fromDay: wholeDay,
  toDay: wholeDay,
  /** Optional: switch these measures by a monitored quantity instead of on every day of the phase. */
  trigger: triggerSchema.optional(),
  /** Multiplier by setting name; a setting not named stays at 1. 0 = closed, >1 allowed. */
  settingMultipliers: z.record(z.string(), between(0, MAX_CONTACT_MULTIPLIER, '')).default({}),
  ageFactors: z.array(ageFactorSchema).default([]),
  /** Fraction by which the infectiousness of cases is cut by isolation, 0-1. */
  caseIsolation: fraction.default(0),
});

export const policyOptionSchema = z.object({
  name: z.string().min(1, { message: 'must not be empty' }),
  description: z.string().default(''),
  phases: z.array(phaseSchema).default([]),
  /** Name of the vaccination campaign this option runs (see `vaccinationCampaigns`); none if absent. */
  vaccinationCampaign: z.string().optional(),
});

/** Beds available. Surge levels, when given, count all beds at full surge (not extra beds). */
export const bedCapacitySchema = z.object({
  wardBeds: between(0, MAX_BEDS, 'beds'),
  icuBeds: between(0, MAX_BEDS, 'beds'),
  wardSurgeBeds: between(0, MAX_BEDS, 'beds').optional(),
  icuSurgeBeds: between(0, MAX_BEDS, 'beds').optional(),
});

/**
 * Hospital and ICU demand (see src/engine/healthcare). Ratios by band default to Ferguson et al.
 * 2020 (Imperial College Report 9, Table 1) turned into per-infection values; delays default to
 * the values cited in src/engine/healthcare/defaults.ts. A delay is given either once for every
 * band (`admissionDelay`) or band by band (`admissionDelayByBand`), never both: the list would
 * silently replace the common delay (healthcareProblems.ts refuses the pair). The common delays
 * therefore have no default in the schema; `commonDelays` (healthcare/defaults.ts) fills them in
 * where they are read.
 */
export const healthcareSchema = z.object({
  /** IHR by band: fraction of infections admitted to hospital, 0-1. */
  infectionHospitalisationRatio: z.array(fraction).optional(),
  /** Share of admissions that need ICU, by band, 0-1. */
  icuShareOfAdmissions: z.array(fraction).optional(),
  /** Infection to hospital admission, every band (default DEFAULT_ADMISSION_DELAY). */
  admissionDelay: delaySchema.describe('Every band (default mean 10 days, shape 4); not together with admissionDelayByBand').optional(),
  /** Length of stay in a ward of patients who do not need ICU, every band (default DEFAULT_WARD_STAY). */
  wardStay: delaySchema.describe('Every band (default mean 8 days, shape 2); not together with wardStayByBand').optional(),
  /** Length of stay in ICU, every band (default DEFAULT_ICU_STAY). */
  icuStay: delaySchema.describe('Every band (default mean 10 days, shape 2); not together with icuStayByBand').optional(),
  /** Days ICU patients spend in a ward outside ICU (counted in ward beds from admission). */
  icuPatientWardStay: delaySchema.default(() => ({ ...DEFAULT_ICU_PATIENT_WARD_STAY })),
  admissionDelayByBand: z.array(delaySchema).optional(),
  wardStayByBand: z.array(delaySchema).optional(),
  icuStayByBand: z.array(delaySchema).optional(),
  capacity: bedCapacitySchema,
  source: z.string().default(''),
});

export const scenarioSchema = z.object({
  format: z.literal(SCENARIO_FORMAT),
  version: z.literal(SCENARIO_VERSION),
  title: z.string().min(1, { message: 'must not be empty' }),
  notes: z.string().default(''),
  ageBands: z.array(ageBandSchema).min(1, { message: 'must list at least one age band' }),
  /** Persons by band: 0 (an empty band) or at least 1 (smaller counts make 1/N overflow). */
  populationPersons: z.array(between(0, MAX_POPULATION_PERSONS, 'persons').refine((x) => x <= 0 || x >= 1, { message: 'must be 0 or at least 1 person' })),
  settings: z.array(settingSchema).min(1, { message: 'must list at least one setting' }),
  disease: diseaseSchema,
  severity: severitySchema,
  initialState: initialStateSchema,
  /**
   * Optional: the calendar date of day 0 (ISO 8601, YYYY-MM-DD); every day shown then also shows its
   * date. The JSON Schema says so with `format: "date"` (RFC 3339 full-date) and the pattern.
   */
  startDate: z
    .string()
    .regex(/^\d{4}-\d{2}-\d{2}$/, { message: 'must be a calendar date written YYYY-MM-DD', abort: true })
    .refine((text) => isoDateToEpochDay(text) !== null, { message: 'must be a calendar date written YYYY-MM-DD' })
    .refine((text) => isoDateToEpochDay(text) === null || !(text < EARLIEST_START_DATE || text > LATEST_START_DATE), { message: `must be from ${EARLIEST_START_DATE} to ${LATEST_START_DATE}` })
    .meta({ format: 'date', description: `Calendar date of day 0, ISO 8601 YYYY-MM-DD, from ${EARLIEST_START_DATE} to ${LATEST_START_DATE}.` })
    .optional(),
  horizonDays: z.number({ message: 'must be a number' }).int({ message: 'must be a whole number of days' }).min(1, { message: 'must be >= 1' }).max(MAX_HORIZON_DAYS, { message: `must be <= ${MAX_HORIZON_DAYS}` }),
  /** Name of the option others are compared with; the first option if absent. */
  referenceOption: z.string().optional(),
  options: z.array(policyOptionSchema).min(1, { message: 'must list at least one policy option' }),
  /** Optional: hospital and ICU demand against capacity. */
  healthcare: healthcareSchema.optional(),
  /** Vaccination campaigns that options can refer to by name. */
  vaccinationCampaigns: z.array(campaignSchema).default([]),
  /** Optional: remaining life expectancy by age for years of life lost; the GBD 2019 reference table if absent (lifeExpectancy.ts). */
  lifeTable: lifeTableSchema.optional(),
  /** Optional: uncertain inputs and how to draw them (see src/engine/uncertainty). */
  uncertainty: uncertaintySchema.optional(),
});

/** A scenario as written in a file (defaults may be missing). */
export type ScenarioInput = z.input<typeof scenarioSchema>;
/** A validated scenario with defaults filled in. */
export type Scenario = z.output<typeof scenarioSchema>;
export type Setting = z.output<typeof settingSchema>;
export type PolicyOption = z.output<typeof policyOptionSchema>;
export type Phase = z.output<typeof phaseSchema>;
export type Trigger = z.output<typeof triggerSchema>;
export type AgeFactor = z.output<typeof ageFactorSchema>;
export type Delay = z.output<typeof delaySchema>;
export type Healthcare = z.output<typeof healthcareSchema>;
export type { Campaign, CampaignInput } from './vaccination/schema.ts';
export type { Uncertainty, UncertaintyInput, UncertainParameter, Distribution } from './uncertainty/schema.ts';
