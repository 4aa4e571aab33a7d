/**
 * What the engine returns for a scenario: one `OptionResults` per policy option.
 * Views (UI, CLI, report) only format these numbers; they never compute model quantities.
 */

/**
 * Daily series of one option, flat and band-major per day: value for day d and band i
 * sits at `[d * bands + i]`. Float64Arrays so a worker can transfer them without copying.
 */
export interface DailySeries {
  /** Horizon H in days. */
  days: number;
  /** Number of age bands n. */
  bands: number;
  /** Persons susceptible at the start of day d (d = 0..H), by band. Length (H+1)·n. */
  susceptible: Float64Array;
  /** Persons currently infected, latent or infectious (E+I), at day d (d = 0..H), by band. Length (H+1)·n. */
  prevalence: Float64Array;
  /**
   * New infections during day d, i.e. in [d, d+1) (d = 0..H-1), by band, persons; day 0 also holds
   * the initial infections, so the series adds up to `infectionsByBand`. Length H·n.
   */
  incidence: Float64Array;
  /**
   * Deaths during day d (d = 0..H-1), all bands together: sum_i IFR_i x incidence_i convolved with
   * the infection-to-death delay (the same delay for every band, so the sum is convolved once).
   * Length H. Deaths by band over the horizon are in `OptionResults.deathsByBand`.
   */
  deaths: Float64Array;
  /** R(t): dominant eigenvalue of the next-generation matrix with day d's susceptibles and measures (d = 0..H). Length H+1. */
  rt: Float64Array;
  /** Vaccine doses given during day d (d = 0..H-1), by band (zeros without a campaign). Length H·n. */
  doses: Float64Array;
}

/** The daily counts of `DailySeries` without R(t): what a `noRt` run keeps (simulate.ts). */
export type DailySeriesNoRt = Omit<DailySeries, 'rt'>;

/**
 * Every number of one policy option over the horizon except the daily series: what a summary run
 * returns (`simulateOption(p, option, { series: 'summary' })`, simulate.ts). Each field equals,
 * bit for bit, the same field of a full run.
 */
export interface OptionSummary {
  name: string;
  /** R on day 0 under this option's measures and the initial susceptibles (NGM dominant eigenvalue). */
  rStart: number;
  /** Exponential growth rate on day 0 under the measures, per day (negative when shrinking). */
  growthRatePerDay: number;
  /** ln 2 / r when r > 0, else null (not growing). */
  doublingTimeDays: number | null;
  /** ln 2 / -r when r < 0, else null. */
  halvingTimeDays: number | null;
  /** Day (0..H) on which the most people are infected (E+I). */
  peakDay: number;
  /** Persons infected (E+I) on the peak day. */
  peakInfectedPersons: number;
  /** peakInfectedPersons / total population, fraction. */
  peakPrevalence: number;
  /** Persons infected by the end of the horizon, including the initial infections. */
  infections: number;
  infectionsByBand: number[];
  /** infections / population, fraction 0-1. */
  attackRate: number;
  attackRateByBand: number[];
  /** Deaths eventually caused by the horizon's infections: sum_i IFR_i x infections_i, persons. */
  deaths: number;
  deathsByBand: number[];
  /** Years of life lost: sum_i deaths_i x remaining life expectancy at band i's mid-age (lifeExpectancy.ts), person-years. */
  yearsOfLifeLost: number;
  yearsOfLifeLostByBand: number[];
  /**
   * Multi-group final-size solution (Ma & Earn 2006) under this option's measures,
   * only when they are constant over the whole horizon; otherwise null.
   */
  finalSize: { attackRate: number; attackRateByBand: number[] } | null;
  /** Hospital and ICU demand against capacity; null when the scenario has no `healthcare` section. */
  healthcare: HealthcareOutcomes | null;
  /** The option's vaccination campaign; null when it has none. */
  vaccination: VaccinationOutcomes | null;
  /** What each triggered phase did (empty when the option has no trigger); see triggers.ts. */
  triggers: TriggerOutcome[];
  /** Days (of 0..H-1) on which any phase's measures were in force, fixed or triggered. */
  daysUnderMeasures: number;
  /** R under each phase's measures (in the order of the option's phases); see rByPhase.ts. */
  rByPhase: PhaseReproduction[];
  /** Contacts the measures removed, by setting; see measureBurden.ts. */
  measureBurden: MeasureBurden;
  /** Against the reference option (filled when the reference is run with it; null otherwise). */
  comparison: Comparison | null;
}

/** Results of one policy option over the horizon: the summary and the daily series. */
export interface OptionResults extends OptionSummary {
  series: DailySeries;
}

/** A `noRt` run (simulate.ts): the summary and the daily counts, without the daily R(t). */
export interface OptionResultsNoRt extends OptionSummary {
  series: DailySeriesNoRt;
}

/**
 * Daily hospital series of one option, all bands together (d = 0..H-1, length H each).
 * Occupancy is the mean number of beds in use during day d (persons).
 */
export interface HealthcareSeries {
  /** Hospital admissions on day d, ICU or not, persons. */
  admissions: Float64Array;
  /** Admissions on day d of patients who will need ICU, persons. */
  icuAdmissions: Float64Array;
  /** Ward beds in use (patients not needing ICU, and ICU patients' days outside ICU). */
  wardOccupancy: Float64Array;
  /** ICU beds in use. */
  icuOccupancy: Float64Array;
}

