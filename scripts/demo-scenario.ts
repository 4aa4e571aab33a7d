/**
 * Builds the bundled demo scenario (resources/demo-scenario.json): the fictional
 * Tessarine Valley region. `scripts/make-demo.ts` writes it; test/resources checks
 * that the file is exactly what this module builds.
 *
 * Everything about the population and the contacts is invented for demonstration.
 * Contact matrices are made reciprocal by construction: for each setting s we build a
 * symmetric matrix of total daily contacts between bands,
 *   W^s_ij = k^s(i, j) N_i N_j / N,   k^s symmetric,
 * and set C^s_ij = W^s_ij / N_i (contacts per person per day), so N_i C_ij = N_j C_ji.
 * k^s is then scaled so the population-mean contacts in the setting hit a target.
 */
import type { ScenarioInput } from '../src/engine/scenario.ts';

/** Lower bounds of the 16 five-year bands 0-4 ... 75+, years. */
const LOWER_AGES = [0, 5, 10, 15, 20, 25, 30, 35, 40, 45, 50, 55, 60, 65, 70, 75];

/** Band label: "0-4", ..., "70-74", "75+". */
export function bandLabel(i: number): string {
  const lower = LOWER_AGES[i];
  return i === LOWER_AGES.length - 1 ? `${lower}+` : `${lower}-${lower + 4}`;
}

/** Invented population pyramid of the Tessarine Valley, persons per band (0-4 ... 70-74). */
const POPULATION_UNDER_75 = [
  76_400, 81_900, 84_300, 86_800, 93_500, 101_200, 108_700, 110_400, 104_900, 99_300, 103_800, 101_600, 92_100,
  81_400, 69_800,
];

/** Invented split of the 75+ band into 75-79, 80-84, 85-89, 90+, persons (sums to the 75+ band). */
export const POPULATION_75_PLUS_SPLIT = [48_200, 33_900, 21_700, 11_600];

export const POPULATION = [...POPULATION_UNDER_75, POPULATION_75_PLUS_SPLIT.reduce((a, b) => a + b, 0)];

/**
 * IFR %, Brazeau et al. 2022, "Estimating the COVID-19 infection fatality ratio accounting
 * for seroreversion using statistical modelling", Commun Med 2:54, Table 2 (modelled IFR by
 * five-year band 0-4 ... 90+).
 */
export const BRAZEAU_2022_IFR_PERCENT = [
  0, 0.01, 0.01, 0.02, 0.03, 0.04, 0.07, 0.1, 0.16, 0.25, 0.4, 0.62, 0.96, 1.5, 2.34, 3.66, 5.71, 8.9, 17.36,
];

/**
 * IFR fraction for our 16 bands: Brazeau's values / 100 for 0-4 ... 70-74; for 75+ the mean of
 * the 75-79, 80-84, 85-89 and 90+ values weighted by the invented pyramid's persons in those bands.
 */
export function demoIfrFraction(): number[] {
  const under75 = BRAZEAU_2022_IFR_PERCENT.slice(0, 15).map((p) => p / 100);
  const old = BRAZEAU_2022_IFR_PERCENT.slice(15);
  const persons = POPULATION_75_PLUS_SPLIT.reduce((a, b) => a + b, 0);
  const weighted = old.reduce((sum, p, k) => sum + (p / 100) * POPULATION_75_PLUS_SPLIT[k], 0) / persons;
  // Round to 1e-7 so the file reads 0.0007, not 0.0007000000000000001.
  return [...under75, weighted].map((f) => Math.round(f * 1e7) / 1e7);
}

/** Gaussian bump in the age difference, used to shape the contact kernels. */
function bump(difference: number, centre: number, width: number): number {
  const z = (difference - centre) / width;
  return Math.exp(-0.5 * z * z);
}

/** Representative age of band i in years (75+ taken as 80). */
function midAge(i: number): number {
  return i === LOWER_AGES.length - 1 ? 80 : LOWER_AGES[i] + 2.5;
}

type Kernel = (i: number, j: number) => number;

/** Home: partners and siblings (same generation), parents and children (~25-35 years apart), grandparents (~55-65). */
const homeKernel: Kernel = (i, j) => {
  const d = Math.abs(midAge(i) - midAge(j));
  return 1.0 * bump(d, 0, 4) + 0.8 * bump(d, 30, 5) + 0.25 * bump(d, 60, 7);
};

const isPupil = (i: number): boolean => i >= 1 && i <= 3;
const isTeacherAge = (i: number): boolean => i >= 5 && i <= 12;

