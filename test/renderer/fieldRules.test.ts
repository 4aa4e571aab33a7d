/**
 * The app's number fields for scenario values take their rules from the file reader
 * (fieldRules.ts): the bounds are limits.ts's, no field keeps bounds of its own, and a value is
 * accepted by the field and the edit exactly when the saved file is accepted by parseScenarioText,
 * which names the same rule in the same words.
 */
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatPath, parseScenarioText, scenarioSchema, type Scenario } from '../../src/engine/index.ts';
import * as L from '../../src/engine/limits.ts';
import { checkEdit } from '../../src/renderer/lib/editCheck.ts';
import { FIELD_RULES, fieldProblem, type FieldName } from '../../src/renderer/lib/fieldRules.ts';
import { demoScenario } from '../helpers/demo.ts';

/** Each field's bounds as limits.ts (or the format's fixed ends: fractions, counts from 1) states them. */
const EXPECTED: Record<FieldName, [number, number]> = {
  populationPersons: [0, L.MAX_POPULATION_PERSONS],
  infectedPersons: [0, L.MAX_POPULATION_PERSONS],
  priorImmunityFraction: [0, 1],
  infectionFatalityRatio: [0, 1],
  relativeSusceptibility: [0, L.MAX_RELATIVE_FACTOR],
  relativeInfectiousness: [0, L.MAX_RELATIVE_FACTOR],
  r0: [0, L.MAX_R0],
  doublingTimeDays: [L.MIN_DOUBLING_TIME_DAYS, L.MAX_DOUBLING_TIME_DAYS],
  latentPeriodDays: [L.MIN_PERIOD_DAYS, L.MAX_PERIOD_DAYS],
  infectiousPeriodDays: [L.MIN_PERIOD_DAYS, L.MAX_PERIOD_DAYS],
  latentStages: [1, L.MAX_ERLANG_STAGES],
  infectiousStages: [1, L.MAX_ERLANG_STAGES],
  delayMeanDays: [0, L.MAX_DELAY_MEAN_DAYS],
  delayShape: [L.MIN_DELAY_SHAPE, L.MAX_DELAY_SHAPE],
  horizonDays: [1, L.MAX_HORIZON_DAYS],
  contactMultiplier: [0, L.MAX_CONTACT_MULTIPLIER],
  caseIsolation: [0, 1],
  ageFactor: [0, L.MAX_CONTACT_MULTIPLIER],
  triggerLevel: [0, L.MAX_TRIGGER_LEVEL_PERSONS],
  triggerDays: [0, L.MAX_DAY_NUMBER],
  beds: [0, L.MAX_BEDS],
  hospitalRatio: [0, 1],
  delayToProtectionDays: [1, L.MAX_DELAY_TO_PROTECTION_DAYS],
  efficacy: [0, 1],
  uptakeCeiling: [0, 1],
  doseStepDay: [0, L.MAX_DAY_NUMBER],
  dosesPerDay: [0, L.MAX_DOSES_PER_DAY],
  draws: [2, L.MAX_DRAWS],
  seed: [0, Number.MAX_SAFE_INTEGER],
  intervalLevel: [0, 1],
  distributionValue: [-L.MAX_DISTRIBUTION_VALUE, L.MAX_DISTRIBUTION_VALUE],
  distributionSd: [0, L.MAX_DISTRIBUTION_VALUE],
  distributionPositive: [0, L.MAX_DISTRIBUTION_VALUE],
  geometricSd: [1, L.MAX_GEOMETRIC_SD],
};

/** A demo scenario with an uncertainty section (the demo has none), for the uncertainty fields. */
function withUncertainty(s: Scenario): Scenario {
  return { ...s, uncertainty: { draws: 10, seed: 1, intervalLevel: 0.9, parameters: [{ name: 'r0', distribution: { kind: 'uniform', low: 2, high: 3 }, source: 'test range' }] } };
}

