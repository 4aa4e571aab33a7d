/**
 * A draw's parameter values applied to a scenario: a new scenario, the original untouched.
 *
 * - r0, doublingTimeDays, latentPeriodDays, infectiousPeriodDays: replace the value (days or R).
 * - ifrScale: IFR_i -> s IFR_i for every band.
 * - hospitalisationScale, icuShareScale: the same for the infection-hospitalisation ratio and the
 *   ICU share of admissions (their defaults when the file gives none).
 * - wardStayScale, icuStayScale: mean length of stay in a ward (patients never needing ICU) or in
 *   ICU -> s x mean: the by-band values when the file gives them, else the common value (or its default).
 * - contactScale.<setting>: that setting's contact matrix -> s C^s.
 * - measureAdherence a (the share of every measure's reduction achieved): in every phase of every
 *   option, setting multipliers and age factors m -> 1 - a (1 - m), case isolation c -> a c.
 * - vaccineEfficacyScale: every campaign's efficacies (infection, death, admission) -> s x efficacy.
 * - initialInfectedScale: initial infections by band -> s x infections.
 * A value that breaks a rule of the format (e.g. an IFR above 1) is caught by validating the
 * result (see `drawOutcomes.ts`): the draw fails with that rule, it is not clipped.
 */
import { commonDelays, defaultIcuShareOfAdmissions, defaultInfectionHospitalisationRatio } from '../healthcare/defaults.ts';
import type { Delay, Healthcare, Scenario } from '../scenario.ts';
import type { ScenarioSection } from '../validation.ts';
import { CONTACT_SCALE_PREFIX } from './schema.ts';

const scaled = (values: readonly number[], s: number): number[] => values.map((x) => x * s);
const scaledDelay = (d: Delay, s: number): Delay => ({ ...d, meanDays: d.meanDays * s });
const adhered = (m: number, a: number): number => 1 - a * (1 - m);

function withHealthcare(s: Scenario, change: (h: Healthcare) => Partial<Healthcare>): Scenario {
  return s.healthcare === undefined ? s : { ...s, healthcare: { ...s.healthcare, ...change(s.healthcare) } };
}

/** `s` with the uncertain parameter `name` set to `value`. */
export function applyParameter(s: Scenario, name: string, value: number): Scenario {
  const d = s.disease;
  switch (name) {
    case 'r0':
      return { ...s, disease: { ...d, transmission: { kind: 'r0', r0: value } } };
    case 'doublingTimeDays':
      return { ...s, disease: { ...d, transmission: { kind: 'doublingTime', doublingTimeDays: value } } };
    case 'latentPeriodDays':
      return { ...s, disease: { ...d, latentPeriodDays: value } };
    case 'infectiousPeriodDays':
      return { ...s, disease: { ...d, infectiousPeriodDays: value } };
    case 'ifrScale':
      return { ...s, severity: { ...s.severity, infectionFatalityRatio: scaled(s.severity.infectionFatalityRatio, value) } };
    case 'hospitalisationScale':
      return withHealthcare(s, (h) => ({ infectionHospitalisationRatio: scaled(h.infectionHospitalisationRatio ?? defaultInfectionHospitalisationRatio(s), value) }));
    case 'icuShareScale':
      return withHealthcare(s, (h) => ({ icuShareOfAdmissions: scaled(h.icuShareOfAdmissions ?? defaultIcuShareOfAdmissions(s), value) }));
    case 'wardStayScale':
      return withHealthcare(s, (h) => (h.wardStayByBand !== undefined ? { wardStayByBand: h.wardStayByBand.map((x) => scaledDelay(x, value)) } : { wardStay: scaledDelay(commonDelays(h).wardStay, value) }));
    case 'icuStayScale':
      return withHealthcare(s, (h) => (h.icuStayByBand !== undefined ? { icuStayByBand: h.icuStayByBand.map((x) => scaledDelay(x, value)) } : { icuStay: scaledDelay(commonDelays(h).icuStay, value) }));
    case 'measureAdherence':
      return {
        ...s,
        options: s.options.map((o) => ({
          ...o,
          phases: o.phases.map((p) => ({
            ...p,
            settingMultipliers: Object.fromEntries(Object.entries(p.settingMultipliers).map(([k, m]) => [k, adhered(m, value)])),
            ageFactors: p.ageFactors.map((f) => ({ ...f, factor: adhered(f.factor, value) })),
            caseIsolation: value * p.caseIsolation,
          })),
        })),
      };
    case 'vaccineEfficacyScale':
      return {
        ...s,
        vaccinationCampaigns: s.vaccinationCampaigns.map((c) => ({
          ...c,
          efficacyAgainstInfection: c.efficacyAgainstInfection * value,
          efficacyAgainstDeath: c.efficacyAgainstDeath * value,
          efficacyAgainstAdmission: c.efficacyAgainstAdmission === undefined ? undefined : c.efficacyAgainstAdmission * value,
        })),
      };
    case 'initialInfectedScale':
      return { ...s, initialState: { ...s.initialState, infectedPersons: scaled(s.initialState.infectedPersons, value) } };
    default: {
      if (!name.startsWith(CONTACT_SCALE_PREFIX)) throw new Error(`unknown uncertain parameter ${name}`);
      const setting = name.slice(CONTACT_SCALE_PREFIX.length);
      return { ...s, settings: s.settings.map((x) => (x.name === setting ? { ...x, contactsPerDay: x.contactsPerDay.map((row) => scaled(row, value)) } : x)) };
    }
  }
}

/** The top-level section of a scenario that the uncertain parameter `name` changes. */
export function sectionOfParameter(name: string): ScenarioSection {
  switch (name) {
    case 'r0':
    case 'doublingTimeDays':
    case 'latentPeriodDays':
    case 'infectiousPeriodDays':
      return 'disease';
    case 'ifrScale':
      return 'severity';
    case 'hospitalisationScale':
    case 'icuShareScale':
    case 'wardStayScale':
    case 'icuStayScale':
      return 'healthcare';
    case 'measureAdherence':
      return 'options';
    case 'vaccineEfficacyScale':
      return 'vaccinationCampaigns';
    case 'initialInfectedScale':
      return 'initialState';
    default:
      if (!name.startsWith(CONTACT_SCALE_PREFIX)) throw new Error(`unknown uncertain parameter ${name}`);
      return 'settings';
  }
}

/** `s` with every parameter set to its value of one draw (parameters and values in the same order). */
export function applyDraw(s: Scenario, names: readonly string[], values: readonly number[]): Scenario {
  return names.reduce((acc, name, k) => applyParameter(acc, name, values[k]), s);
}
