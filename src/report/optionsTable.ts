/**
 * The policy options table as printed: one row per outcome, one column per option. Every cell is
 * a number the engine returned (`ScenarioResults`), formatted; the one derived row, deaths
 * averted, is the reference option's deaths minus the option's deaths (persons; negative = more
 * deaths than under the reference). Hospital and ICU rows appear when the scenario has a
 * `healthcare` section.
 */
import type { HealthcareOutcomes, OptionResults, ScenarioResults } from '../engine/results.ts';
import { formatDecimal, formatDoubling, formatGrowthRate, formatPercent, formatPersons, formatR, formatSignedPersons } from './numbers.ts';

export interface OutcomeRow {
  /** Stable key (used by tests and CSV). */
  key: string;
  /** What the row shows, in plain words with its unit. */
  label: string;
  /** One formatted cell per option, in the results' order. */
  cells: string[];
}

export interface OptionsTable {
  optionNames: string[];
  referenceIndex: number;
  rows: OutcomeRow[];
  /** Notes printed under the table (capacities, conventions). */
  notes: string[];
}

type Cell = (o: OptionResults, reference: OptionResults) => string;

const dayOrNone = (day: number | null): string => (day === null ? 'never' : String(day));

const EPIDEMIC_ROWS: [string, string, Cell][] = [
  ['rStart', 'R at start (day 0)', (o) => formatR(o.rStart)],
  ['growthRate', 'Growth rate at start, per day', (o) => formatGrowthRate(o.growthRatePerDay)],
  ['doublingTime', 'Doubling time at start, days', (o) => formatDoubling(o.doublingTimeDays, o.halvingTimeDays)],
  ['peakDay', 'Peak day (most infected)', (o) => String(o.peakDay)],
  ['peakPrevalence', 'Peak prevalence, % infected', (o) => formatPercent(o.peakPrevalence)],
  ['infections', 'Infections, persons', (o) => formatPersons(o.infections)],
  ['attackRate', 'Attack rate, % of population', (o) => formatPercent(o.attackRate)],
  ['deaths', 'Deaths, persons', (o) => formatPersons(o.deaths)],
  ['deathsAverted', 'Deaths averted vs reference', (o, ref) => (o === ref ? 'reference' : formatSignedPersons(o.comparison?.deathsAverted ?? ref.deaths - o.deaths))],
];

const VACCINATION_ROWS: [string, string, Cell][] = [
  ['doses', 'Vaccine doses given', (o) => (o.vaccination === null ? 'none' : formatPersons(o.vaccination.doses))],
  ['deathsAvertedPer1000Doses', 'Deaths averted per 1,000 doses', (o) => {
    const perDoses = o.comparison?.deathsAvertedPer1000Doses ?? null;
    return perDoses === null ? 'n/a' : formatDecimal(perDoses, 2);
  }],
];

const FINAL_SIZE_ROW: [string, string, Cell] = [
  'finalSizeAttackRate',
  'Final-size attack rate (check)',
  (o) => (o.finalSize === null ? 'n/a' : formatPercent(o.finalSize.attackRate)),
];

type HospitalCell = (h: HealthcareOutcomes) => string;

const HOSPITAL_ROWS: [string, string, HospitalCell][] = [
  ['admissions', 'Hospital admissions, persons', (h) => formatPersons(h.admissions)],
  ['icuAdmissions', 'ICU admissions, persons', (h) => formatPersons(h.icuAdmissions)],
  ['peakWardOccupancy', 'Peak ward beds in use', (h) => formatPersons(h.ward.peakOccupancy)],
  ['wardDaysOverCapacity', 'Days ward over capacity', (h) => String(h.ward.daysOverCapacity)],
  ['peakIcuOccupancy', 'Peak ICU beds in use', (h) => formatPersons(h.icu.peakOccupancy)],
  ['peakIcuDay', 'Peak ICU day', (h) => String(h.icu.peakDay)],
  ['icuDaysOverCapacity', 'Days ICU over capacity', (h) => String(h.icu.daysOverCapacity)],
  ['icuFirstDayOverCapacity', 'First day ICU over capacity', (h) => dayOrNone(h.icu.firstDayOverCapacity)],
];