/** Where each field's value goes in a scenario (as its panel writes it) and the JSON path of that value. */
const PLACES: Record<FieldName, { path: string; set(s: Scenario, v: number): Scenario }> = {
  populationPersons: { path: 'populationPersons[0]', set: (s, v) => ({ ...s, populationPersons: s.populationPersons.map((x, i) => (i === 0 ? v : x)) }) },
  infectedPersons: { path: 'initialState.infectedPersons[0]', set: (s, v) => ({ ...s, initialState: { ...s.initialState, infectedPersons: s.initialState.infectedPersons.map((x, i) => (i === 0 ? v : x)) } }) },
  priorImmunityFraction: { path: 'initialState.priorImmunityFraction[0]', set: (s, v) => ({ ...s, initialState: { ...s.initialState, priorImmunityFraction: s.ageBands.map((_, i) => (i === 0 ? v : 0)) } }) },
  infectionFatalityRatio: { path: 'severity.infectionFatalityRatio[0]', set: (s, v) => ({ ...s, severity: { ...s.severity, infectionFatalityRatio: s.severity.infectionFatalityRatio.map((x, i) => (i === 0 ? v : x)) } }) },
  relativeSusceptibility: { path: 'disease.relativeSusceptibility[0]', set: (s, v) => ({ ...s, disease: { ...s.disease, relativeSusceptibility: s.ageBands.map((_, i) => (i === 0 ? v : 1)) } }) },
  relativeInfectiousness: { path: 'disease.relativeInfectiousness[0]', set: (s, v) => ({ ...s, disease: { ...s.disease, relativeInfectiousness: s.ageBands.map((_, i) => (i === 0 ? v : 1)) } }) },
  r0: { path: 'disease.transmission.r0', set: (s, v) => ({ ...s, disease: { ...s.disease, transmission: { kind: 'r0', r0: v } } }) },
  doublingTimeDays: { path: 'disease.transmission.doublingTimeDays', set: (s, v) => ({ ...s, disease: { ...s.disease, transmission: { kind: 'doublingTime', doublingTimeDays: v } } }) },
  latentPeriodDays: { path: 'disease.latentPeriodDays', set: (s, v) => ({ ...s, disease: { ...s.disease, latentPeriodDays: v } }) },
  infectiousPeriodDays: { path: 'disease.infectiousPeriodDays', set: (s, v) => ({ ...s, disease: { ...s.disease, infectiousPeriodDays: v } }) },
  latentStages: { path: 'disease.latentStages', set: (s, v) => ({ ...s, disease: { ...s.disease, latentStages: v } }) },
  infectiousStages: { path: 'disease.infectiousStages', set: (s, v) => ({ ...s, disease: { ...s.disease, infectiousStages: v } }) },
  delayMeanDays: { path: 'severity.deathDelay.meanDays', set: (s, v) => ({ ...s, severity: { ...s.severity, deathDelay: { ...s.severity.deathDelay, meanDays: v } } }) },
  delayShape: { path: 'severity.deathDelay.shape', set: (s, v) => ({ ...s, severity: { ...s.severity, deathDelay: { ...s.severity.deathDelay, shape: v } } }) },
  horizonDays: { path: 'horizonDays', set: (s, v) => ({ ...s, horizonDays: v }) },
  contactMultiplier: { path: 'options[1].phases[0].settingMultipliers.school', set: (s, v) => phaseEdit(s, (p) => ({ ...p, settingMultipliers: { ...p.settingMultipliers, school: v } })) },
  caseIsolation: { path: 'options[1].phases[0].caseIsolation', set: (s, v) => phaseEdit(s, (p) => ({ ...p, caseIsolation: v })) },
  ageFactor: { path: 'options[1].phases[0].ageFactors[0].factor', set: (s, v) => phaseEdit(s, (p) => ({ ...p, ageFactors: [{ setting: 'home', bands: [0], factor: v }] })) },
  triggerLevel: { path: 'options[1].phases[0].trigger.onAbove', set: (s, v) => phaseEdit(s, (p) => ({ ...p, trigger: { quantity: 'icuOccupancy', onAbove: v, offBelow: 0, minimumDaysOn: 0, lagDays: 0 } })) },
  triggerDays: { path: 'options[1].phases[0].trigger.lagDays', set: (s, v) => phaseEdit(s, (p) => ({ ...p, trigger: { quantity: 'icuOccupancy', onAbove: 10, offBelow: 5, minimumDaysOn: 0, lagDays: v } })) },
  beds: { path: 'healthcare.capacity.icuBeds', set: (s, v) => healthcareEdit(s, (h) => ({ ...h, capacity: { ...h.capacity, icuBeds: v, icuSurgeBeds: undefined } })) },
  hospitalRatio: { path: 'healthcare.icuShareOfAdmissions[0]', set: (s, v) => healthcareEdit(s, (h) => ({ ...h, icuShareOfAdmissions: s.ageBands.map((_, i) => (i === 0 ? v : 0.2)) })) },
  delayToProtectionDays: { path: 'vaccinationCampaigns[0].delayToProtectionDays', set: (s, v) => campaignEdit(s, (c) => ({ ...c, delayToProtectionDays: v })) },
  efficacy: { path: 'vaccinationCampaigns[0].efficacyAgainstInfection', set: (s, v) => campaignEdit(s, (c) => ({ ...c, efficacyAgainstInfection: v, efficacyAgainstDeath: 1, efficacyAgainstAdmission: 1 })) },
  uptakeCeiling: { path: 'vaccinationCampaigns[0].uptakeCeiling[0]', set: (s, v) => campaignEdit(s, (c) => ({ ...c, uptakeCeiling: c.uptakeCeiling.map((x, i) => (i === 0 ? v : x)) })) },
  doseStepDay: { path: 'vaccinationCampaigns[0].schedule[0].fromDay', set: (s, v) => campaignEdit(s, (c) => ({ ...c, schedule: [{ ...c.schedule[0], fromDay: v }] })) },
  dosesPerDay: { path: 'vaccinationCampaigns[0].schedule[0].dosesPerDay', set: (s, v) => campaignEdit(s, (c) => ({ ...c, schedule: [{ ...c.schedule[0], dosesPerDay: v }] })) },
  draws: { path: 'uncertainty.draws', set: (s, v) => uncertaintyEdit(s, (u) => ({ ...u, draws: v })) },
  seed: { path: 'uncertainty.seed', set: (s, v) => uncertaintyEdit(s, (u) => ({ ...u, seed: v })) },
  intervalLevel: { path: 'uncertainty.intervalLevel', set: (s, v) => uncertaintyEdit(s, (u) => ({ ...u, intervalLevel: v })) },
  distributionValue: { path: 'uncertainty.parameters[0].distribution.mean', set: (s, v) => distributionEdit(s, { kind: 'normal', mean: v, sd: 1 }) },
  distributionSd: { path: 'uncertainty.parameters[0].distribution.sd', set: (s, v) => distributionEdit(s, { kind: 'normal', mean: 2, sd: v }) },
  distributionPositive: { path: 'uncertainty.parameters[0].distribution.median', set: (s, v) => distributionEdit(s, { kind: 'lognormal', median: v, geometricSd: 1.5 }) },
  geometricSd: { path: 'uncertainty.parameters[0].distribution.geometricSd', set: (s, v) => distributionEdit(s, { kind: 'lognormal', median: 2, geometricSd: v }) },
};

