/**
 * One policy option through the horizon: integrate the SEIR system phase by phase (restarting
 * the integrator where the measures change, since the right-hand side jumps there), record the
 * daily state, then derive the outcomes.
 */
import { integrate, Dopri5Workspace } from './dopri5.ts';
import { convolve, weightedBandSum } from './distributions.ts';
import { finalSizeByBand } from './finalSize.ts';
import { doublingTimeDays, growthRateFromR, halvingTimeDays } from './growth.ts';
import { healthcareDemand } from './healthcare/demand.ts';
import { nextGenerationMatrixInto, spectralRadius } from './ngm.ts';
import { changeDays, measuresConstant, phaseAt } from './phases.ts';
import type { PreparedScenario } from './prepare.ts';
import type { DailySeries, OptionResults } from './results.ts';
import type { PolicyOption } from './scenario.ts';
import { infectedIn, seirRightHandSide } from './seir.ts';
import { transmissionMatrixInto } from './transmission.ts';

/** Daily state kept from the integration: susceptibles, infected (E+I), cumulative infections. */
interface DailyState {
  susceptible: Float64Array;
  prevalence: Float64Array;
  cumulative: Float64Array;
}

/** A stretch of days with the same measures and its transmission matrix M. */
interface Segment {
  fromDay: number;
  toDay: number;
  transmission: Float64Array;
}

function segmentsOf(p: PreparedScenario, option: PolicyOption): Segment[] {
  const s = p.scenario;
  const n = p.bands.bands;
  const bounds = [0, ...changeDays(option, s.horizonDays), s.horizonDays];
  const segments: Segment[] = [];
  for (let k = 0; k + 1 < bounds.length; k++) {
    const phase = phaseAt(option, bounds[k]);
    segments.push({ fromDay: bounds[k], toDay: bounds[k + 1], transmission: transmissionMatrixInto(new Float64Array(n * n), s, p.bands, p.beta, phase) });
  }
  return segments;
}

/** Integrates the option and returns the state on days 0..H (negative rounding noise clipped to 0). */
function integrateDaily(p: PreparedScenario, segments: Segment[]): DailyState {
  const L = p.layout;
  const n = L.bands;
  const H = p.scenario.horizonDays;
  const daily: DailyState = {
    susceptible: new Float64Array((H + 1) * n),
    prevalence: new Float64Array((H + 1) * n),
    cumulative: new Float64Array((H + 1) * n),
  };
  const record = (day: number, y: Float64Array): void => {
    for (let i = 0; i < n; i++) {
      daily.susceptible[day * n + i] = Math.max(0, y[L.susceptible + i]);
      daily.prevalence[day * n + i] = Math.max(0, infectedIn(y, L, i));
      daily.cumulative[day * n + i] = Math.max(0, y[L.cumulative + i]);
    }
  };
  const y = p.initialState.slice();
  record(0, y);
  const transmission = new Float64Array(n * n);
  const rhs = seirRightHandSide(L, p.periods.latentPeriodDays, p.periods.infectiousPeriodDays, transmission);
  const ws = new Dopri5Workspace(L.size);
  let step = 0.25;
  for (const seg of segments) {
    transmission.set(seg.transmission);
    const days: number[] = [];
    for (let d = seg.fromDay + 1; d <= seg.toDay; d++) days.push(d);
    step = integrate(rhs, y, seg.fromDay, seg.toDay, days, (t, state) => record(Math.round(t), state), ws, undefined, Math.max(step, 0.05));
  }
  return daily;
}

/**
 * R(t) for days 0..H: spectral radius of K(d) = D diag(S(d)) M(d). Each day's power iteration
 * starts from the Perron vector extrapolated quadratically from the three days before
 * (3 x_{d-1} - 3 x_{d-2} + x_{d-3}, clipped at 0), much closer than yesterday's vector while S
 * changes fast; within the first days of a phase, from yesterday's vector.
 */
function reproductionByDay(p: PreparedScenario, segments: Segment[], susceptible: Float64Array): Float64Array {
  const n = p.bands.bands;
  const H = p.scenario.horizonDays;
  const rt = new Float64Array(H + 1);
  const k = new Float64Array(n * n);
  const vector = new Float64Array(n).fill(1 / n);
  const x1 = new Float64Array(n);
  const x2 = new Float64Array(n);
  const x3 = new Float64Array(n);
  const scratch = new Float64Array(n);
  let seg = 0;
  for (let d = 0; d <= H; d++) {
    while (seg + 1 < segments.length && d >= segments[seg].toDay) seg++;
    if (d >= 3 && segments[seg].fromDay <= d - 3) {
      for (let i = 0; i < n; i++) vector[i] = Math.max(0, 3 * x1[i] - 3 * x2[i] + x3[i]);
    }
    nextGenerationMatrixInto(k, segments[seg].transmission, susceptible.subarray(d * n, (d + 1) * n), p.periods.infectiousPeriodDays);
    rt[d] = spectralRadius(k, n, vector, scratch);
    x3.set(x2);
    x2.set(x1);
    x1.set(vector);
  }
  return rt;
}

