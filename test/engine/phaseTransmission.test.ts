/**
 * Quantities kept per prepared scenario and phase (src/engine/phaseTransmission.ts): each is the
 * number a fresh computation gives, computed once (the same object on a second call), and runs
 * that share them give what runs on a freshly prepared scenario give.
 */
import { describe, expect, it } from 'vitest';
import { finalSizeByBand } from '../../src/engine/finalSize.ts';
import { finalSizeUnder, phaseTransmission, rAtDayZero, rMeasuresOnly } from '../../src/engine/phaseTransmission.ts';
import { prepareScenario } from '../../src/engine/prepare.ts';
import { reproductionNumber } from '../../src/engine/reproductionNumber.ts';
import { simulateOption } from '../../src/engine/simulate.ts';
import { transmissionMatrixInto } from '../../src/engine/transmission.ts';
import { demoScenario } from '../helpers/demo.ts';

describe('per-phase quantities', () => {
  const s = demoScenario();
  const p = prepareScenario(s);
  const n = s.ageBands.length;
  const phases = [null, ...s.options.flatMap((o) => o.phases)];

  it('equal a fresh computation and are computed once', () => {
    for (const phase of phases) {
      const m = phaseTransmission(p, phase);
      expect(m).toStrictEqual(transmissionMatrixInto(new Float64Array(n * n), s, p.bands, p.beta, phase));
      expect(phaseTransmission(p, phase)).toBe(m);
      expect(rAtDayZero(p, m)).toBe(reproductionNumber(m, p.initialSusceptible, p.periods.infectiousPeriodDays));
      const s0 = new Float64Array(n).fill(1);
      expect(finalSizeUnder(p, m, s0)).toStrictEqual(finalSizeByBand(m, p.bands.population, s0, p.periods.infectiousPeriodDays));
      expect(finalSizeUnder(p, m, s0)).toBe(finalSizeUnder(p, m, s0));
      if (phase !== null) {
        const scaled = new Float64Array(n * n).map((_, k) => m[k] * p.bands.population[Math.floor(k / n)]);
        expect(rMeasuresOnly(p, phase)).toBeCloseTo(reproductionNumber(scaled, new Float64Array(n).fill(1), p.periods.infectiousPeriodDays), 8);
      }
    }
    // Another prepared scenario has its own.
    expect(phaseTransmission(prepareScenario(s), null)).not.toBe(phaseTransmission(p, null));
  });

  it('runs sharing them give what runs on a freshly prepared scenario give', () => {
    for (const option of s.options) simulateOption(p, option, { series: 'summary' });
    for (const option of s.options) expect(simulateOption(p, option)).toStrictEqual(simulateOption(prepareScenario(s), option));
  });
});