/** School: strong diagonal among pupils 5-19, weak spill to neighbouring years, nursery 0-4, teachers 25-64. */
const schoolKernel: Kernel = (i, j) => {
  if (isPupil(i) && isPupil(j)) return i === j ? 1 : 0.12;
  if (i === 0 && j === 0) return 0.45;
  if ((i === 0 && isPupil(j)) || (j === 0 && isPupil(i))) return 0.03;
  if ((isPupil(i) && isTeacherAge(j)) || (isPupil(j) && isTeacherAge(i))) return 0.035;
  if ((i === 0 && isTeacherAge(j)) || (j === 0 && isTeacherAge(i))) return 0.02;
  if (i === 4 && j === 4) return 0.15; // students in further education
  return 0;
};

/** Weight of band i in the workforce: 20-64 fully, some 15-19 and 65-69. */
function workShare(i: number): number {
  if (i >= 4 && i <= 12) return 1;
  if (i === 3 || i === 13) return 0.3;
  return 0;
}

/** Work: ages 20-64 (part of 15-19 and 65-69), mildly assortative by age. */
const workKernel: Kernel = (i, j) => {
  const d = Math.abs(midAge(i) - midAge(j));
  return workShare(i) * workShare(j) * (0.5 + bump(d, 0, 12));
};

/** Other (shops, transport, leisure): broad mixing with mild assortativity; fewer among the oldest. */
const otherKernel: Kernel = (i, j) => {
  const d = Math.abs(midAge(i) - midAge(j));
  const activity = (k: number): number => (k >= 14 ? 0.7 : 1);
  return activity(i) * activity(j) * (0.6 + bump(d, 0, 8));
};

/**
 * Population-mean contacts per person per day in each setting (invented targets). They sum to
 * 12.5 a day, near the ~13 a day that European contact diaries reported (Mossong et al. 2008,
 * Social contacts and mixing patterns relevant to the spread of infectious diseases, PLoS Med
 * 5:e74; from memory).
 */
const MEAN_CONTACTS: Record<string, number> = { home: 3.4, school: 2.2, work: 2.8, other: 4.1 };

/** C^s_ij = W^s_ij / N_i with W^s_ij = c k(i,j) N_i N_j / N, c scaled to the target mean. */
export function reciprocalMatrix(kernel: Kernel, population: number[], meanContacts: number): number[][] {
  const n = population.length;
  const total = population.reduce((a, b) => a + b, 0);
  const w: number[][] = [];
  let sum = 0;
  for (let i = 0; i < n; i++) {
    w.push([]);
    for (let j = 0; j < n; j++) {
      // Build from the (min, max) pair so W is symmetric bit for bit.
      const a = Math.min(i, j);
      const b = Math.max(i, j);
      const value = (kernel(a, b) * population[a] * population[b]) / total;
      w[i].push(value);
      sum += value;
    }
  }
  const scale = (meanContacts * total) / sum;
  return w.map((row, i) => row.map((value) => (scale * value) / population[i]));
}

/** Initial infections: 20 latent infections among adults 20-44 (4 per band). */
function initialInfections(): number[] {
  return LOWER_AGES.map((lower) => (lower >= 20 && lower <= 40 ? 4 : 0));
}

const HORIZON_DAYS = 365;
const BANDS_70_PLUS = [14, 15];

