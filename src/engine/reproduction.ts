/**
 * R(t) for days 0..H: spectral radius of K(d) = D diag(S_eff(d)) M(d) (applied, not formed), with S_eff the
 * susceptibles weighted by their risk (vaccine protection included) and M the measures in force.
 * Each day's power iteration starts from the Perron vector extrapolated quadratically from the
 * three days before (3 x_{d-1} - 3 x_{d-2} + x_{d-3}, clipped at 0), much closer than yesterday's
 * vector while S changes fast; in the first days after the measures change, from yesterday's.
 */
import { spectralRadius } from './ngm.ts';
import type { PreparedScenario } from './prepare.ts';
import type { Segment } from './segments.ts';

export function reproductionByDay(p: PreparedScenario, segments: readonly Segment[], effectiveSusceptible: Float64Array): Float64Array {
  const n = p.bands.bands;
  const H = p.scenario.horizonDays;
  const rt = new Float64Array(H + 1);
  const rowScale = new Float64Array(n);
  const D = p.periods.infectiousPeriodDays;
  const vector = new Float64Array(n).fill(1 / n);
  const x1 = new Float64Array(n);
  const x2 = new Float64Array(n);
  const x3 = new Float64Array(n);
  const scratch = new Float64Array(n);
  let seg = 0;
  let measuresSince = 0;
  for (let d = 0; d <= H; d++) {
    while (seg + 1 < segments.length && d >= segments[seg].toDay) {
      seg++;
      if (segments[seg].measuresChange) measuresSince = segments[seg].fromDay;
    }
    if (d - 3 >= measuresSince) {
      for (let i = 0; i < n; i++) vector[i] = Math.max(0, 3 * x1[i] - 3 * x2[i] + x3[i]);
    }
    for (let i = 0; i < n; i++) rowScale[i] = D * effectiveSusceptible[d * n + i];
    rt[d] = spectralRadius(segments[seg].transmission, n, vector, scratch, 1e-7, rowScale);
    x3.set(x2);
    x2.set(x1);
    x1.set(vector);
  }
  return rt;
}
