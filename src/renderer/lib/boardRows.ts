/**
 * The rows of the options board: what each shows, how it is formatted, and which way is
 * better (for shading by change against the reference option; null = not shaded).
 * Only formats and compares engine results; computes no model quantity: averted counts and
 * "per 1,000 doses" come from the engine's `comparison`, beds and doses from its outcomes.
 */
import type { BedDemand, OptionResults, ScenarioResults } from '../../engine/results.ts';
import {
  formatBedsAgainstCapacity,
  formatDoublingOrHalving,
  formatGrowthRate,
  formatPer1000Doses,
  formatPercent,
  formatPersons,
  formatR,
  formatSignedPercent,
  formatSignedPersons,
} from './format.ts';

export type RowGroup = 'spread' | 'hospital' | 'vaccination';

export const ROW_GROUP_TITLES: Record<RowGroup, string> = {
  spread: 'Spread and deaths',
  hospital: 'Hospital and ICU',
  vaccination: 'Vaccination',
};

/** Shown where an option has no such outcome (no campaign, no hospital section). */
export const NOT_APPLICABLE = '—';

export interface BoardRow {
  id: string;
  group: RowGroup;
  label: string;
  hint: string;
  /** The number shown (and put in data-value for tests); null when the option has no such outcome. */
  value(o: OptionResults): number | null;
  text(o: OptionResults, reference: OptionResults): string;
  detail?(o: OptionResults, reference: OptionResults): string;
  /** The number compared with the reference for shading, when not `value` (e.g. deaths for "deaths averted"). */
  shadeValue?(o: OptionResults): number | null;
  lowerIsBetter: boolean | null;
  /** Rows that are themselves a comparison are blank in the reference column. */
  comparison?: boolean;
  /** Beds rows: true when the option's demand exceeds capacity (the cell is marked instead of shaded). */
  overCapacity?(o: OptionResults): boolean;
}

const orNa = (v: number | null | undefined, format: (v: number) => string) => (v === null || v === undefined ? NOT_APPLICABLE : format(v));

/** Share of the reference's count that the option averts, for the detail line ("−23.4 % of reference"). */
function shareOfReference(averted: number | null | undefined, referenceCount: number | undefined): string {
  if (averted === null || averted === undefined || referenceCount === undefined || referenceCount === 0) return '';
  return `${formatSignedPercent(averted / referenceCount)} of reference`;
}

function bedsRow(id: string, label: string, hint: string, pick: (o: OptionResults) => BedDemand | undefined): BoardRow {
  return {
    id,
    group: 'hospital',
    label,
    hint,
    value: (o) => pick(o)?.peakOccupancy ?? null,
    text: (o) => orNa(pick(o)?.peakOccupancy, (v) => formatBedsAgainstCapacity(v, pick(o)!.capacityBeds)),
    detail: (o) => {
      const beds = pick(o);
      if (beds === undefined) return '';
      const surge = beds.surgeCapacityBeds === null ? '' : ` · surge ${formatPersons(beds.surgeCapacityBeds)}`;
      return `peak on day ${beds.peakDay}${surge}`;
    },
    lowerIsBetter: null,
    overCapacity: (o) => {
      const beds = pick(o);
      return beds !== undefined && beds.peakOccupancy > beds.capacityBeds;
    },
  };
}