/** Beds in use against beds available, over the horizon. */
export interface BedDemand {
  capacityBeds: number;
  /** All beds at full surge; null when no surge level is given. */
  surgeCapacityBeds: number | null;
  /** Most beds in use on one day (mean over that day), persons. */
  peakOccupancy: number;
  /** Day (0..H-1) of the peak; the first such day if it repeats. */
  peakDay: number;
  /** Days on which occupancy exceeds capacity. */
  daysOverCapacity: number;
  /** sum over days of max(0, occupancy - capacity), patient-days. */
  patientDaysOverCapacity: number;
  /** First day occupancy exceeds capacity; null if it never does. */
  firstDayOverCapacity: number | null;
  /** As `daysOverCapacity` against the surge level; null when no surge level is given. */
  daysOverSurgeCapacity: number | null;
  /** As `patientDaysOverCapacity` against the surge level; null when no surge level is given. */
  patientDaysOverSurgeCapacity: number | null;
}

/**
 * Hospital and ICU demand of one option (model and sources: src/engine/healthcare).
 * Admission totals count admissions on days 0..H-1: the few due after the horizon (from
 * infections near its end) are left out, unlike `deaths`, which counts eventual deaths.
 */
export interface HealthcareOutcomes {
  /** Hospital admissions (ICU or not) within the horizon, persons. */
  admissions: number;
  admissionsByBand: number[];
  /** Admissions of patients who never need ICU, persons. */
  wardOnlyAdmissions: number;
  /** Admissions of patients who need ICU, persons. */
  icuAdmissions: number;
  icuAdmissionsByBand: number[];
  ward: BedDemand;
  icu: BedDemand;
  series: HealthcareSeries;
}

/** The largest reciprocity imbalance of one setting's matrix (see contacts.ts). */
export interface ReciprocityCheck {
  setting: string;
  /** max_ij |N_i C_ij - N_j C_ji| / max(N_i C_ij, N_j C_ji), fraction (0 = balanced). */
  largestRelativeImbalance: number;
  /** Band pair (i, j) where it occurs. */
  at: [number, number];
}

/** Results of a scenario; `O` = `OptionSummary` for a summary run (`ScenarioSummary`). */
export interface ScenarioResults<O extends OptionSummary = OptionResults> {
  title: string;
  /** The revision of the scenario these results belong to (`scenarioRevision`, revision.ts). */
  revision: string;
  /** The scenario's day 0 as an ISO 8601 date (YYYY-MM-DD); null when the scenario has no start date. */
  startDate: string | null;
  ageBands: string[];
  /** Horizon H in days (the scenario's `horizonDays`). */
  horizonDays: number;
  /** Basic reproduction number: NGM dominant eigenvalue, fully susceptible, no measures. */
  r0: number;
  /** Transmission rate per contact, calibrated from R0 or the doubling time. */
  beta: number;
  /** Index into `options` of the reference option. */
  referenceIndex: number;
  options: O[];
  reciprocity: ReciprocityCheck[];
}

/** A scenario's results without the daily series (run.ts, `runScenarioSummary`). */
export type ScenarioSummary = ScenarioResults<OptionSummary>;

/** Doses of one option's campaign within the horizon. */
export interface VaccinationOutcomes {
  campaign: string;
  /** Doses given, persons (one dose each). */
  doses: number;
  dosesByBand: number[];
  /** Share of doses given to people already infected or immune (latent, infectious or recovered), fraction. */
  dosesToNonSusceptibleShare: number;
}

/** What an option changes against the reference option (positive = fewer than the reference). */
export interface Comparison {
  reference: string;
  infectionsAverted: number;
  deathsAverted: number;
  /** Null when the scenario has no hospital section. */
  admissionsAverted: number | null;
  /** Averted per 1,000 doses of this option's campaign; null without doses. */
  infectionsAvertedPer1000Doses: number | null;
  deathsAvertedPer1000Doses: number | null;
  admissionsAvertedPer1000Doses: number | null;
}

/** What one triggered phase did over the horizon (rule in src/engine/triggers.ts). */
export interface TriggerOutcome {
  /** Index of the phase in the option's `phases`. */
  phase: number;
  quantity: string;
  /** Times the measures came into force. */
  switchesOn: number;
  /** Day they first came into force, or null when they never did. */
  firstOnDay: number | null;
  /** Days (of 0..H-1) the measures were in force. */
  daysInForce: number;
  /** Stretches in force, [fromDay, toDay) within the horizon, for shading the curves. */
  periods: { fromDay: number; toDay: number }[];
}

/** R under one phase's measures (rByPhase.ts). */
export interface PhaseReproduction {
  fromDay: number;
  toDay: number;
  /** Day whose susceptibles `rAtPhaseStart` uses: fromDay, or the day a trigger first put the phase in force. */
  startDay: number;
  /** R with the phase's measures and the susceptibles on its start day. */
  rAtPhaseStart: number;
  /** R with the phase's measures and everyone susceptible. */
  rMeasuresOnly: number;
}

/** The cost side of an option's measures (measureBurden.ts). */
export interface MeasureBurden {
  /** Days (of 0..H-1) with any phase in force. */
  daysUnderMeasures: number;
  /** By setting name: usual contacts per person per day removed, summed over the horizon (contact-days per person). */
  contactDaysRemovedPerPerson: Record<string, number>;
  /** By setting name: the same as days of complete closure of that setting. */
  fullClosureDays: Record<string, number>;
}
