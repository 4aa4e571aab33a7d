/**
 * A validation problem in the words the app shows, not the file's JSON path: the field's label
 * as the user sees it ("Ward beds at full surge", "Population 0-4", "Phase 1 of “Schools closed”:
 * last day") and the rule with any other field it names put the same way. Paths the table does not
 * know fall back to their last field name spelt out in words.
 */
import type { Problem, Scenario } from '../../engine/index.ts';
import { parameterLabel } from './uncertaintyEdits.ts';

/** Field names as words, for labels and for fields named inside a rule. */
const FIELD_WORDS: Record<string, string> = {
  wardBeds: 'usual ward beds',
  icuBeds: 'usual ICU beds',
  wardSurgeBeds: 'ward beds at full surge',
  icuSurgeBeds: 'ICU beds at full surge',
  efficacyAgainstInfection: 'efficacy against infection',
  efficacyAgainstDeath: 'efficacy against death',
  efficacyAgainstAdmission: 'efficacy against admission',
  delayToProtectionDays: 'delay to protection',
  uptakeCeiling: 'uptake ceiling',
  dosesPerDay: 'doses per day',
  fromDay: 'first day',
  toDay: 'last day',
  caseIsolation: 'case isolation',
  r0: 'R0',
  doublingTimeDays: 'doubling time',
  latentPeriodDays: 'latent period',
  infectiousPeriodDays: 'infectious period',
  horizonDays: 'horizon',
  populationPersons: 'population',
  infectedPersons: 'infected on day 0',
  infectionFatalityRatio: 'IFR',
  priorImmunityFraction: 'prior immunity',
  relativeSusceptibility: 'relative susceptibility',
  relativeInfectiousness: 'relative infectiousness',
  infectionHospitalisationRatio: 'infection-hospitalisation ratio',
  icuShareOfAdmissions: 'ICU share of admissions',
  intervalLevel: 'interval level',
  mode: 'most likely value',
  sd: 'standard deviation',
  range95: '95% range',
  geometricSd: 'geometric SD',
};

/** Labels that differ from the words above where the field stands alone (the capacity table's own). */
const CAPACITY_LABELS: Record<string, string> = {
  wardBeds: 'Ward beds',
  icuBeds: 'ICU beds',
  wardSurgeBeds: 'Ward beds at full surge',
  icuSurgeBeds: 'ICU beds at full surge',
};

const capitalise = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/** A table's own entry for `name`, never a built-in every object has (a field named "constructor" or "toString"). */
function own(table: Record<string, string>, name: string): string | undefined {
  return Object.hasOwn(table, name) ? table[name] : undefined;
}

/** "wardSurgeBeds" → "ward surge beds" when the table has no words for it. */
function spelt(name: string): string {
  return own(FIELD_WORDS, name) ?? name.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase();
}

function band(scenario: Scenario, index: string): string {
  return scenario.ageBands?.[Number(index)]?.label ?? `band ${Number(index) + 1}`;
}

/** The label of the field at `path`. */
export function fieldLabel(path: string, scenario: Scenario): string {
  let m = /^healthcare\.capacity\.(\w+)$/.exec(path);
  if (m) return own(CAPACITY_LABELS, m[1]) ?? capitalise(spelt(m[1]));
  m = /^(?:populationPersons|initialState\.(\w+)|severity\.(\w+)|disease\.(\w+)|healthcare\.(\w+))\[(\d+)\]$/.exec(path);
  if (m) return `${capitalise(spelt(m[1] ?? m[2] ?? m[3] ?? m[4] ?? 'populationPersons'))} ${band(scenario, m[5])}`;
  m = /^options\[(\d+)\](?:\.phases\[(\d+)\](?:\.(\w+))?)?$/.exec(path);
  if (m) {
    const option = `“${scenario.options?.[Number(m[1])]?.name ?? `option ${Number(m[1]) + 1}`}”`;
    if (m[2] === undefined) return `Option ${option}`;
    return `Phase ${Number(m[2]) + 1} of ${option}${m[3] === undefined ? '' : `: ${spelt(m[3])}`}`;
  }
  m = /^options\[(\d+)\]\.phases\[(\d+)\]\.(\w+)/.exec(path);
  if (m) return `Phase ${Number(m[2]) + 1} of “${scenario.options?.[Number(m[1])]?.name ?? `option ${Number(m[1]) + 1}`}”: ${spelt(m[3])}`;
  m = /^uncertainty\.parameters\[(\d+)\](?:\.distribution)?(?:\.(\w+))?/.exec(path);
  if (m) {
    const name = scenario.uncertainty?.parameters[Number(m[1])]?.name;
    const input = `Uncertain ${name === undefined ? `input ${Number(m[1]) + 1}` : parameterLabel(name)}`;
    return m[2] === undefined || m[2] === 'distribution' ? input : `${input}: ${spelt(m[2])}`;
  }
  m = /^vaccinationCampaigns\[(\d+)\]\.schedule\[(\d+)\]\.(\w+)$/.exec(path);
  if (m) return `Supply step ${Number(m[2]) + 1}: ${spelt(m[3])}`;
  m = /^vaccinationCampaigns\[(\d+)\]\.(\w+)/.exec(path);
  if (m) return capitalise(spelt(m[2]));
  const last = /(\w+)(?:\[\d+\])*$/.exec(path)?.[1];
  return last === undefined ? path : capitalise(spelt(last));
}

/** The rule with the fields it names put in words ("must be at least wardBeds (3200)" → "... the usual ward beds (3200)"). */
function ruleInWords(rule: string): string {
  return rule.replace(/\b([a-z]+[A-Z]\w*)\b/g, (name) => {
    const words = own(FIELD_WORDS, name);
    return words === undefined ? name : `${name.endsWith('Beds') ? 'the ' : ''}${words}`;
  });
}

/** One line for the user: label, rule, offending value. */
export function problemInWords(problem: Problem, scenario: Scenario): string {
  // A refused run's rule names its option for the command line (runRefusal.ts); the label here already does.
  const rule = ruleInWords(/^options\[\d+\]/.test(problem.path) ? problem.rule.replace(/^\(option "(?:[^"\\]|\\.)*"\) /, '') : problem.rule);
  return `${fieldLabel(problem.path, scenario)} ${rule}${problem.value === undefined ? '' : `, got ${problem.value}`}`;
}
