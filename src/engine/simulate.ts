/**
 * One policy option through the horizon: integrate the SEIR system segment by segment
 * (segments.ts: restarting where the measures or the dose plan change), then derive the outcomes.
 *
 * Deaths by band: IFR_i x (infections_i - Xp_i + f_D Xp_i), with Xp_i the infections of protected
 * people and f_D their relative fatality (vaccination/prepare.ts); without vaccination, IFR x
 * infections. The daily death series convolves the same weighted daily infections with the
 * infection-to-death delay. Hospital demand gets the daily infections weighted by f_H the same way
 * (healthcare/demand.ts reads them from the cumulative infections, so a summary run builds no
 * H x n array of daily infections).
 */
import { weightedBandSum } from './bandTotals.ts';
import { convolve } from './distributions.ts';
import { doublingTimeDays, growthRateFromR, halvingTimeDays } from './growth.ts';
import { healthcareDemandOfRun } from './healthcare/demand.ts';
import { type Accuracy, type DailyState, integrateOption, newDailyState } from './integrateOption.ts';
import { yearsOfLifeLostByBand } from './lifeExpectancy.ts';
import { hasTriggers, measuresConstant, phaseAt } from './phases.ts';
import type { PreparedScenario } from './prepare.ts';
import { reproductionByDay } from './reproduction.ts';
import { optionPath, rootOrRefusal } from './runRefusal.ts';
import type { DailySeries, DailySeriesNoRt, OptionResults, OptionResultsNoRt, OptionSummary, VaccinationOutcomes } from './results.ts';
import type { PolicyOption } from './scenario.ts';
import { type Segment, segmentsOf } from './segments.ts';
import { TriggeredMeasures } from './triggeredMeasures.ts';
import { measureBurden } from './measureBurden.ts';
import { reproductionByPhase } from './rByPhase.ts';
import { finalSizeUnder, rAtDayZero } from './phaseTransmission.ts';
import { type DosePiece, dosesByBandUntil } from './vaccination/dosePlan.ts';
import type { PreparedCampaign } from './vaccination/prepareCampaign.ts';

/** Daily differences of a cumulative series (days 0..H, by band): new counts in [d, d+1), d = 0..H-1. */
function dailyDifferences(cumulative: Float64Array, n: number, H: number): Float64Array {
  const out = new Float64Array(H * n);
  for (let d = 0; d < H; d++) {
    for (let i = 0; i < n; i++) out[d * n + i] = Math.max(0, cumulative[(d + 1) * n + i] - cumulative[d * n + i]);
  }
  return out;
}

/** New infections during each day d in [d, d+1), by band; the day-0 seeds are counted on day 0. */
function dailyIncidence(p: PreparedScenario, cumulative: Float64Array): Float64Array {
  const n = p.bands.bands;
  const incidence = dailyDifferences(cumulative, n, p.scenario.horizonDays);
  for (let i = 0; i < n; i++) incidence[i] += p.seeds[i];
  return incidence;
}

/** incidence - (1 - factor) x protected incidence: infections weighted by their relative risk of an outcome. */
function weightedIncidence(incidence: Float64Array, protectedIncidence: Float64Array | null, factor: number): Float64Array {
  if (protectedIncidence === null) return incidence;
  const out = new Float64Array(incidence.length);
  const avoided = 1 - factor;
  for (let k = 0; k < incidence.length; k++) out[k] = Math.max(0, incidence[k] - avoided * protectedIncidence[k]);
  return out;
}

/** Doses given during each day d (d = 0..H-1) by band, from the plan. */
function dailyDoses(plan: readonly DosePiece[], n: number, H: number): Float64Array {
  const out = new Float64Array(H * n);
  for (const piece of plan) {
    for (let d = Math.floor(piece.fromDay); d < Math.min(H, Math.ceil(piece.toDay)); d++) {
      const span = Math.min(d + 1, piece.toDay) - Math.max(d, piece.fromDay);
      if (span <= 0) continue;
      for (let i = 0; i < n; i++) out[d * n + i] += piece.dosesPerDay[i] * span;
    }
  }
  return out;
}

function sum(values: ArrayLike<number>): number {
  let total = 0;
  for (let i = 0; i < values.length; i++) total += values[i];
  return total;
}

/**
 * A fraction of people (attack rate, prevalence, share of doses) kept in [0, 1]: with very fast
 * growth the integrator's rounding can leave it a few units of 1e-9 outside.
 */
function fraction(x: number): number {
  return Math.min(1, Math.max(0, x));
}

/**
 * The day (0..H) with the most people infected (E + I summed over bands) and that number; the
 * first such day on a tie. Four days are summed together: each day's sum still runs over the
 * bands in ascending order (the same bits as day by day), and the four sums are independent, so
 * their additions overlap instead of waiting on one another.
 */
