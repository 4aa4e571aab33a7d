import { describe, expect, it } from 'vitest';
import { validateScenario } from '../../src/engine/validation.ts';
import { runScenario } from '../../src/engine/run.ts';
import { REPORT9_CRITICAL_CARE_PERCENT_OF_HOSPITALISED, REPORT9_HOSPITALISED_PERCENT_OF_SYMPTOMATIC, DEFAULT_ICU_STAY } from '../../src/engine/healthcare/defaults.ts';
import {
  bandValue,
  campaignSummary,
  defaultHealthcare,
  hospitalRatio,
  HOSPITAL_DELAYS,
  isDefaultDelay,
  withBandValue,
  withHospitalRatio,
} from '../../src/renderer/lib/assumptionEdits.ts';
import { demoScenario } from '../helpers/demo.ts';

describe('by-band lists that may be absent', () => {
  it('writes an absent list out with its meaning (fill) in the other bands', () => {
    expect(withBandValue(undefined, 4, 2, 0.5, 1)).toEqual([1, 1, 0.5, 1]);
    expect(withBandValue(undefined, 3, 0, 0.2, 0)).toEqual([0.2, 0, 0]);
  });

  it('copies a given list and leaves the original untouched', () => {
    const given = [0.6, 0.8, 1];
    const next = withBandValue(given, 3, 1, 1.2, 1);
    expect(next).toEqual([0.6, 1.2, 1]);
    expect(given).toEqual([0.6, 0.8, 1]);
  });

  it('reads a band, with the fill when the list is absent', () => {
    expect(bandValue(undefined, 3, 1)).toBe(1);
    expect(bandValue([0.1, 0.2], 1, 0)).toBe(0.2);
  });

  it('an edited susceptibility gives a valid scenario the engine runs with a different R at start', () => {
    const s = demoScenario();
    const work = s.options.findIndex((o) => o.name === 'Work contacts halved');
    const edited = structuredClone(s);
    edited.disease.relativeSusceptibility = withBandValue(undefined, s.ageBands.length, 3, 0.5, 1);
    const check = validateScenario(edited);
    expect(check.ok).toBe(true);
    expect(runScenario(edited).options[work].rStart).not.toBeCloseTo(runScenario(s).options[work].rStart, 3);
  });
});

describe('hospital ratios', () => {
  const s = demoScenario(); // leaves both ratios to the program defaults

  it('shows the program defaults (Ferguson et al. 2020, Report 9, Table 1, x 0.8 symptomatic share) when the file leaves them out', () => {
    const ihr = hospitalRatio(s, 'infectionHospitalisationRatio');
    expect(ihr.isDefault).toBe(true);
    // Band 60-64 (index 12) takes the 60-69 row: 16.6% of symptomatic cases x 0.8.
    expect(ihr.values[12]).toBeCloseTo((0.8 * REPORT9_HOSPITALISED_PERCENT_OF_SYMPTOMATIC[6]) / 100, 12);
    const icu = hospitalRatio(s, 'icuShareOfAdmissions');
    expect(icu.values[15]).toBeCloseTo(REPORT9_CRITICAL_CARE_PERCENT_OF_HOSPITALISED[7] / 100, 12);
  });

  it('editing one band writes the whole table, the other bands keeping the defaults', () => {
    const values = withHospitalRatio(s, 'icuShareOfAdmissions', 0, 0.1);
    const defaults = hospitalRatio(s, 'icuShareOfAdmissions').values;
    expect(values[0]).toBe(0.1);
    expect(values.slice(1)).toEqual(defaults.slice(1));
    const edited = structuredClone(s);
    edited.healthcare!.icuShareOfAdmissions = values;
    expect(hospitalRatio(edited, 'icuShareOfAdmissions')).toEqual({ values, isDefault: false });
  });
});

describe('a hospital section with the program defaults', () => {
  it('is valid, leaves the ratios to the defaults and starts with no beds', () => {
    const s = demoScenario();
    delete s.healthcare;
    const added = { ...s, healthcare: defaultHealthcare() };
    const check = validateScenario(added);
    expect(check.ok).toBe(true);
    expect(added.healthcare.infectionHospitalisationRatio).toBeUndefined();
    expect(added.healthcare.capacity).toEqual({ wardBeds: 0, icuBeds: 0 });
    for (const d of HOSPITAL_DELAYS) expect(isDefaultDelay(added.healthcare[d.key], d.fallback)).toBe(true);
    expect(isDefaultDelay({ meanDays: DEFAULT_ICU_STAY.meanDays + 1, shape: DEFAULT_ICU_STAY.shape }, DEFAULT_ICU_STAY)).toBe(false);
  });

  it('returns a fresh copy each time (editing one does not change the defaults)', () => {
    const a = defaultHealthcare();
    a.icuStay.meanDays = 99;
    expect(defaultHealthcare().icuStay.meanDays).toBe(DEFAULT_ICU_STAY.meanDays);
  });
});

describe('campaign summary', () => {
  it('says the demo campaign in plain words', () => {
    const s = demoScenario();
    const summary = campaignSummary(s, s.vaccinationCampaigns[0]);
    expect(summary.name).toBe('Autumn campaign');
    expect(summary.schedule).toBe('6,000 per day from day 30; 12,000 per day from day 90');
    expect(summary.efficacies).toBe('infection 50.0 %, admission 80.0 %, death 85.0 %');
    expect(summary.protection).toBe('leaky');
    expect(summary.delayDays).toBe(14);
    expect(summary.order.startsWith('75+ → 70-74 → 65-69')).toBe(true);
    expect(summary.order.endsWith('→ 15-19')).toBe(true);
    expect(summary.options).toEqual(s.options.filter((o) => o.vaccinationCampaign === 'Autumn campaign').map((o) => o.name));
    expect(summary.options.length).toBeGreaterThan(0);
  });

  it('sorts the schedule by day and says when the admission efficacy falls back to the death efficacy', () => {
    const s = demoScenario();
    const campaign = { ...s.vaccinationCampaigns[0], schedule: [{ fromDay: 50, dosesPerDay: 10 }, { fromDay: 5, dosesPerDay: 2000 }], priority: [[15, 14], [0]] };
    delete campaign.efficacyAgainstAdmission;
    const summary = campaignSummary(s, campaign);
    expect(summary.schedule).toBe('2,000 per day from day 5; 10 per day from day 50');
    expect(summary.efficacies).toContain('admission 85.0 % (as death)');
    expect(summary.order).toBe('75+, 70-74 → 0-4');
  });
});
