/**
 * The assumptions table: every input parameter of the scenario with its value, unit and source,
 * plus the by-band inputs as one table. Values are the validated scenario's (defaults filled in);
 * hospital ratios left out of the file are the program defaults, named as such with their source.
 * The only figures derived here are summaries of inputs (totals, mean contacts per person).
 */
import { DEFAULT_ADMISSION_DELAY, DEFAULT_ICU_PATIENT_WARD_STAY, DEFAULT_ICU_STAY, DEFAULT_WARD_STAY, commonDelays, defaultIcuShareOfAdmissions, defaultInfectionHospitalisationRatio, type ScenarioResults, type Delay, type Scenario } from '../engine/index.ts';
import { fitRecordRows } from './fitRecord.ts';
import { print } from './numberFormat.ts';
import type { BandTable, ParameterRow } from './reportTypes.ts';

const FROM_FILE = 'Scenario file';
export const HOSPITAL_DEFAULT_SOURCE =
  'Program default: Ferguson et al. 2020, Imperial College COVID-19 Response Team Report 9, Table 1 (per symptomatic case x 0.8 symptomatic share, Buitrago-Garcia et al. 2020, PLoS Med 17:e1003346)';
export const DELAY_DEFAULT_SOURCE = 'Program default (src/engine/healthcare/defaults.ts: Ferguson et al. 2020 Report 9; Rees et al. 2020, BMC Med 18:270; Lauer et al. 2020, Ann Intern Med 172:577)';

const orFile = (source: string): string => (source.trim() === '' ? FROM_FILE : source);
const sameDelay = (a: Delay, b: Delay): boolean => a.meanDays === b.meanDays && a.shape === b.shape;
const delayText = (d: Delay): string => `mean ${print.decimal(d.meanDays, 1)}, gamma shape ${print.decimal(d.shape, 1)}`;
/** A delay given band by band: the range of its means. */
function byBandDelayText(delays: readonly Delay[]): string {
  const means = delays.map((d) => d.meanDays);
  return `band by band: mean ${print.decimal(Math.min(...means), 1)} to ${print.decimal(Math.max(...means), 1)}`;
}

/** Population-weighted mean contacts per person per day in one setting: sum_i N_i sum_j C_ij / sum_i N_i. */
function meanContactsPerPerson(matrix: number[][], population: number[]): number {
  let weighted = 0;
  let total = 0;
  matrix.forEach((row, i) => {
    weighted += population[i] * row.reduce((a, b) => a + b, 0);
    total += population[i];
  });
  return total > 0 ? weighted / total : 0;
}