type Phase = Scenario['options'][number]['phases'][number];
function phaseEdit(s: Scenario, f: (p: Phase) => Phase): Scenario {
  return { ...s, options: s.options.map((o, k) => (k === 1 ? { ...o, phases: o.phases.map((p, j) => (j === 0 ? f(p) : p)) } : o)) };
}
function healthcareEdit(s: Scenario, f: (h: NonNullable<Scenario['healthcare']>) => NonNullable<Scenario['healthcare']>): Scenario {
  return { ...s, healthcare: f(s.healthcare as NonNullable<Scenario['healthcare']>) };
}
function campaignEdit(s: Scenario, f: (c: Scenario['vaccinationCampaigns'][number]) => Scenario['vaccinationCampaigns'][number]): Scenario {
  return { ...s, vaccinationCampaigns: s.vaccinationCampaigns.map((c, k) => (k === 0 ? f(c) : c)) };
}
function uncertaintyEdit(s: Scenario, f: (u: NonNullable<Scenario['uncertainty']>) => NonNullable<Scenario['uncertainty']>): Scenario {
  const w = withUncertainty(s);
  return { ...w, uncertainty: f(w.uncertainty as NonNullable<Scenario['uncertainty']>) };
}
function distributionEdit(s: Scenario, distribution: object): Scenario {
  return uncertaintyEdit(s, (u) => ({ ...u, parameters: [{ ...u.parameters[0], distribution } as (typeof u.parameters)[number]] }));
}