export function buildDemoScenario(): ScenarioInput {
  const kernels: Record<string, Kernel> = { home: homeKernel, school: schoolKernel, work: workKernel, other: otherKernel };
  return {
    format: 'mixwise-scenario',
    version: 1,
    title: 'Tessarine Valley (fictional): options for the coming wave',
    notes:
      'Tessarine Valley is a fictional region. Its population and all contact matrices are invented for demonstration ' +
      '(built by scripts/make-demo.ts from a symmetric matrix of total contacts, so they are exactly reciprocal; ' +
      'about 12.5 contacts per person per day in all). Disease values are illustrative. ' +
      'Scenario projections under stated assumptions, not forecasts.',
    ageBands: LOWER_AGES.map((lowerAgeYears, i) => ({ label: bandLabel(i), lowerAgeYears })),
    populationPersons: POPULATION,
    settings: Object.entries(kernels).map(([name, kernel]) => ({
      name,
      contactsPerDay: reciprocalMatrix(kernel, POPULATION, MEAN_CONTACTS[name]),
    })),
    disease: {
      transmission: { kind: 'r0', r0: 2.5 },
      latentPeriodDays: 3,
      infectiousPeriodDays: 5,
      source: 'Illustrative values for demonstration (R0 2.5, latent 3 days, infectious 5 days), not fitted to any outbreak.',
    },
    severity: {
      infectionFatalityRatio: demoIfrFraction(),
      source:
        'Brazeau NF et al. 2022, Estimating the COVID-19 infection fatality ratio accounting for seroreversion using ' +
        'statistical modelling, Commun Med 2:54, Table 2 (IFR % by five-year band, divided by 100). 75+: mean of the ' +
        '75-79, 80-84, 85-89 and 90+ values weighted by the demo population in those bands ' +
        `(${POPULATION_75_PLUS_SPLIT.join(', ')} persons).`,
    },
    initialState: { infectedPersons: initialInfections(), infectedCompartment: 'latent' },
    horizonDays: HORIZON_DAYS,
    referenceOption: 'No measures',
    options: [
      { name: 'No measures', description: 'Contacts as usual throughout.', phases: [] },
      {
        name: 'Schools closed 8 weeks',
        description: 'Schools shut on days 21 to 76 (eight weeks); children at home raise home contacts by a fifth.',
        phases: [{ fromDay: 21, toDay: 77, settingMultipliers: { school: 0, home: 1.2 } }],
      },
      {
        name: 'Work contacts halved',
        description: 'Home working and distancing halve contacts at work for the whole horizon.',
        phases: [{ fromDay: 0, toDay: HORIZON_DAYS, settingMultipliers: { work: 0.5 } }],
      },
      {
        name: 'Shield 70+',
        description: 'People aged 70 and over keep a quarter of their usual work and other contacts for the whole horizon.',
        phases: [
          {
            fromDay: 0,
            toDay: HORIZON_DAYS,
            ageFactors: [
              { setting: 'work', bands: BANDS_70_PLUS, factor: 0.25 },
              { setting: 'other', bands: BANDS_70_PLUS, factor: 0.25 },
            ],
          },
        ],
      },
      {
        name: 'Vaccinate oldest first',
        description: 'From day 30, 6,000 doses a day (12,000 from day 90), oldest band first; no contact measures.',
        phases: [],
        vaccinationCampaign: 'Autumn campaign',
      },
    ],
    vaccinationCampaigns: [
      {
        name: 'Autumn campaign',
        schedule: [{ fromDay: 30, dosesPerDay: 6000 }, { fromDay: 90, dosesPerDay: 12000 }],
        uptakeCeiling: LOWER_AGES.map((lower) => (lower < 15 ? 0 : lower < 60 ? 0.7 : 0.85)),
        delayToProtectionDays: 14,
        efficacyAgainstInfection: 0.5,
        efficacyAgainstDeath: 0.85,
        efficacyAgainstAdmission: 0.8,
        protection: 'leaky',
        priority: [[15], [14], [13], [12], [11], [10], [9], [8], [7], [6], [5], [4], [3]],
        source: 'Supply, uptake and efficacy are illustrative values for demonstration, not estimates for any vaccine.',
      },
    ],
    healthcare: {
      capacity: { wardBeds: 3200, icuBeds: 110, wardSurgeBeds: 3800, icuSurgeBeds: 200 },
      source:
        'Bed numbers are invented for the fictional region. Hospitalisation ratios, ICU shares, delays and stays are ' +
        'the program defaults (src/engine/healthcare/defaults.ts: Ferguson et al. 2020, Imperial College Report 9, ' +
        'Table 1, per symptomatic case x 0.8 symptomatic share from Buitrago-Garcia et al. 2020, PLoS Med 17:e1003346).',
    },
  };
}

/**
 * JSON with two-space indent, but arrays of numbers (population, matrix rows) and small flat
 * objects (age bands) kept on one line.
 */
function toJsonText(value: unknown, indent = ''): string {
  const flat = JSON.stringify(value);
  const isFlatObject =
    value !== null && typeof value === 'object' && !Array.isArray(value) && Object.values(value).every((v) => typeof v !== 'object');
  if (isFlatObject && flat.length <= 60) return flat.replace(/,"/g, ', "').replace(/":/g, '": ');
  if (Array.isArray(value)) {
    if (value.every((v) => typeof v === 'number')) return `[${value.map((v) => JSON.stringify(v)).join(', ')}]`;
    if (value.length === 0) return '[]';
    const inner = `${indent}  `;
    return `[\n${value.map((v) => inner + toJsonText(v, inner)).join(',\n')}\n${indent}]`;
  }
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value).filter(([, v]) => v !== undefined);
    if (entries.length === 0) return '{}';
    const inner = `${indent}  `;
    const lines = entries.map(([k, v]) => `${inner}${JSON.stringify(k)}: ${toJsonText(v, inner)}`);
    return `{\n${lines.join(',\n')}\n${indent}}`;
  }
  return JSON.stringify(value);
}

/** The file text of resources/demo-scenario.json, with a final newline. */
export function demoScenarioText(): string {
  return `${toJsonText(buildDemoScenario())}\n`;
}