function peakOfPrevalence(prevalence: Float64Array, n: number, H: number): { day: number; persons: number } {
  let day = 0;
  let persons = -1;
  let d = 0;
  for (; d + 3 <= H; d += 4) {
    const row = d * n;
    let p0 = 0;
    let p1 = 0;
    let p2 = 0;
    let p3 = 0;
    for (let i = 0; i < n; i++) {
      p0 += prevalence[row + i];
      p1 += prevalence[row + n + i];
      p2 += prevalence[row + 2 * n + i];
      p3 += prevalence[row + 3 * n + i];
    }
    if (p0 > persons) {
      persons = p0;
      day = d;
    }
    if (p1 > persons) {
      persons = p1;
      day = d + 1;
    }
    if (p2 > persons) {
      persons = p2;
      day = d + 2;
    }
    if (p3 > persons) {
      persons = p3;
      day = d + 3;
    }
  }
  for (; d <= H; d++) {
    let total = 0;
    for (let i = 0; i < n; i++) total += prevalence[d * n + i];
    if (total > persons) {
      persons = total;
      day = d;
    }
  }
  return { day, persons };
}

/** Doses given within the horizon and the share that reached people no longer susceptible. */
function vaccinationOutcomes(campaign: PreparedCampaign, plan: readonly DosePiece[], n: number, H: number, toNonSusceptible: Float64Array): VaccinationOutcomes {
  const dosesByBand = Array.from(dosesByBandUntil(plan, n, H));
  const doses = sum(dosesByBand);
  return {
    campaign: campaign.campaign.name,
    doses,
    dosesByBand,
    dosesToNonSusceptibleShare: doses > 0 ? fraction(sum(toNonSusceptible) / doses) : 0,
  };
}

/**
 * Daily arrays kept per prepared scenario and campaign for summary runs, which hand none of them
 * out: a summary run writes into the last one's arrays instead of allocating five arrays of
 * (H + 1) x n doubles (about 0.2 MB on the demo) and leaving them to the garbage collector. A run
 * with the same scenario and campaign writes the same entries (integrateOption.ts), so the kept
 * arrays hold nothing of an earlier run that a run reads. One run at a time on a thread.
 */
const keptDaily = new WeakMap<PreparedScenario, Map<PreparedCampaign | null, DailyState>>();

function keptDailyState(p: PreparedScenario, campaign: PreparedCampaign | null): DailyState {
  let byCampaign = keptDaily.get(p);
  if (byCampaign === undefined) {
    byCampaign = new Map();
    keptDaily.set(p, byCampaign);
  }
  let daily = byCampaign.get(campaign);
  if (daily === undefined) {
    daily = newDailyState(p, campaign);
    byCampaign.set(campaign, daily);
  }
  return daily;
}

/**
 * How much of an option run to keep: `full`, every outcome and the daily series (the views'
 * curves, the daily CSV); `summary`, every outcome without the daily series, for the many-run
 * loops that read only outcomes (uncertainty draws, order searches, the options table); `noRt`,
 * every outcome and the daily counts without the daily R(t) (its eigenvalue a day is most of what
 * a full run costs beyond a summary), for readers of daily amounts such as the order search's
 * bounds (vaccination/orderEvaluation.ts). A summary run skips the daily R(t) (the R at the start,
 * R by phase and every other outcome stay), the daily deaths and doses and keeps no per-day
 * arrays; the outcomes of all three equal the full run's bit for bit, and so do the series a
 * `noRt` run keeps (test/engine/summaryRuns.test.ts).
 */
export type SeriesDetail = 'full' | 'summary' | 'noRt';

/**
 * `series`: what to keep (SeriesDetail; default `full`). `accuracy` overrides the integrator's
 * error tolerances (integrator.ts; the defaults are those every view uses), for checks against a
 * tighter solution.
 */
export interface OptionRunSettings {
  series?: SeriesDetail;
  accuracy?: Accuracy;
}