/** Values around a field's bounds: anywhere in a span past both ends, the ends themselves and the nearest numbers beyond. */
function valuesAround(min: number, max: number): fc.Arbitrary<number> {
  const span = Math.min(max - min, 1e12) + 1;
  const beyond = (x: number, up: boolean) => x + (up ? 1 : -1) * Math.max(Math.abs(x) * 2 ** -52, Number.MIN_VALUE);
  return fc.oneof(
    fc.double({ min: Math.max(min - span, -1e300), max: Math.min(max + span, 1e300), noNaN: true, noDefaultInfinity: true }),
    fc.constantFrom(min, max, beyond(min, false), beyond(max, true), (min + max) / 2),
    fc.integer({ min: -3, max: 1000 }),
  );
}

describe('number fields take the file reader\'s rules', () => {
  it('have the bounds of limits.ts, every field listed', () => {
    expect(Object.keys(EXPECTED).sort()).toEqual(Object.keys(FIELD_RULES).sort());
    for (const [name, rule] of Object.entries(FIELD_RULES)) expect([name, rule.min, rule.max]).toEqual([name, ...EXPECTED[name as FieldName]]);
  });

  it('keep no bounds of their own in the panels that edit scenario values', () => {
    const panels = ['views/AssumptionsView.svelte', 'components/HospitalPanel.svelte', 'components/VaccinationPanel.svelte', 'components/UncertaintyPanel.svelte', 'components/MeasuresEditor.svelte'];
    let fields = 0;
    for (const panel of panels) {
      const text = readFileSync(new URL(`../../src/renderer/${panel}`, import.meta.url), 'utf8');
      for (const field of text.match(/<(NumberField|PercentSlider)\b[\s\S]*?\/>/g) ?? []) {
        fields++;
        expect(field, `${panel}: ${field}`).toMatch(/\brule=\{FIELD_RULES\.\w+\}/);
        if (field.startsWith('<NumberField')) expect(field, `${panel}: ${field}`).not.toMatch(/\s(min|max|integer)[\s=/]/);
      }
    }
    expect(fields).toBeGreaterThanOrEqual(30);
  });

  it('say the rule in the file reader\'s words, in the shown unit where it differs', () => {
    expect(fieldProblem(FIELD_RULES.latentPeriodDays, 'Latent period', 0.05, 1, 'days')).toBe('Latent period must be at least 0.1 days, got 0.05 days.');
    expect(fieldProblem(FIELD_RULES.r0, 'R0', 50)).toBeNull();
    expect(fieldProblem(FIELD_RULES.r0, 'R0', 0)).toBe('R0 must be > 0, got 0.');
    expect(fieldProblem(FIELD_RULES.infectionFatalityRatio, 'IFR 0-4', 150, 100, '%')).toBe('IFR 0-4 must be a fraction between 0 and 1 (0 % to 100 % here), got 150 %.');
    expect(fieldProblem(FIELD_RULES.latentStages, 'Latent stages', 2.5)).toBe('Latent stages must be a whole number, got 2.5.');
  });

  it.each(Object.keys(PLACES) as FieldName[])('%s: a value the field and the edit accept is one the saved file is read with, and one the field refuses the file refuses by the same rule', (name) => {
    const rule = FIELD_RULES[name];
    const place = PLACES[name];
    const demo = demoScenario();
    fc.assert(
      fc.property(valuesAround(rule.min, rule.max), (v) => {
        const edited = place.set(demo, v);
        const saved = `${JSON.stringify(edited, null, 2)}\n`;
        const read = parseScenarioText(saved);
        const broken = rule.problem(v);
        if (broken === null) {
          // The reader's schema takes the value; refused at all, it is by a rule across fields, as the edit is.
          const structure = scenarioSchema.safeParse(JSON.parse(saved));
          expect(structure.success ? [] : structure.error.issues.map((i) => formatPath(i.path)), `${name} = ${v}`).not.toContain(place.path);
          expect(read.ok, `${name} = ${v}`).toBe(checkEdit(edited).ok);
        } else {
          expect(read.ok, `${name} = ${v}`).toBe(false);
          if (!read.ok) expect(read.problems.map((p) => [p.path, p.rule])).toContainEqual([place.path, broken]);
        }
      }),
      { numRuns: 60, seed: 11 },
    );
  });
});