export const BOARD_ROWS: BoardRow[] = [
  {
    id: 'rStart',
    group: 'spread',
    label: 'R at start',
    hint: 'Reproduction number on day 0 under the measures in force (next-generation matrix)',
    value: (o) => o.rStart,
    text: (o) => formatR(o.rStart),
    lowerIsBetter: true,
  },
  {
    id: 'growth',
    group: 'spread',
    label: 'Growth at start',
    hint: 'Exponential growth rate on day 0, per day; and the doubling or halving time',
    value: (o) => o.growthRatePerDay,
    text: (o) => formatGrowthRate(o.growthRatePerDay),
    detail: (o) => formatDoublingOrHalving(o.doublingTimeDays, o.halvingTimeDays),
    lowerIsBetter: true,
  },
  {
    id: 'peakDay',
    group: 'spread',
    label: 'Peak day',
    hint: 'Day on which the most people are infected (latent or infectious)',
    value: (o) => o.peakDay,
    text: (o) => `day ${o.peakDay}`,
    lowerIsBetter: null,
  },
  {
    id: 'peakPrevalence',
    group: 'spread',
    label: 'Peak prevalence',
    hint: 'Share of the population infected on the peak day (persons below)',
    value: (o) => o.peakPrevalence,
    text: (o) => formatPercent(o.peakPrevalence),
    detail: (o) => `${formatPersons(o.peakInfectedPersons)} persons`,
    lowerIsBetter: true,
  },
  {
    id: 'infections',
    group: 'spread',
    label: 'Infections',
    hint: 'Persons infected by the end of the horizon, including the initial infections',
    value: (o) => o.infections,
    text: (o) => formatPersons(o.infections),
    lowerIsBetter: true,
  },
  {
    id: 'attackRate',
    group: 'spread',
    label: 'Attack rate',
    hint: 'Infections divided by the population',
    value: (o) => o.attackRate,
    text: (o) => formatPercent(o.attackRate),
    lowerIsBetter: true,
  },
  {
    id: 'deaths',
    group: 'spread',
    label: 'Deaths',
    hint: 'Deaths eventually caused by the infections in the horizon (IFR by band)',
    value: (o) => o.deaths,
    text: (o) => formatPersons(o.deaths),
    lowerIsBetter: true,
  },
  {
    id: 'infectionsAverted',
    group: 'spread',
    label: 'Infections averted',
    hint: 'Reference option minus this option (positive = fewer infections)',
    value: (o) => o.comparison?.infectionsAverted ?? null,
    shadeValue: (o) => o.infections,
    text: (o) => orNa(o.comparison?.infectionsAverted, formatSignedPersons),
    detail: (o, ref) => shareOfReference(o.comparison?.infectionsAverted, ref.infections),
    lowerIsBetter: true,
    comparison: true,
  },
  {
    id: 'deathsAverted',
    group: 'spread',
    label: 'Deaths averted',
    hint: 'Reference option minus this option (positive = fewer deaths)',
    value: (o) => o.comparison?.deathsAverted ?? null,
    shadeValue: (o) => o.deaths,
    text: (o) => orNa(o.comparison?.deathsAverted, formatSignedPersons),
    detail: (o, ref) => shareOfReference(o.comparison?.deathsAverted, ref.deaths),
    lowerIsBetter: true,
    comparison: true,
  },
  {
    id: 'admissions',
    group: 'hospital',
    label: 'Hospital admissions',
    hint: 'Admissions to hospital (ward or ICU) within the horizon (infection-hospitalisation ratio by band)',
    value: (o) => o.healthcare?.admissions ?? null,
    text: (o) => orNa(o.healthcare?.admissions, formatPersons),
    detail: (o) => orNa(o.healthcare?.icuAdmissions, (v) => `${formatPersons(v)} need ICU`),
    lowerIsBetter: true,
  },
  bedsRow('peakWard', 'Peak ward occupancy', 'Most ward beds in use on one day, against ward capacity', (o) => o.healthcare?.ward),
  bedsRow('peakIcu', 'Peak ICU occupancy', 'Most ICU beds in use on one day, against ICU capacity', (o) => o.healthcare?.icu),
  {
    id: 'icuDaysOver',
    group: 'hospital',
    label: 'Days ICU over capacity',
    hint: 'Days on which ICU beds in use exceed ICU capacity; patient-days above capacity below',
    value: (o) => o.healthcare?.icu.daysOverCapacity ?? null,
    text: (o) => orNa(o.healthcare?.icu.daysOverCapacity, (v) => `${v} ${v === 1 ? 'day' : 'days'}`),
    detail: (o) => {
      const icu = o.healthcare?.icu;
      if (icu === undefined) return '';
      const surge = icu.daysOverSurgeCapacity === null ? '' : ` · ${icu.daysOverSurgeCapacity} ${icu.daysOverSurgeCapacity === 1 ? 'day' : 'days'} over surge`;
      return `${formatPersons(icu.patientDaysOverCapacity)} patient-days over${surge}`;
    },
    lowerIsBetter: true,
  },
  {
    id: 'admissionsAverted',
    group: 'hospital',
    label: 'Admissions averted',
    hint: 'Reference option minus this option (positive = fewer admissions)',
    value: (o) => o.comparison?.admissionsAverted ?? null,
    shadeValue: (o) => o.healthcare?.admissions ?? null,
    text: (o) => orNa(o.comparison?.admissionsAverted, formatSignedPersons),
    detail: (o, ref) => shareOfReference(o.comparison?.admissionsAverted, ref.healthcare?.admissions),
    lowerIsBetter: true,
    comparison: true,
  },
  {
    id: 'doses',
    group: 'vaccination',
    label: 'Doses given',
    hint: 'Vaccine doses given within the horizon under the option\'s campaign',
    value: (o) => o.vaccination?.doses ?? null,
    text: (o) => orNa(o.vaccination?.doses, formatPersons),
    detail: (o) => o.vaccination?.campaign ?? 'no campaign',
    lowerIsBetter: null,
  },
  {
    id: 'deathsAvertedPer1000',
    group: 'vaccination',
    label: 'Deaths averted per 1,000 doses',
    hint: 'Deaths averted against the reference option for every 1,000 doses this option gives',
    value: (o) => o.comparison?.deathsAvertedPer1000Doses ?? null,
    text: (o) => (o.comparison?.deathsAvertedPer1000Doses == null ? NOT_APPLICABLE : formatPer1000Doses(o.comparison.deathsAvertedPer1000Doses)),
    detail: (o) => (o.comparison?.infectionsAvertedPer1000Doses == null ? '' : `infections: ${o.comparison.infectionsAvertedPer1000Doses.toFixed(1)}`),
    lowerIsBetter: null,
    comparison: true,
  },
  {
    id: 'dosesToImmune',
    group: 'vaccination',
    label: 'Doses to already-immune people',
    hint: 'Share of doses given to people already infected or recovered (latent, infectious or recovered)',
    value: (o) => o.vaccination?.dosesToNonSusceptibleShare ?? null,
    text: (o) => orNa(o.vaccination?.dosesToNonSusceptibleShare, formatPercent),
    lowerIsBetter: null,
  },
];

/** The rows that apply to these results: hospital rows with a hospital section, vaccination rows when any option has a campaign. */
export function boardRowsFor(results: ScenarioResults | null): BoardRow[] {
  const hasHospital = results?.options.some((o) => o.healthcare !== null) ?? false;
  const hasVaccination = results?.options.some((o) => o.vaccination !== null) ?? false;
  return BOARD_ROWS.filter((r) => r.group === 'spread' || (r.group === 'hospital' && hasHospital) || (r.group === 'vaccination' && hasVaccination));
}