/** Runs one option of a prepared scenario: every outcome and, unless `series: 'summary'`, the daily series (without R(t) for `noRt`). */
export function simulateOption(p: PreparedScenario, option: PolicyOption, settings?: OptionRunSettings & { series?: 'full' }): OptionResults;
export function simulateOption(p: PreparedScenario, option: PolicyOption, settings: OptionRunSettings & { series: 'summary' }): OptionSummary;
export function simulateOption(p: PreparedScenario, option: PolicyOption, settings: OptionRunSettings & { series: 'noRt' }): OptionResultsNoRt;
export function simulateOption(p: PreparedScenario, option: PolicyOption, settings?: OptionRunSettings): OptionSummary | OptionResultsNoRt | OptionResults;
export function simulateOption(p: PreparedScenario, option: PolicyOption, settings: OptionRunSettings = {}): OptionSummary | OptionResultsNoRt | OptionResults {
  const detail = settings.series ?? 'full';
  const s = p.scenario;
  const n = p.bands.bands;
  const H = s.horizonDays;
  const population = p.bands.population;
  const totalPopulation = sum(population);
  const campaign = option.vaccinationCampaign === undefined ? null : (p.campaigns.get(option.vaccinationCampaign) ?? null);
  const plan = campaign?.plan ?? [];
  const fixedSegments = segmentsOf(p, option, plan);
  const triggered = hasTriggers(option)
    ? { measures: new TriggeredMeasures(p, option, campaign?.admissionRiskFactor ?? 1), fixedPhaseAt: (t: number) => phaseAt(option, t), realized: [] as Segment[] }
    : null;
  const daily = integrateOption(p, fixedSegments, campaign, triggered, settings.accuracy, undefined, detail === 'summary' ? keptDailyState(p, campaign) : null);
  const segments = triggered === null ? fixedSegments : triggered.realized;
  const triggers = triggered === null ? [] : triggered.measures.controller.outcomes(H);
  const burden = measureBurden(s, option, triggers);

  const rStart = rootOrRefusal(() => rAtDayZero(p, segments[0].transmission), optionPath(s.options, option.name), option.name, 'on day 0');
  const growthRatePerDay = growthRateFromR(rStart, p.periods);

  const { day: peakDay, persons: peakInfectedPersons } = peakOfPrevalence(daily.prevalence, n, H);

  const deathFactor = campaign?.deathRiskFactor ?? 1;
  const last = H * n;
  const infectionsByBand: number[] = [];
  const attackRateByBand: number[] = [];
  const deathsByBand: number[] = [];
  for (let i = 0; i < n; i++) {
    const x = p.seeds[i] + daily.cumulative[last + i];
    infectionsByBand.push(x);
    attackRateByBand.push(population[i] > 0 ? fraction(x / population[i]) : 0);
    deathsByBand.push((x - (1 - deathFactor) * daily.protectedCumulative[last + i]) * p.infectionFatalityRatio[i]);
  }
  const infections = sum(infectionsByBand);
  const yllByBand = yearsOfLifeLostByBand(deathsByBand, p.remainingLifeExpectancy);

  let finalSize: OptionResults['finalSize'] = null;
  if (campaign === null && measuresConstant(option, H)) {
    const prior = s.initialState.priorImmunityFraction;
    const s0 = new Float64Array(n);
    for (let i = 0; i < n; i++) s0[i] = population[i] > 0 ? 1 - (prior?.[i] ?? 0) : 0;
    const z = finalSizeUnder(p, segments[0].transmission, s0);
    const attackRateByBand: number[] = [];
    let infected = 0;
    for (let i = 0; i < n; i++) {
      attackRateByBand.push(fraction(z[i]));
      infected += z[i] * population[i];
    }
    finalSize = { attackRateByBand, attackRate: fraction(infected / totalPopulation) };
  }

  const summary: OptionSummary = {
    name: option.name,
    rStart,
    growthRatePerDay,
    doublingTimeDays: doublingTimeDays(growthRatePerDay),
    halvingTimeDays: halvingTimeDays(growthRatePerDay),
    peakDay,
    peakInfectedPersons,
    peakPrevalence: fraction(peakInfectedPersons / totalPopulation),
    infections,
    infectionsByBand,
    attackRate: fraction(infections / totalPopulation),
    attackRateByBand,
    deaths: sum(deathsByBand),
    deathsByBand,
    yearsOfLifeLost: sum(yllByBand),
    yearsOfLifeLostByBand: yllByBand,
    finalSize,
    healthcare: p.healthcare === null ? null : healthcareDemandOfRun(p.healthcare, daily.cumulative, p.seeds, campaign === null ? null : daily.protectedCumulative, campaign?.admissionRiskFactor ?? 1),
    vaccination: campaign === null ? null : vaccinationOutcomes(campaign, plan, n, H, daily.dosesToNonSusceptible),
    triggers,
    daysUnderMeasures: burden.daysUnderMeasures,
    rByPhase: reproductionByPhase(p, option, daily.effectiveSusceptible, triggers),
    measureBurden: burden,
    comparison: null,
  };
  if (detail === 'summary') return summary;
  // Daily infections, by band: the series, and the death series through the infection-to-death delay.
  const incidence = dailyIncidence(p, daily.cumulative);
  const protectedIncidence = campaign === null ? null : dailyDifferences(daily.protectedCumulative, n, H);
  const withoutRt: DailySeriesNoRt = {
    days: H,
    bands: n,
    susceptible: daily.susceptible,
    prevalence: daily.prevalence,
    incidence,
    deaths: convolve(weightedBandSum(weightedIncidence(incidence, protectedIncidence, deathFactor), n, p.infectionFatalityRatio), p.deathDelayWeights),
    doses: dailyDoses(plan, n, H),
  };
  if (detail === 'noRt') return { ...summary, series: withoutRt };
  const series: DailySeries = { ...withoutRt, rt: reproductionByDay(p, option, segments, daily.effectiveSusceptible) };
  return { ...summary, series };
}
