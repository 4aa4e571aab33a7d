/**
 * Integrates one option segment by segment and keeps the daily state the outcomes need.
 */
import { DEFAULT_TOLERANCES, integrate, IntegratorWorkspace, REAL_STABILITY_BOUNDARY, type Tolerances } from './integrator.ts';
import { initialStateOf } from './initialState.ts';
import { kernelAvailable, KernelRun } from './optionKernel.ts';
import type { PreparedScenario } from './prepare.ts';
import { protectedRisk, quadratureUnits, seirRightHandSide, type StateLayout, stateLayout } from './seir.ts';
import type { Segment } from './segments.ts';
import type { Phase } from './scenario.ts';
import type { TriggeredMeasures } from './triggeredMeasures.ts';
import type { PreparedCampaign } from './vaccination/prepareCampaign.ts';
import { Unvaccinated } from './vaccination/unvaccinated.ts';

/**
 * Daily state on days 0..H by band (band-major rows), negative rounding noise clipped to 0.
 * E and I stages sit next to each other in the state, so E + I is one run of blocks.
 */
export interface DailyState {
  susceptible: Float64Array;
  /** S + W + s P: susceptibles weighted by risk, for R(t) (without vaccination the same array as `susceptible`). */
  effectiveSusceptible: Float64Array;
  /** E + I. */
  prevalence: Float64Array;
  /** Cumulative infections since day 0 (seeds excluded). */
  cumulative: Float64Array;
  /** Cumulative infections of protected people (zeros without vaccination). */
  protectedCumulative: Float64Array;
  /** Doses given by the end of the horizon to people no longer susceptible, by band (zeros without vaccination). */
  dosesToNonSusceptible: Float64Array;
}

/**
 * The largest step that keeps the explicit method stable on the model's fastest decay: stage
 * exits at rate k_E / T_E, k_I / T_I and protection at 1 / delay. The integrator is stable for
 * h * rate up to REAL_STABILITY_BOUNDARY (3.5) on the negative real axis; three quarters of it
 * leaves a margin (common practice). Without this cap a nearly empty compartment lets the error
 * controller take steps far beyond that limit, and the decaying mode then grows instead.
 */
function largestStableStep(p: PreparedScenario, campaign: PreparedCampaign | null): number {
  const rates = [p.periods.latentStages / p.periods.latentPeriodDays, p.periods.infectiousStages / p.periods.infectiousPeriodDays];
  if (campaign !== null) rates.push(1 / campaign.vaccine.delayToProtectionDays);
  return Math.min(DEFAULT_TOLERANCES.maxStep, (0.75 * REAL_STABILITY_BOUNDARY) / Math.max(...rates));
}

/** Error tolerances that override the integrator's defaults (relative; absolute, persons). */
export type Accuracy = Partial<Pick<Tolerances, 'relative' | 'absolute'>>;

/** The state components the daily record and the triggers read: S, E and I stages, and W, P, Xp, V with vaccination. */
function denseComponentsOf(L: StateLayout): Int32Array {
  const blocks = [L.susceptible, ...Array.from({ length: L.latentStages + L.infectiousStages }, (_, k) => L.latent + k * L.bands)];
  if (L.waiting >= 0) blocks.push(L.waiting, L.protectedSusceptible, L.protectedInfections);
  if (L.vaccineImmune >= 0) blocks.push(L.vaccineImmune);
  return Int32Array.from(blocks.flatMap((b) => Array.from({ length: L.bands }, (_, i) => b + i)));
}

/** Zeroed daily arrays for a run of `p` with `campaign`. */
export function newDailyState(p: PreparedScenario, campaign: PreparedCampaign | null): DailyState {
  const n = p.bands.bands;
  const rows = (p.scenario.horizonDays + 1) * n;
  const susceptibleRows = new Float64Array(rows);
  return {
    susceptible: susceptibleRows,
    // Without vaccination S_eff = S: the same array.
    effectiveSusceptible: campaign === null ? susceptibleRows : new Float64Array(rows),
    prevalence: new Float64Array(rows),
    cumulative: new Float64Array(rows),
    protectedCumulative: new Float64Array(rows),
    dosesToNonSusceptible: new Float64Array(n),
  };
}

/**
 * Which code integrates an option: the WebAssembly kernel (optionKernel.ts, the same steps in the
 * same arithmetic, about 4 times faster) or the TypeScript integrator (integrator.ts with
 * seir.ts), where WebAssembly cannot compile the kernel.
 */
export type Integration = 'kernel' | 'typescript';

/**
 * Integrates an option over its segments. With `triggered`, the measures also change on the days
 * its triggers decide (checked at every whole day): the integration stops there, the transmission
 * matrix is rebuilt for the measures then in force, and it restarts. `realized` receives the
 * segments as they were actually run (cut at every switch), for R(t). `into`: arrays from
 * `newDailyState(p, campaign)` to write into instead of new ones, for a caller that keeps them
 * between runs (a run with the same p and campaign writes the same entries, every day 0..H).
 */
