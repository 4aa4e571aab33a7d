/**
 * One vaccination order of an option, evaluated: the option run with its campaign's priority
 * replaced by the order (supply, ceilings, efficacies and delay unchanged), its main outcomes, and
 * lower bounds on the searched outcome for every order that starts with the same groups.
 *
 * Why the bounds hold. Let T_k be the time the first dose goes to a band outside the first k
 * groups (the horizon H when none does). The dose plan on [0, T_k] depends only on those k groups
 * (dosePlan.ts hands doses out group by group), so every order that starts with them has the same
 * plan, the same integration segments and hence the same trajectory, bit for bit, up to T_k. Each
 * searched outcome is a sum of non-negative daily amounts (infections, deaths, years of life lost,
 * admissions) or a maximum over days (peak ICU occupancy), and the amounts of the days before
 * D_k = floor(T_k) depend only on that shared trajectory (the delay convolutions are causal). So
 * the part accumulated over days 0..D_k-1 is a lower bound for every such order:
 * - infections: sum of daily new infections, days < D_k;
 * - deaths: per band, IFR_i times the day's infections less (1 - f_D) times an upper bound on
 *   those of protected people (f_D <= 1: relative fatality of a protected person's infection; see
 *   deathBoundByBand); or the deaths of days < D_k, whichever is larger;
 * - years of life lost: the per-band death bound times remaining life expectancy;
 * - admissions: admissions of days < D_k; peak ICU occupancy: the largest occupancy of days < D_k.
 *
 * Cost: the hospital bounds read only the hospital series, which a summary run keeps, so an order
 * searched for admissions or peak ICU occupancy costs a summary run; the others read daily
 * infections, doses, susceptibles and deaths, so they take a run without the daily R(t)
 * (simulate.ts `noRt`), never a full one.
 */
import { simulateOption } from '../simulate.ts';
import type { PreparedScenario } from '../prepare.ts';
import type { OptionResultsNoRt, OptionSummary } from '../results.ts';
import type { PolicyOption } from '../scenario.ts';
import { type PreparedCampaign, prepareCampaign } from './prepareCampaign.ts';

export const ORDER_OUTCOMES = ['deaths', 'infections', 'admissions', 'peakIcuOccupancy', 'yearsOfLifeLost'] as const;
/** An outcome an order can be chosen to minimise. */
export type OrderOutcome = (typeof ORDER_OUTCOMES)[number];

/** The main outcomes of one order (hospital outcomes null without a `healthcare` section). */
export interface OrderOutcomes {
  deaths: number;
  infections: number;
  yearsOfLifeLost: number;
  admissions: number | null;
  peakIcuOccupancy: number | null;
}

/** What a search needs, prepared once: the option, its campaign and the groups to order. */
export interface OrderSearchJob {
  prepared: PreparedScenario;
  option: PolicyOption;
  campaign: PreparedCampaign;
  outcome: OrderOutcome;
  /** The groups being ordered (band indices); the search permutes their indices. */
  groups: number[][];
  /** Groups in which no one is eligible: they never change the plan and stay last. */
  idleGroups: number[][];
}

export interface OrderEvaluation {
  /** The order, as indices into `job.groups`. */
  permutation: number[];
  outcomes: OrderOutcomes;
  /** The searched outcome. */
  value: number;
  /** bounds[k]: lower bound on the searched outcome for every order with the same first k groups (k = 0..m). */
  bounds: number[];
  /** T_k of the module comment, days (k = 0..m). */
  prefixDays: number[];
}

/** The campaign's priority for an order of the job's groups (idle groups last). */
export function priorityOf(job: OrderSearchJob, permutation: readonly number[]): number[][] {
  return [...permutation.map((g) => job.groups[g]), ...job.idleGroups];
}

/** T_k for k = 0..m: first dose time to a band outside the first k groups, else the horizon. */
function prefixDaysOf(job: OrderSearchJob, plan: PreparedCampaign['plan'], permutation: readonly number[]): number[] {
  const H = job.prepared.scenario.horizonDays;
  const firstDose = new Float64Array(job.prepared.bands.bands).fill(H);
  for (const piece of plan) piece.dosesPerDay.forEach((rate, b) => {
    if (rate > 0 && piece.fromDay < firstDose[b]) firstDose[b] = piece.fromDay;
  });
  const days: number[] = [];
  for (let k = 0; k <= permutation.length; k++) {
    let t = H;
    for (let j = k; j < permutation.length; j++) for (const b of job.groups[permutation[j]]) t = Math.min(t, firstDose[b]);
    days.push(t);
  }
  return days;
}

function sumDays(series: Float64Array, days: number): number {
  let total = 0;
  for (let d = 0; d < days; d++) total += series[d];
  return total;
}

