/**
 * Scenario validation: structure (zod schema) then the rules that tie fields together
 * (matrix sizes, band counts, phase order, names that must exist).
 *
 * Every problem names its JSON path, the rule and the value, e.g.
 * `populationPersons[3] must be >= 0, got -12`. A user's mistake is never a stack trace.
 */
import type { z } from 'zod';
import { type Calibration, calibrateTransmission, calibrationProblem } from './calibration.ts';
import { healthcareProblems } from './healthcare/healthcareProblems.ts';
import { lifeTableProblems } from './lifeExpectancy.ts';
import { MAX_TRIGGER_LEVEL_PER_100K } from './limits.ts';
import { PerronRootNotSettled } from './perronRoot.ts';
import { measuresOnlyProblems } from './rByPhase.ts';
import { jsonValueProblems, readJsonText } from './jsonText.ts';
import { formatPath, formatProblem, type Problem } from './problems.ts';
import { isReservedName, strictInputProblems } from './strictInput.ts';
import { vaccinationProblems } from './vaccination/vaccinationProblems.ts';
import { uncertaintyProblems } from './uncertainty/uncertaintyProblems.ts';
import { HOSPITAL_TRIGGER_QUANTITIES, scenarioSchema, type Scenario, type Trigger } from './scenario.ts';
import { bandParameters } from './transmission.ts';

/** A valid scenario comes with its calibration, to hand to `prepareScenario` / `runScenario`. */
export type ValidationResult = { ok: true; scenario: Scenario; calibration: Calibration } | { ok: false; problems: Problem[] };

function showValue(v: unknown): string | undefined {
  if (v === undefined) return undefined;
  if (typeof v === 'number' && !Number.isFinite(v)) return String(v);
  const text = JSON.stringify(v);
  if (text === undefined) return String(v);
  return text.length > 60 ? `${text.slice(0, 57)}...` : text;
}

function valueAt(root: unknown, path: readonly PropertyKey[]): unknown {
  let node: unknown = root;
  for (const key of path) {
    if (node === null || typeof node !== 'object') return undefined;
    node = (node as Record<PropertyKey, unknown>)[key as string];
  }
  return node;
}

const TYPE_WORDS: Record<string, string> = {
  number: 'a number',
  string: 'text',
  array: 'a list',
  object: 'an object',
  boolean: 'true or false',
  int: 'a whole number',
};

function ruleOf(issue: z.core.$ZodIssue, value: unknown): string {
  if (issue.code === 'invalid_type' && typeof value === 'number' && !Number.isFinite(value)) return 'must be a finite number';
  if (issue.code === 'invalid_type') {
    const kind = TYPE_WORDS[issue.expected] ?? issue.expected;
    return value === undefined ? `is required (${kind})` : `must be ${kind}`;
  }
  if (issue.code === 'invalid_value') {
    return `must be ${issue.values.map((v) => JSON.stringify(v)).join(' or ')}`;
  }
  if (issue.code === 'invalid_union') return /^must /.test(issue.message) ? issue.message : 'does not match any allowed form';
  const msg = issue.message;
  if (/^must |^is |^has /.test(msg)) return msg;
  if (issue.code === 'too_small') return `must have at least ${String(issue.minimum)}${issue.origin === 'array' ? ' item(s)' : ''}`;
  if (issue.code === 'too_big') return `must be at most ${String(issue.maximum)}`;
  return msg.charAt(0).toLowerCase() + msg.slice(1);
}

/**
 * The rule `value` breaks under `schema` (one field's part of the scenario schema), in the words
 * `validateScenario` reports it at that field, or null when it passes: what the app's number
 * fields check before an edit (src/renderer/lib/fieldRules.ts), so they refuse exactly what the
 * file reader refuses, saying it the same way.
 */
export function fieldRuleBroken(schema: z.ZodType, value: unknown): string | null {
  const parsed = schema.safeParse(value);
  return parsed.success ? null : ruleOf(parsed.error.issues[0], value);
}

