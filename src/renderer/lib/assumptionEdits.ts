/**
 * Pure helpers of the Assumptions view: by-band lists that may be absent from the file
 * (relative susceptibility u, relative infectiousness h, prior immunity, hospital ratios),
 * a hospital section with the program defaults, and the read-only campaign summary.
 * Each edit helper returns new values and leaves its input untouched; the view commits the
 * resulting scenario through the workspace (validated, one undo step).
 */
import { DEFAULT_ADMISSION_DELAY, DEFAULT_ICU_PATIENT_WARD_STAY, DEFAULT_ICU_STAY, DEFAULT_WARD_STAY, defaultIcuShareOfAdmissions, defaultInfectionHospitalisationRatio, type Campaign, type Delay, type Healthcare, type Scenario } from '../../engine/index.ts';
import { HOSPITAL_DEFAULT_SOURCE } from '../../report/assumptions.ts';
import { screen } from '../../report/numberFormat.ts';
import { groupLabel } from './priorityOrder.ts';

/**
 * A by-band list with entry `index` set to `value`. An absent list stands for `fill` in every
 * band (u = h = 1, no prior immunity), so the others keep that meaning when it is written out.
 */
export function withBandValue(values: readonly number[] | undefined, bands: number, index: number, value: number, fill: number): number[] {
  const next = values === undefined ? new Array<number>(bands).fill(fill) : [...values];
  next[index] = value;
  return next;
}

/** Band `index` of a list that may be absent (absent = `fill` everywhere). */
export function bandValue(values: readonly number[] | undefined, index: number, fill: number): number {
  return values?.[index] ?? fill;
}

export type HospitalRatio = 'infectionHospitalisationRatio' | 'icuShareOfAdmissions';

export const HOSPITAL_RATIO_LABELS: Record<HospitalRatio, string> = {
  infectionHospitalisationRatio: 'Infection-hospitalisation ratio',
  icuShareOfAdmissions: 'ICU share of admissions',
};

/** The ratio by band as the engine uses it: the file's values, or the program defaults when left out. */
export function hospitalRatio(scenario: Scenario, field: HospitalRatio): { values: number[]; isDefault: boolean } {
  const given = scenario.healthcare?.[field];
  if (given !== undefined) return { values: [...given], isDefault: false };
  const values = field === 'infectionHospitalisationRatio' ? defaultInfectionHospitalisationRatio(scenario) : defaultIcuShareOfAdmissions(scenario);
  return { values, isDefault: true };
}

/** The ratio with band `index` set to `value`; the other bands keep what the engine used (defaults if left out). */
export function withHospitalRatio(scenario: Scenario, field: HospitalRatio, index: number, value: number): number[] {
  const { values } = hospitalRatio(scenario, field);
  values[index] = value;
  return values;
}

/** Source line of the hospital ratios when they are the program defaults. */
export const HOSPITAL_RATIO_DEFAULT_SOURCE = HOSPITAL_DEFAULT_SOURCE;

/**
 * A hospital section with the program defaults: ratios left out (so the cited defaults apply),
 * delays and stays as in src/engine/healthcare/defaults.ts. Bed numbers have no program default:
 * they start at 0 and the source says to enter the region's own.
 */
export function defaultHealthcare(): Healthcare & Required<Pick<Healthcare, 'admissionDelay' | 'wardStay' | 'icuStay'>> {
  return {
    admissionDelay: { ...DEFAULT_ADMISSION_DELAY },
    wardStay: { ...DEFAULT_WARD_STAY },
    icuStay: { ...DEFAULT_ICU_STAY },
    icuPatientWardStay: { ...DEFAULT_ICU_PATIENT_WARD_STAY },
    capacity: { wardBeds: 0, icuBeds: 0 },
    source:
      'Hospitalisation ratios, ICU shares, delays and stays: program defaults (src/engine/healthcare/defaults.ts). Bed numbers: not entered yet; enter the region\'s own.',
  };
}

/**
 * The four delays of the hospital section, in the order the view lists them. A delay the file
 * gives band by band (`byBand`) has no common value: the view says so instead of offering one.
 */
export const HOSPITAL_DELAYS: readonly {
  key: 'admissionDelay' | 'wardStay' | 'icuStay' | 'icuPatientWardStay';
  byBand: 'admissionDelayByBand' | 'wardStayByBand' | 'icuStayByBand' | null;
  label: string;
  fallback: Delay;
}[] = [
  { key: 'admissionDelay', byBand: 'admissionDelayByBand', label: 'Infection to admission', fallback: DEFAULT_ADMISSION_DELAY },
  { key: 'wardStay', byBand: 'wardStayByBand', label: 'Ward stay (no ICU)', fallback: DEFAULT_WARD_STAY },
  { key: 'icuStay', byBand: 'icuStayByBand', label: 'ICU stay', fallback: DEFAULT_ICU_STAY },
  { key: 'icuPatientWardStay', byBand: null, label: 'Ward days of ICU patients', fallback: DEFAULT_ICU_PATIENT_WARD_STAY },
];

/** True when a delay equals its program default. */
export function isDefaultDelay(delay: Delay, fallback: Delay): boolean {
  return delay.meanDays === fallback.meanDays && delay.shape === fallback.shape;
}

export interface CampaignSummary {
  name: string;
  /** "6,000 per day from day 30; 12,000 per day from day 90" */
  schedule: string;
  /** "infection 50.0 %, admission 80.0 %, death 85.0 %" (admission: the death efficacy when left out) */
  efficacies: string;
  protection: string;
  delayDays: number;
  /** Priority groups in order, first to last: "75+ → 70-74 → 60-64, 65-69" */
  order: string;
  /** Options that run this campaign. */
  options: string[];
}

/** One campaign in plain words for the read-only table. */
export function campaignSummary(scenario: Scenario, campaign: Campaign): CampaignSummary {
  const labels = scenario.ageBands.map((b) => b.label);
  const steps = [...campaign.schedule].sort((a, b) => a.fromDay - b.fromDay);
  const admission = campaign.efficacyAgainstAdmission ?? campaign.efficacyAgainstDeath;
  return {
    name: campaign.name,
    schedule: steps.map((s) => `${screen.persons(s.dosesPerDay)} per day from day ${s.fromDay}`).join('; '),
    efficacies:
      `infection ${screen.percent(campaign.efficacyAgainstInfection)}, admission ${screen.percent(admission)}` +
      `${campaign.efficacyAgainstAdmission === undefined ? ' (as death)' : ''}, death ${screen.percent(campaign.efficacyAgainstDeath)}`,
    protection: campaign.protection === 'leaky' ? 'leaky' : 'all-or-nothing',
    delayDays: campaign.delayToProtectionDays,
    order: campaign.priority.map((group) => groupLabel(group, labels)).join(' → '),
    options: scenario.options.filter((o) => o.vaccinationCampaign === campaign.name).map((o) => o.name),
  };
}
