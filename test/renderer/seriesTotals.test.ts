/** The Curves view's daily totals come straight from the engine's series. */
import { describe, expect, it } from 'vitest';
import { runScenario } from '../../src/engine/run.ts';
import { curveOfOption } from '../../src/renderer/lib/seriesTotals.ts';
import { demoScenario } from '../helpers/demo.ts';

describe('curveOfOption', () => {
  const o = runScenario(demoScenario()).options[0];
  const H = o.series.days;

  it('deaths per day: one value per day of the horizon, adding up to (nearly) the deaths of the option', () => {
    const deaths = curveOfOption(o, 'deaths');
    expect(deaths).toHaveLength(H);
    const total = deaths.reduce((a, b) => a + b, 0);
    expect(total).toBeLessThanOrEqual(o.deaths * (1 + 1e-9));
    expect(total).toBeGreaterThan(0.99 * o.deaths);
  });

  it('new infections per day add up to the infections; prevalence has one value per day 0..H; R(t) is the engine series', () => {
    const incidence = curveOfOption(o, 'incidence');
    expect(incidence).toHaveLength(H);
    expect(incidence.reduce((a, b) => a + b, 0)).toBeCloseTo(o.infections, 3);
    expect(curveOfOption(o, 'prevalence')).toHaveLength(H + 1);
    expect(curveOfOption(o, 'rt')).toEqual(Array.from(o.series.rt));
  });

  it('beds in use come from the hospital series', () => {
    expect(curveOfOption(o, 'icuOccupancy')).toEqual(Array.from(o.healthcare!.series.icuOccupancy));
  });
});