/**
 * Per-band lower bound on deaths from the days before `days`. Day d's infections in band i are
 * X_i(d); those of protected people, Xp_i(d), happen at rate s lambda_i P_i, with P_i at most the
 * doses given so far, V_i, while all infections happen at rate at least lambda_i (S_i + s P_i); so
 * Xp_i(d) <= X_i(d) V_i(d+1) / (S_i(d+1) + V_i(d+1)) (V grows and S shrinks during the day), and
 * deaths_i >= IFR_i sum_d (X_i(d) - (1 - f_D) Xp_i(d)).
 */
function deathBoundByBand(job: OrderSearchJob, r: OptionResultsNoRt, days: number): number[] {
  const n = r.series.bands;
  const ifr = job.prepared.infectionFatalityRatio;
  const f = job.campaign.deathRiskFactor;
  const out: number[] = [];
  for (let i = 0; i < n; i++) {
    let total = 0;
    let doses = 0;
    for (let d = 0; d < days; d++) {
      doses += r.series.doses[d * n + i];
      const x = r.series.incidence[d * n + i];
      const protectedShare = doses > 0 ? Math.min(1, doses / (r.series.susceptible[(d + 1) * n + i] + doses)) : 0;
      total += x * (1 - (1 - f) * protectedShare);
    }
    out.push(ifr[i] * total);
  }
  return out;
}

/** True when the bounds of `outcome` read daily series beyond the hospital ones. */
function boundsNeedDailySeries(outcome: OrderOutcome): boolean {
  return outcome === 'infections' || outcome === 'deaths' || outcome === 'yearsOfLifeLost';
}

/** The run's daily series, which the bounds of infections, deaths and years of life lost read. */
function dailySeriesOf(r: OptionSummary | OptionResultsNoRt): OptionResultsNoRt {
  if (!('series' in r)) throw new Error('order bounds: this outcome needs a run with daily series');
  return r;
}

/** Lower bound on the searched outcome from the days before `days`. */
export function outcomeBound(job: OrderSearchJob, r: OptionSummary | OptionResultsNoRt, days: number): number {
  const sum = (xs: readonly number[]) => xs.reduce((a, b) => a + b, 0);
  switch (job.outcome) {
    case 'infections': {
      const s = dailySeriesOf(r).series;
      return sumDays(s.incidence, days * s.bands);
    }
    case 'deaths':
      return Math.max(sum(deathBoundByBand(job, dailySeriesOf(r), days)), sumDays(dailySeriesOf(r).series.deaths, days));
    case 'yearsOfLifeLost': {
      const e = job.prepared.remainingLifeExpectancy;
      return sum(deathBoundByBand(job, dailySeriesOf(r), days).map((x, i) => x * e[i]));
    }
    case 'admissions':
      return r.healthcare === null ? 0 : sumDays(r.healthcare.series.admissions, days);
    case 'peakIcuOccupancy': {
      let peak = 0;
      if (r.healthcare !== null) for (let d = 0; d < days; d++) peak = Math.max(peak, r.healthcare.series.icuOccupancy[d]);
      return peak;
    }
  }
}

export function outcomeValue(outcomes: OrderOutcomes, outcome: OrderOutcome): number {
  return outcomes[outcome] ?? 0;
}

/** Runs the option with its campaign in this order. Pure: the same job and order give the same numbers. */
export function evaluateOrder(job: OrderSearchJob, permutation: readonly number[]): OrderEvaluation {
  const p = job.prepared;
  const campaign = prepareCampaign({ ...job.campaign.campaign, priority: priorityOf(job, permutation) }, p.bands.population, p.scenario.horizonDays);
  const withOrder = { ...p, campaigns: new Map([[campaign.campaign.name, campaign]]) };
  const r = boundsNeedDailySeries(job.outcome) ? simulateOption(withOrder, job.option, { series: 'noRt' }) : simulateOption(withOrder, job.option, { series: 'summary' });
  const outcomes: OrderOutcomes = {
    deaths: r.deaths,
    infections: r.infections,
    yearsOfLifeLost: r.yearsOfLifeLost,
    admissions: r.healthcare?.admissions ?? null,
    peakIcuOccupancy: r.healthcare?.icu.peakOccupancy ?? null,
  };
  const prefixDays = prefixDaysOf(job, campaign.plan, permutation);
  const value = outcomeValue(outcomes, job.outcome);
  // The full order's own value is the tightest bound for itself (k = m).
  const bounds = prefixDays.map((t, k) => (k === permutation.length ? value : Math.min(value, outcomeBound(job, r, Math.floor(t)))));
  return { permutation: [...permutation], outcomes, value, bounds, prefixDays };
}