/** zod's issues as problems; unknown fields are left to strictInput.ts, which names each one. */
function structuralProblems(input: unknown, issues: readonly z.core.$ZodIssue[]): Problem[] {
  return issues.filter((issue) => issue.code !== 'unrecognized_keys').map((issue) => {
    const value = valueAt(input, issue.path);
    return { path: formatPath(issue.path), rule: ruleOf(issue, value), value: showValue(value) };
  });
}

function checkLength(problems: Problem[], path: string, arr: readonly unknown[] | undefined, n: number): void {
  if (arr !== undefined && arr.length !== n) {
    problems.push({ path, rule: `must have one entry per age band (${n})`, value: `${arr.length} entries` });
  }
}

/** A trigger's thresholds must leave a dead band, and hospital quantities need the hospital model. */
function triggerProblems(s: Scenario, t: Trigger, at: string): Problem[] {
  const problems: Problem[] = [];
  if (t.offBelow > t.onAbove) {
    problems.push({ path: `${at}.offBelow`, rule: `must be at most onAbove (${t.onAbove})`, value: String(t.offBelow) });
  }
  if (!HOSPITAL_TRIGGER_QUANTITIES.includes(t.quantity)) {
    for (const [field, level] of [['onAbove', t.onAbove], ['offBelow', t.offBelow]] as const) {
      if (level > MAX_TRIGGER_LEVEL_PER_100K) problems.push({ path: `${at}.${field}`, rule: `must be at most ${MAX_TRIGGER_LEVEL_PER_100K.toLocaleString('en')} (per 100,000 population)`, value: String(level) });
    }
  }
  if (HOSPITAL_TRIGGER_QUANTITIES.includes(t.quantity) && s.healthcare === undefined) {
    problems.push({ path: `${at}.quantity`, rule: 'needs a healthcare section (hospital quantities come from the hospital model)', value: JSON.stringify(t.quantity) });
  }
  return problems;
}

