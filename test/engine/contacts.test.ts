/** Combining settings under measures, and the rule for scaled bands. */
import { describe, expect, it } from 'vitest';
import { effectiveContactMatrix, reciprocityCheck } from '../../src/engine/contacts.ts';
import type { Phase } from '../../src/engine/scenario.ts';
import { demoScenario } from '../helpers/demo.ts';

const phase = (p: Partial<Phase>): Phase => ({ fromDay: 0, toDay: 10, settingMultipliers: {}, ageFactors: [], caseIsolation: 0, ...p });

describe('effective contact matrix', () => {
  const s = demoScenario();
  const n = s.ageBands.length;

  it('without measures is the sum of the settings', () => {
    const c = effectiveContactMatrix(s, null);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      expect(c[i][j]).toBeCloseTo(s.settings.reduce((acc, st) => acc + st.contactsPerDay[i][j], 0), 12);
    }
  });

  it('scales each setting by its multiplier', () => {
    const c = effectiveContactMatrix(s, phase({ settingMultipliers: { school: 0, home: 1.5 } }));
    const home = s.settings.find((x) => x.name === 'home')!;
    const rest = s.settings.filter((x) => x.name !== 'home' && x.name !== 'school');
    expect(c[3][4]).toBeCloseTo(1.5 * home.contactsPerDay[3][4] + rest.reduce((a, st) => a + st.contactsPerDay[3][4], 0), 12);
  });

  it('applies the smaller factor of the two bands, and stays reciprocal', () => {
    const work = s.settings.findIndex((x) => x.name === 'work');
    const only = { ...s, settings: [s.settings[work]] };
    const c = effectiveContactMatrix(only, phase({ ageFactors: [{ setting: 'work', bands: [13], factor: 0.25 }] }));
    const w = s.settings[work].contactsPerDay;
    expect(c[13][13]).toBeCloseTo(0.25 * w[13][13], 12);
    expect(c[13][8]).toBeCloseTo(0.25 * w[13][8], 12);
    expect(c[8][13]).toBeCloseTo(0.25 * w[8][13], 12);
    expect(c[8][9]).toBeCloseTo(w[8][9], 12);
    expect(reciprocityCheck(c, s.populationPersons).largestRelativeImbalance).toBeLessThan(1e-12);
  });
});

describe('several age factors for one band and setting', () => {
  it('multiply: 0.5 and 0.4 keep a fifth of that band\'s contacts in the setting', () => {
    const s = demoScenario();
    const work = s.settings.findIndex((x) => x.name === 'work');
    const only = { ...s, settings: [s.settings[work]] };
    const c = effectiveContactMatrix(only, phase({ ageFactors: [{ setting: 'work', bands: [13, 14], factor: 0.5 }, { setting: 'work', bands: [13], factor: 0.4 }] }));
    const w = s.settings[work].contactsPerDay;
    expect(c[13][13]).toBeCloseTo(0.2 * w[13][13], 12);
    expect(c[13][14]).toBeCloseTo(0.2 * w[13][14], 12); // min(0.2, 0.5)
    expect(c[14][14]).toBeCloseTo(0.5 * w[14][14], 12);
    expect(c[8][13]).toBeCloseTo(0.2 * w[8][13], 12);
  });
});

describe('reciprocity check', () => {
  it('finds the largest imbalance and where it is', () => {
    // N_0 C_01 = 250 * 10 = 2500 against N_1 C_10 = 750 * 3 = 2250: relative 250 / 2500.
    const r = reciprocityCheck([[18, 10], [3, 12]], [250, 750]);
    expect(r.largestRelativeImbalance).toBeCloseTo(0.1, 12);
    expect(r.at).toEqual([0, 1]);
  });
});