export function parameterRows(scenario: Scenario, results: ScenarioResults): ParameterRow[] {
  const d = scenario.disease;
  const diseaseSource = orFile(d.source);
  const rows: ParameterRow[] = [];
  const add = (parameter: string, value: string, unit: string, source: string) => rows.push({ parameter, value, unit, source });
  const populationTotal = scenario.populationPersons.reduce((a, b) => a + b, 0);

  add('Age bands', `${scenario.ageBands.length} (${scenario.ageBands[0].label} ... ${scenario.ageBands[scenario.ageBands.length - 1].label})`, 'bands', FROM_FILE);
  add('Population', print.persons(populationTotal), 'persons', `${FROM_FILE} (by band below)`);
  add('Horizon', String(scenario.horizonDays), 'days', FROM_FILE);
  if (d.transmission.kind === 'r0') add('Basic reproduction number R0 (target)', print.decimal(d.transmission.r0, 2), 'per case', diseaseSource);
  else add('Doubling time before measures (target)', print.decimal(d.transmission.doublingTimeDays, 2), 'days', diseaseSource);
  rows.push(...fitRecordRows(scenario));
  add('R0 from the next-generation matrix', print.decimal(results.r0, 3), 'per case', 'Computed by Mixwise (dominant eigenvalue, all susceptible, no measures)');
  add('Transmission rate beta', results.beta.toPrecision(4), 'per contact', 'Calibrated by Mixwise to the target above');
  add('Latent period (mean)', print.decimal(d.latentPeriodDays, 2), 'days', diseaseSource);
  add('Infectious period D (mean)', print.decimal(d.infectiousPeriodDays, 2), 'days', diseaseSource);
  add('Latent / infectious stages (Erlang)', `${d.latentStages} / ${d.infectiousStages}`, 'stages', diseaseSource);
  add('Relative susceptibility u', d.relativeSusceptibility === undefined ? '1 in every band' : 'by band, below', 'ratio', d.relativeSusceptibility === undefined ? 'Program default' : diseaseSource);
  add('Relative infectiousness h', d.relativeInfectiousness === undefined ? '1 in every band' : 'by band, below', 'ratio', d.relativeInfectiousness === undefined ? 'Program default' : diseaseSource);
  add('Infection fatality ratio (IFR)', 'by band, below', 'fraction of infections', scenario.severity.source);
  add('Infection-to-death delay', delayText(scenario.severity.deathDelay), 'days', `${FROM_FILE}, or program default (mean 21, shape 4) when left out`);
  for (const setting of scenario.settings) {
    add(`Contacts in setting "${setting.name}"`, print.decimal(meanContactsPerPerson(setting.contactsPerDay, scenario.populationPersons), 2), 'per person per day', `${FROM_FILE} (contact matrix)`);
  }
  add(
    'Reciprocity imbalance (largest, by setting)',
    results.reciprocity.map((c) => `${c.setting} ${print.percent(c.largestRelativeImbalance, 1)}`).join(', '),
    '|N_i C_ij - N_j C_ji| / max',
    'Computed by Mixwise from the file',
  );
  const initial = scenario.initialState;
  add('Infected on day 0', print.decimal(initial.infectedPersons.reduce((a, b) => a + b, 0), 1), `persons (${initial.infectedCompartment})`, FROM_FILE);
  add('Prior immunity', initial.priorImmunityFraction === undefined ? 'none' : 'by band, below', 'fraction of band', FROM_FILE);
  add('Reference option', scenario.options[results.referenceIndex]?.name ?? '', '', FROM_FILE);

  for (const campaign of scenario.vaccinationCampaigns) {
    const source = orFile(campaign.source);
    const name = `Campaign "${campaign.name}"`;
    const supply = [...campaign.schedule].sort((a, b) => a.fromDay - b.fromDay).map((step) => `${print.persons(step.dosesPerDay)} from day ${step.fromDay}`);
    add(`${name}: doses per day`, supply.join('; '), 'doses per day', source);
    add(`${name}: priority order`, campaign.priority.map((group) => group.map((b) => scenario.ageBands[b]?.label ?? `band ${b}`).join(' + ')).join(', '), 'age bands', source);
    add(`${name}: uptake ceiling`, 'by band, below', 'fraction of band', source);
    add(`${name}: efficacy against infection`, print.percent(campaign.efficacyAgainstInfection, 0), `fraction (${campaign.protection === 'leaky' ? 'leaky' : 'all-or-nothing'})`, source);
    add(`${name}: efficacy against admission`, print.percent(campaign.efficacyAgainstAdmission ?? campaign.efficacyAgainstDeath, 0), 'fraction', campaign.efficacyAgainstAdmission === undefined ? 'Program default: the efficacy against death' : source);
    add(`${name}: efficacy against death`, print.percent(campaign.efficacyAgainstDeath, 0), 'fraction', source);
    add(`${name}: delay to protection`, print.decimal(campaign.delayToProtectionDays, 1), 'days (mean, exponential)', source);
  }

  const h = scenario.healthcare;
  if (h !== undefined) {
    const hospitalSource = orFile(h.source);
    add('Infection-hospitalisation ratio (IHR)', 'by band, below', 'fraction of infections', h.infectionHospitalisationRatio === undefined ? HOSPITAL_DEFAULT_SOURCE : hospitalSource);
    add('ICU share of admissions', 'by band, below', 'fraction of admissions', h.icuShareOfAdmissions === undefined ? HOSPITAL_DEFAULT_SOURCE : hospitalSource);
    const common = commonDelays(h);
    const delays: [string, Delay, Delay, readonly Delay[] | undefined][] = [
      ['Infection to hospital admission', common.admissionDelay, DEFAULT_ADMISSION_DELAY, h.admissionDelayByBand],
      ['Ward stay (patients not needing ICU)', common.wardStay, DEFAULT_WARD_STAY, h.wardStayByBand],
      ['ICU stay', common.icuStay, DEFAULT_ICU_STAY, h.icuStayByBand],
      ['Ward days of ICU patients outside ICU', h.icuPatientWardStay, DEFAULT_ICU_PATIENT_WARD_STAY, undefined],
    ];
    for (const [name, delay, fallback, byBand] of delays) {
      if (byBand !== undefined) add(name, byBandDelayText(byBand), 'days', hospitalSource);
      else add(name, delayText(delay), 'days', sameDelay(delay, fallback) ? DELAY_DEFAULT_SOURCE : hospitalSource);
    }
    const surge = (n: number | undefined) => (n === undefined ? '' : `; ${print.persons(n)} at full surge`);
    add('Ward beds', `${print.persons(h.capacity.wardBeds)}${surge(h.capacity.wardSurgeBeds)}`, 'beds', hospitalSource);
    add('ICU beds', `${print.persons(h.capacity.icuBeds)}${surge(h.capacity.icuSurgeBeds)}`, 'beds', hospitalSource);
  }
  return rows;
}

/** Inputs by age band, one row per band; percentages for fractions. */
export function bandTable(scenario: Scenario): BandTable {
  const d = scenario.disease;
  const h = scenario.healthcare;
  const ihr = h === undefined ? null : (h.infectionHospitalisationRatio ?? defaultInfectionHospitalisationRatio(scenario));
  const icu = h === undefined ? null : (h.icuShareOfAdmissions ?? defaultIcuShareOfAdmissions(scenario));
  // Soft hyphens (U+00AD) let the long words break, so the table fits a portrait page.
  const header = ['Age band', 'Population, persons', 'IFR, %', 'Rel. suscep\u00adtibility u', 'Rel. infec\u00adtious\u00adness h', 'Infected on day 0', 'Prior immunity, %'];
  if (ihr !== null) header.push('IHR, %', 'ICU share of admissions, %');
  for (const campaign of scenario.vaccinationCampaigns) header.push(`Uptake ceiling, % (${campaign.name})`);
  const rows = scenario.ageBands.map((band, i) => {
    const row = [
      band.label,
      print.persons(scenario.populationPersons[i]),
      print.percent(scenario.severity.infectionFatalityRatio[i], 3),
      print.decimal(d.relativeSusceptibility?.[i] ?? 1, 2),
      print.decimal(d.relativeInfectiousness?.[i] ?? 1, 2),
      print.decimal(scenario.initialState.infectedPersons[i], 1),
      print.percent(scenario.initialState.priorImmunityFraction?.[i] ?? 0, 1),
    ];
    if (ihr !== null && icu !== null) row.push(print.percent(ihr[i], 2), print.percent(icu[i], 1));
    for (const campaign of scenario.vaccinationCampaigns) row.push(print.percent(campaign.uptakeCeiling[i] ?? 0, 0));
    return row;
  });
  return { header, rows };
}