/** Rules that tie fields together; run only when the structure is valid. */
export function crossFieldProblems(s: Scenario): Problem[] {
  const problems: Problem[] = [];
  const n = s.ageBands.length;
  s.ageBands.forEach((band, i) => {
    if (i > 0 && band.lowerAgeYears <= s.ageBands[i - 1].lowerAgeYears) {
      problems.push({ path: `ageBands[${i}].lowerAgeYears`, rule: 'must be greater than the band before', value: String(band.lowerAgeYears) });
    }
  });
  checkLength(problems, 'populationPersons', s.populationPersons, n);
  if (s.populationPersons.every((p) => p === 0)) {
    problems.push({ path: 'populationPersons', rule: 'must have at least one band with people', value: 'all 0' });
  }
  const settingNames = new Set<string>();
  s.settings.forEach((setting, k) => {
    if (settingNames.has(setting.name)) {
      problems.push({ path: `settings[${k}].name`, rule: 'must be unique', value: JSON.stringify(setting.name) });
    }
    if (isReservedName(setting.name)) {
      problems.push({ path: `settings[${k}].name`, rule: 'must not be a name JavaScript objects reserve (constructor, toString, __proto__ ...); choose another', value: JSON.stringify(setting.name) });
    }
    settingNames.add(setting.name);
    const m = setting.contactsPerDay;
    if (m.length !== n) {
      problems.push({ path: `settings[${k}].contactsPerDay`, rule: `must have ${n} rows (one per age band)`, value: `${m.length} rows` });
    }
    m.forEach((row, i) => {
      if (row.length !== n) {
        problems.push({ path: `settings[${k}].contactsPerDay[${i}]`, rule: `must have ${n} columns (one per age band)`, value: `${row.length} columns` });
      }
    });
  });
  checkLength(problems, 'disease.relativeSusceptibility', s.disease.relativeSusceptibility, n);
  checkLength(problems, 'disease.relativeInfectiousness', s.disease.relativeInfectiousness, n);
  checkLength(problems, 'severity.infectionFatalityRatio', s.severity.infectionFatalityRatio, n);
  checkLength(problems, 'initialState.infectedPersons', s.initialState.infectedPersons, n);
  checkLength(problems, 'initialState.priorImmunityFraction', s.initialState.priorImmunityFraction, n);
  if (s.initialState.infectedPersons.length === n) {
    s.initialState.infectedPersons.forEach((x, i) => {
      const immune = s.initialState.priorImmunityFraction?.[i] ?? 0;
      const room = (s.populationPersons[i] ?? 0) * (1 - immune);
      if (x > room + 1e-9) {
        problems.push({ path: `initialState.infectedPersons[${i}]`, rule: `must not exceed the band's non-immune population (${room})`, value: String(x) });
      }
    });
    if (s.initialState.infectedPersons.every((x) => x === 0)) {
      problems.push({ path: 'initialState.infectedPersons', rule: 'must seed at least one infection', value: 'all 0' });
    }
  }
  const optionNames = new Set<string>();
  s.options.forEach((option, o) => {
    if (optionNames.has(option.name)) {
      problems.push({ path: `options[${o}].name`, rule: 'must be unique', value: JSON.stringify(option.name) });
    }
    optionNames.add(option.name);
    const sorted = option.phases.map((p, k) => ({ p, k })).sort((a, b) => a.p.fromDay - b.p.fromDay);
    sorted.forEach(({ p, k }, idx) => {
      const at = `options[${o}].phases[${k}]`;
      if (p.toDay <= p.fromDay) {
        problems.push({ path: `${at}.toDay`, rule: `must be after fromDay (${p.fromDay})`, value: String(p.toDay) });
      }
      if (p.trigger !== undefined) problems.push(...triggerProblems(s, p.trigger, `${at}.trigger`));
      else if (idx > 0) {
        // Fixed phases may not overlap one another; a triggered phase may overlap any phase (their measures combine).
        const prev = sorted.slice(0, idx).reverse().find((q) => q.p.trigger === undefined);
        if (prev !== undefined && p.fromDay < prev.p.toDay) {
          problems.push({ path: `${at}.fromDay`, rule: `must not overlap phases[${prev.k}] (which runs to day ${prev.p.toDay})`, value: String(p.fromDay) });
        }
      }
      for (const name of Object.keys(p.settingMultipliers)) {
        if (!settingNames.has(name)) {
          problems.push({ path: `${at}.settingMultipliers.${name}`, rule: `must name a setting of the scenario (${[...settingNames].join(', ')})`, value: JSON.stringify(name) });
        }
      }
      p.ageFactors.forEach((f, a) => {
        if (!settingNames.has(f.setting)) {
          problems.push({ path: `${at}.ageFactors[${a}].setting`, rule: `must name a setting of the scenario (${[...settingNames].join(', ')})`, value: JSON.stringify(f.setting) });
        }
        f.bands.forEach((b, bi) => {
          if (b >= n) problems.push({ path: `${at}.ageFactors[${a}].bands[${bi}]`, rule: `must be a band index below ${n}`, value: String(b) });
          const first = f.bands.indexOf(b);
          if (first !== bi) problems.push({ path: `${at}.ageFactors[${a}].bands[${bi}]`, rule: `must not repeat a band (already at bands[${first}]; the factor would apply twice)`, value: String(b) });
        });
      });
    });
  });
  if (s.referenceOption !== undefined && !optionNames.has(s.referenceOption)) {
    problems.push({ path: 'referenceOption', rule: 'must name one of the options', value: JSON.stringify(s.referenceOption) });
  }
  problems.push(...healthcareProblems(s));
  problems.push(...vaccinationProblems(s));
  problems.push(...lifeTableProblems(s));
  problems.push(...uncertaintyProblems(s));
  return problems;
}

/** Problems listed one per line; the rest are counted in one closing line. */
export const MAX_LISTED_PROBLEMS = 30;

function listed(problems: Problem[]): Problem[] {
  if (problems.length <= MAX_LISTED_PROBLEMS) return problems;
  const rest = problems.length - MAX_LISTED_PROBLEMS;
  return [...problems.slice(0, MAX_LISTED_PROBLEMS), { path: '(file)', rule: `has ${rest} more problem${rest === 1 ? '' : 's'} not listed` }];
}