const ICU_SURGE_ROW: [string, string, HospitalCell] = [
  'icuDaysOverSurgeCapacity',
  'Days ICU over surge capacity',
  (h) => (h.icu.daysOverSurgeCapacity === null ? 'n/a' : String(h.icu.daysOverSurgeCapacity)),
];

/** A hospital cell as a table cell; "n/a" for an option without hospital results. */
function hospitalCell(cell: HospitalCell): Cell {
  return (o) => (o.healthcare === null ? 'n/a' : cell(o.healthcare));
}

function capacityNote(results: ScenarioResults): string | null {
  const h = results.options.find((o) => o.healthcare !== null)?.healthcare ?? null;
  if (h === null) return null;
  const surge = (n: number | null) => (n === null ? '' : `, ${formatPersons(n)} at full surge`);
  return (
    `Bed capacity: ward ${formatPersons(h.ward.capacityBeds)}${surge(h.ward.surgeCapacityBeds)}; ` +
    `ICU ${formatPersons(h.icu.capacityBeds)}${surge(h.icu.surgeCapacityBeds)}. Beds in use: mean over the day. Admissions: those within the horizon.`
  );
}

export function optionsTable(results: ScenarioResults): OptionsTable {
  const reference = results.options[results.referenceIndex];
  const definitions = [...EPIDEMIC_ROWS];
  if (results.options.some((o) => o.finalSize !== null)) definitions.push(FINAL_SIZE_ROW);
  if (results.options.some((o) => o.vaccination !== null)) definitions.push(...VACCINATION_ROWS);
  const hospital = results.options.find((o) => o.healthcare !== null)?.healthcare ?? null;
  if (hospital !== null) {
    const rows = hospital.icu.surgeCapacityBeds === null ? HOSPITAL_ROWS : [...HOSPITAL_ROWS, ICU_SURGE_ROW];
    for (const [key, label, cell] of rows) definitions.push([key, label, hospitalCell(cell)]);
  }
  const notes = [
    `Reference option: ${reference.name}. R0 without measures: ${formatDecimal(results.r0, 2)}. Day 0 is the scenario's first day.`,
    'R, growth rate and doubling time are those of day 0, with the measures in force on day 0. Peak prevalence: share of the population infected (latent or infectious) on the peak day. Infections and attack rate: by the end of the horizon.',
    'Deaths count every death eventually caused by the infections within the horizon; deaths averted = deaths under the reference minus deaths under the option (negative: more deaths than under the reference).',
  ];
  if (definitions.includes(VACCINATION_ROWS[0])) {
    notes.push('Vaccine doses: doses given within the horizon (one dose per person). Deaths averted per 1,000 doses: deaths averted against the reference for every 1,000 doses of the option\'s campaign (n/a without doses).');
  }
  if (definitions.includes(FINAL_SIZE_ROW)) {
    notes.push('Final-size attack rate: the multi-group final-size relation (Ma & Earn 2006) solved as a cross-check of the simulated attack rate, for options whose measures never change (n/a for the others).');
  }
  const capacity = capacityNote(results);
  if (capacity !== null) notes.push(capacity);
  return {
    optionNames: results.options.map((o) => o.name),
    referenceIndex: results.referenceIndex,
    rows: definitions.map(([key, label, cell]) => ({ key, label, cells: results.options.map((o) => cell(o, reference)) })),
    notes,
  };
}

/** Splits option indices into groups of at most `perGroup` columns (a wide table prints as several). */
export function columnGroups(optionCount: number, perGroup: number): number[][] {
  const size = Math.max(1, Math.floor(perGroup));
  const groups: number[][] = [];
  for (let start = 0; start < optionCount; start += size) {
    groups.push(Array.from({ length: Math.min(size, optionCount - start) }, (_, k) => start + k));
  }
  return groups;
}