export function integrateOption(
  p: PreparedScenario,
  segments: readonly Segment[],
  campaign: PreparedCampaign | null,
  triggered: { measures: TriggeredMeasures; fixedPhaseAt: (t: number) => Phase | null; realized: Segment[] } | null = null,
  accuracy: Accuracy = {},
  integration: Integration = kernelAvailable() ? 'kernel' : 'typescript',
  into: DailyState | null = null,
): DailyState {
  const n = p.bands.bands;
  const H = p.scenario.horizonDays;
  const L = campaign === null ? p.layout : stateLayout(n, p.periods.latentStages, p.periods.infectiousStages, campaign.vaccine.protection);
  // X is not integrated: X = S(0) - S, and with vaccination X = (S + W + P + V)(0) - (S + W + P + V) (seir.ts).
  const s0 = p.initialSusceptible;
  const risk = campaign === null ? 1 : protectedRisk(campaign.vaccine);
  // Xp and Q are held in units of 1% of the band (seir.ts).
  const unit = quadratureUnits(p.scenario.populationPersons);
  const daily = into ?? newDailyState(p, campaign);
  const { susceptible, effectiveSusceptible, prevalence, cumulative, protectedCumulative } = daily;
  const { susceptible: oS, latent: oE, waiting: oW, protectedSusceptible: oP, vaccineImmune: oV, protectedInfections: oXp } = L;
  const infectedBlocks = L.latentStages + L.infectiousStages;
  const record = (day: number, y: Float64Array): void => {
    const base = day * n;
    for (let i = 0; i < n; i++) {
      const s = y[oS + i];
      let infected = 0;
      for (let k = 0; k < infectedBlocks; k++) infected += y[oE + k * n + i];
      susceptible[base + i] = s > 0 ? s : 0;
      prevalence[base + i] = infected > 0 ? infected : 0;
      let x = s0[i] - s;
      if (oW >= 0) {
        const w = y[oW + i];
        const pr = y[oP + i];
        x -= w + pr + (oV >= 0 ? y[oV + i] : 0);
        const eff = s + w + risk * pr;
        effectiveSusceptible[base + i] = eff > 0 ? eff : 0;
        const xp = y[oXp + i] * unit[i];
        protectedCumulative[base + i] = xp > 0 ? xp : 0;
      }
      cumulative[base + i] = x > 0 ? x : 0;
    }
  };
  const y = campaign === null ? p.initialState.slice(0, L.active) : initialStateOf(p.scenario, L);
  const transmission = new Float64Array(n * n);
  const doses = campaign === null ? null : new Unvaccinated(p.scenario.populationPersons);
  const tolerances = { ...DEFAULT_TOLERANCES, ...accuracy, maxStep: largestStableStep(p, campaign) };
  let step = 0.25;
  const firstStep = (): number => Math.min(tolerances.maxStep, Math.max(step, 0.05));
  /**
   * Integrates from `from` to `to` with `transmission` and `doses` as they are now, recording
   * each whole day; `watch` sees each day's state and stops there by returning true. Returns the
   * day it stopped at, or null when it reached `to`.
   */
  let advance: (from: number, to: number, watch: ((day: number, state: Float64Array) => boolean) | null) => number | null;
  let finish = (): void => {};
  if (integration === 'kernel') {
    const run = new KernelRun(L, p.periods.latentPeriodDays, p.periods.infectiousPeriodDays, H, y, s0, tolerances, campaign?.vaccine ?? null, doses);
    run.copyDay(0, daily);
    advance = (from, to, watch) => {
      step = run.integrate(from, to, firstStep(), transmission, doses, watch, daily);
      return run.stoppedAt;
    };
    finish = () => {
      run.copyAll(daily);
      run.copyState(y);
    };
  } else {
    record(0, y);
    const rhs = seirRightHandSide(L, p.periods.latentPeriodDays, p.periods.infectiousPeriodDays, transmission, campaign?.vaccine ?? null, doses, false);
    const ws = new IntegratorWorkspace(y.length);
    const days = new Float64Array(H);
    for (let d = 0; d < H; d++) days[d] = d + 1;
    const dense = denseComponentsOf(L);
    advance = (from, to, watch) => {
      const sink = (t: number, state: Float64Array): boolean => {
        const d = Math.round(t);
        record(d, state);
        return watch !== null && watch(d, state);
      };
      step = integrate(rhs, y, from, to, days, sink, ws, tolerances, firstStep(), dense, L.active);
      return ws.stoppedAt;
    };
  }
  if (triggered === null) {
    for (const seg of segments) {
      transmission.set(seg.transmission);
      doses?.enter(seg.fromDay, seg.doseRates);
      advance(seg.fromDay, seg.toDay, null);
    }
  } else {
    const { measures, fixedPhaseAt, realized } = triggered;
    let switched = measures.atDay(0, y, daily);
    const watch = (d: number, state: Float64Array): boolean => d < H && measures.atDay(d, state, daily);
    for (const seg of segments) {
      doses?.enter(seg.fromDay, seg.doseRates);
      let from = seg.fromDay;
      while (from < seg.toDay) {
        const inForce = measures.transmissionWith(fixedPhaseAt(from));
        transmission.set(inForce);
        const measuresChange = (from === seg.fromDay && seg.measuresChange) || switched;
        realized.push({ fromDay: from, toDay: seg.toDay, transmission: inForce, doseRates: seg.doseRates, measuresChange });
        const stoppedAt = advance(from, seg.toDay, watch);
        switched = stoppedAt !== null;
        from = stoppedAt ?? seg.toDay;
        realized[realized.length - 1].toDay = from;
      }
    }
  }
  finish();
  if (L.dosesToNonSusceptible >= 0) for (let i = 0; i < n; i++) daily.dosesToNonSusceptible[i] = Math.max(0, y[L.dosesToNonSusceptible + i] * unit[i]);
  return daily;
}
