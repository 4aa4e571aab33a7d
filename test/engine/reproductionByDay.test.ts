/**
 * R(t) day by day (reproduction.ts) and its accelerated power iteration (ngm.ts
 * `scaledSpectralRadius`) against perronRoot (Noda's iteration, perronRoot.ts) on K written out:
 * the days certified from an extrapolated vector and product, and the Aitken-extrapolated iterates,
 * must give the same R to REPRODUCTION_TOLERANCE, and the product handed back must be M x.
 */
import { describe, expect, it } from 'vitest';
import { integrateOption } from '../../src/engine/integrateOption.ts';
import { scaledSpectralRadius } from '../../src/engine/ngm.ts';
import { perronRoot } from '../../src/engine/perronRoot.ts';
import { prepareScenario } from '../../src/engine/prepare.ts';
import { REPRODUCTION_TOLERANCE, reproductionByDay } from '../../src/engine/reproduction.ts';
import { segmentsOf } from '../../src/engine/segments.ts';
import { demoScenario } from '../helpers/demo.ts';
import { seededRandom } from '../helpers/random.ts';

/** diag(scale) M written out, row-major. */
function scaled(m: Float64Array, scale: ArrayLike<number>, n: number): Float64Array {
  const out = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) out[i * n + j] = scale[i] * m[i * n + j];
  return out;
}

describe('scaledSpectralRadius', () => {
  it('agrees with perronRoot and hands back M x, also where the second eigenvalue is close to the first', () => {
    const rand = seededRandom(7);
    for (let trial = 0; trial < 40; trial++) {
      const n = 2 + Math.floor(rand() * 15);
      // Two blocks joined weakly (every other trial): a second eigenvalue near the first, slow power iteration.
      const coupling = trial % 2 === 0 ? 1 : 0.02;
      const m = new Float64Array(n * n);
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) m[i * n + j] = rand() * ((i < n / 2) === (j < n / 2) ? 1 : coupling);
      const scale = Float64Array.from({ length: n }, () => 0.2 + rand());
      const vector = Float64Array.from({ length: n }, () => rand());
      const product = new Float64Array(n);
      const r = scaledSpectralRadius(m, n, scale, vector, product, new Float64Array(5 * n), 1e-9);
      const expected = perronRoot(scaled(m, scale, n), n);
      expect(Math.abs(r - expected) / expected).toBeLessThan(1e-9);
      for (let i = 0; i < n; i++) {
        let mx = 0;
        for (let j = 0; j < n; j++) mx += m[i * n + j] * vector[j];
        expect(Math.abs(product[i] - mx)).toBeLessThan(1e-12 * mx);
      }
    }
  });
});

describe('R(t) day by day', () => {
  it('matches perronRoot of diag(D S_eff) M every day of every demo option', () => {
    const scenario = demoScenario();
    const p = prepareScenario(scenario);
    const n = p.bands.bands;
    const D = p.periods.infectiousPeriodDays;
    for (const option of scenario.options) {
      const campaign = option.vaccinationCampaign === undefined ? null : (p.campaigns.get(option.vaccinationCampaign) ?? null);
      const segments = segmentsOf(p, option, campaign?.plan ?? []);
      const susceptible = integrateOption(p, segments, campaign).effectiveSusceptible;
      const rt = reproductionByDay(p, option, segments, susceptible);
      let seg = 0;
      for (let d = 0; d <= scenario.horizonDays; d++) {
        while (seg + 1 < segments.length && d >= segments[seg].toDay) seg++;
        const scale = Array.from(susceptible.subarray(d * n, (d + 1) * n), (s) => D * s);
        const expected = perronRoot(scaled(segments[seg].transmission, scale, n), n);
        expect(Math.abs(rt[d] - expected) / expected, `${option.name}, day ${d}`).toBeLessThan(REPRODUCTION_TOLERANCE);
      }
    }
  });
});