/** New infections during each day d in [d, d+1), by band; the day-0 seeds are counted on day 0. */
function dailyIncidence(p: PreparedScenario, cumulative: Float64Array): Float64Array {
  const n = p.bands.bands;
  const H = p.scenario.horizonDays;
  const incidence = new Float64Array(H * n);
  for (let d = 0; d < H; d++) {
    for (let i = 0; i < n; i++) incidence[d * n + i] = Math.max(0, cumulative[(d + 1) * n + i] - cumulative[d * n + i]);
  }
  for (let i = 0; i < n; i++) incidence[i] += p.seeds[i];
  return incidence;
}

function sum(values: ArrayLike<number>): number {
  let total = 0;
  for (let i = 0; i < values.length; i++) total += values[i];
  return total;
}

/** Runs one option of a prepared scenario. */
export function simulateOption(p: PreparedScenario, option: PolicyOption): OptionResults {
  const s = p.scenario;
  const n = p.bands.bands;
  const H = s.horizonDays;
  const population = p.bands.population;
  const totalPopulation = sum(population);
  const segments = segmentsOf(p, option);
  const daily = integrateDaily(p, segments);

  const kStart = nextGenerationMatrixInto(new Float64Array(n * n), segments[0].transmission, p.initialSusceptible, p.periods.infectiousPeriodDays);
  // Certified to 1e-12 by the Collatz-Wielandt bracket; ml-matrix is the fallback inside.
  const rStart = spectralRadius(kStart, n, new Float64Array(n).fill(1 / n), new Float64Array(n), 1e-12);
  const growthRatePerDay = growthRateFromR(rStart, p.periods);

  let peakDay = 0;
  let peakInfectedPersons = -1;
  for (let d = 0; d <= H; d++) {
    const infected = sum(daily.prevalence.subarray(d * n, (d + 1) * n));
    if (infected > peakInfectedPersons) {
      peakInfectedPersons = infected;
      peakDay = d;
    }
  }

  const infectionsByBand = Array.from({ length: n }, (_, i) => p.seeds[i] + daily.cumulative[H * n + i]);
  const attackRateByBand = infectionsByBand.map((x, i) => (population[i] > 0 ? x / population[i] : 0));
  const deathsByBand = infectionsByBand.map((x, i) => x * p.infectionFatalityRatio[i]);
  const infections = sum(infectionsByBand);

  const incidence = dailyIncidence(p, daily.cumulative);
  const series: DailySeries = {
    days: H,
    bands: n,
    susceptible: daily.susceptible,
    prevalence: daily.prevalence,
    incidence,
    deaths: convolve(weightedBandSum(incidence, n, p.infectionFatalityRatio), p.deathDelayWeights),
    rt: reproductionByDay(p, segments, daily.susceptible),
  };

  let finalSize: OptionResults['finalSize'] = null;
  if (measuresConstant(option, H)) {
    const s0 = Array.from(population, (N, i) => (N > 0 ? 1 - (s.initialState.priorImmunityFraction?.[i] ?? 0) : 0));
    const z = Array.from(finalSizeByBand(segments[0].transmission, population, s0, p.periods.infectiousPeriodDays));
    finalSize = { attackRateByBand: z, attackRate: sum(z.map((x, i) => x * population[i])) / totalPopulation };
  }

  return {
    name: option.name,
    rStart,
    growthRatePerDay,
    doublingTimeDays: doublingTimeDays(growthRatePerDay),
    halvingTimeDays: halvingTimeDays(growthRatePerDay),
    peakDay,
    peakInfectedPersons,
    peakPrevalence: peakInfectedPersons / totalPopulation,
    infections,
    infectionsByBand,
    attackRate: infections / totalPopulation,
    attackRateByBand,
    deaths: sum(deathsByBand),
    deathsByBand,
    finalSize,
    series,
    healthcare: p.healthcare === null ? null : healthcareDemand(p.healthcare, incidence),
  };
}