/** Validates parsed JSON as a scenario, listing every problem (at most MAX_LISTED_PROBLEMS, and a count of the rest). */
export function validateScenario(input: unknown): ValidationResult {
  // Depth and non-finite numbers first: the steps below may recurse into what they are given.
  const valueProblems = jsonValueProblems(input);
  if (valueProblems.length > 0) return { ok: false, problems: valueProblems };
  const parsed = scenarioSchema.safeParse(input);
  const strict = strictInputProblems(scenarioSchema, input);
  if (!parsed.success) return { ok: false, problems: listed([...structuralProblems(input, parsed.error.issues), ...strict]) };
  if (strict.length > 0) return { ok: false, problems: strict };
  return checkedWhole(parsed.data);
}

/** The rules after the structure: cross-field rules, then the calibration of transmission. */
function checkedWhole(scenario: Scenario): ValidationResult {
  const problems = crossFieldProblems(scenario);
  if (problems.length > 0) return { ok: false, problems: listed(problems) };
  const bands = bandParameters(scenario);
  let calibration: Calibration;
  try {
    calibration = calibrateTransmission(scenario, bands);
  } catch (err) {
    if (!(err instanceof PerronRootNotSettled)) throw err;
    return { ok: false, problems: [{ path: 'settings', rule: `must give contacts R0 can be computed for: with these contacts and populations ${err.message}; look for values many orders of magnitude from the rest (such as 1e-300)` }] };
  }
  const problem = calibrationProblem(scenario, calibration, bands);
  if (problem !== null) return { ok: false, problems: [problem] };
  // Each phase's R under its measures alone, as every run computes it (rByPhase.ts): refused here rather than mid-run.
  const phaseProblems = measuresOnlyProblems(scenario, bands, calibration.beta);
  return phaseProblems.length > 0 ? { ok: false, problems: listed(phaseProblems) } : { ok: true, scenario, calibration };
}

/** A top-level section of a scenario (the unit `revalidateSections` checks again). */
export type ScenarioSection = keyof Scenario;

const sectionSchemas = new Map<string, z.ZodType>();

/** The scenario schema restricted to `sections`: issue paths stay those of the whole schema. */
function schemaOfSections(sections: readonly ScenarioSection[]): z.ZodType {
  const key = sections.join(',');
  let schema = sectionSchemas.get(key);
  if (schema === undefined) {
    schema = scenarioSchema.pick(Object.fromEntries(sections.map((k) => [k, true])) as Partial<Record<ScenarioSection, true>>);
    sectionSchemas.set(key, schema);
  }
  return schema;
}

/**
 * `validateScenario` for a scenario that was valid before only `sections` changed (an uncertainty
 * draw, drawOutcomes.ts): the structural rules are checked on those sections alone, then every
 * cross-field rule and the calibration, as `validateScenario` does. For such a scenario it gives
 * the same result and the same first problem, at a fraction of the cost (the contact matrices of
 * untouched settings, the other options and so on are not parsed again). Unknown keys cannot
 * appear this way and are not looked for.
 */
export function revalidateSections(s: Scenario, sections: readonly ScenarioSection[]): ValidationResult {
  // In the schema's order, so several broken sections are listed as the whole schema lists them.
  const ordered = (Object.keys(scenarioSchema.shape) as ScenarioSection[]).filter((k) => sections.includes(k) && s[k] !== undefined);
  const changed = Object.fromEntries(ordered.map((k) => [k, s[k]]));
  const valueProblems = jsonValueProblems(changed);
  if (valueProblems.length > 0) return { ok: false, problems: valueProblems };
  const parsed = schemaOfSections(Object.keys(changed) as ScenarioSection[]).safeParse(changed);
  if (!parsed.success) return { ok: false, problems: listed(structuralProblems(changed, parsed.error.issues)) };
  return checkedWhole({ ...s, ...(parsed.data as Partial<Scenario>) });
}

/** Parses JSON text and validates it; a JSON syntax error is reported as one problem (one line, with its line and column). */
export function parseScenarioText(text: string): ValidationResult {
  const json = readJsonText(text);
  return json.ok ? validateScenario(json.value) : json;
}

/** Thrown by engine entry points handed an unvalidated scenario. */
export class ScenarioError extends Error {
  constructor(readonly problems: Problem[]) {
    super(problems.map(formatProblem).join('\n'));
    this.name = 'ScenarioError';
  }
}
