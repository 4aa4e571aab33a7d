/**
 * Integrates one option segment by segment and keeps the daily state the outcomes need.
 */
import { Dopri5Workspace, integrate } from './dopri5.ts';
import { initialStateOf } from './prepare.ts';
import type { PreparedScenario } from './prepare.ts';
import { effectiveSusceptibleIn, infectedIn, protectedRisk, seirRightHandSide, stateLayout } from './seir.ts';
import type { Segment } from './segments.ts';
import type { PreparedCampaign } from './vaccination/prepare.ts';

/** Daily state on days 0..H by band (band-major rows), negative rounding noise clipped to 0. */
export interface DailyState {
  susceptible: Float64Array;
  /** S + W + s P: susceptibles weighted by risk, for R(t) (equals S without vaccination). */
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

export function integrateOption(p: PreparedScenario, segments: readonly Segment[], campaign: PreparedCampaign | null): DailyState {
  const n = p.bands.bands;
  const H = p.scenario.horizonDays;
  const L = campaign === null ? p.layout : stateLayout(n, p.periods.latentStages, p.periods.infectiousStages, true);
  const risk = campaign === null ? 1 : protectedRisk(campaign.vaccine);
  const rows = (H + 1) * n;
  const daily: DailyState = {
    susceptible: new Float64Array(rows),
    effectiveSusceptible: new Float64Array(rows),
    prevalence: new Float64Array(rows),
    cumulative: new Float64Array(rows),
    protectedCumulative: new Float64Array(rows),
    dosesToNonSusceptible: new Float64Array(n),
  };
  const record = (day: number, y: Float64Array): void => {
    for (let i = 0; i < n; i++) {
      const at = day * n + i;
      daily.susceptible[at] = Math.max(0, y[L.susceptible + i]);
      daily.effectiveSusceptible[at] = Math.max(0, effectiveSusceptibleIn(y, L, i, risk));
      daily.prevalence[at] = Math.max(0, infectedIn(y, L, i));
      daily.cumulative[at] = Math.max(0, y[L.cumulative + i]);
      if (L.protectedInfections >= 0) daily.protectedCumulative[at] = Math.max(0, y[L.protectedInfections + i]);
    }
  };
  const y = campaign === null ? p.initialState.slice() : initialStateOf(p.scenario, L);
  record(0, y);
  const transmission = new Float64Array(n * n);
  const doseRates = new Float64Array(n);
  const rhs = seirRightHandSide(L, p.periods.latentPeriodDays, p.periods.infectiousPeriodDays, transmission, campaign?.vaccine ?? null, doseRates);
  const ws = new Dopri5Workspace(L.size);
  let step = 0.25;
  for (const seg of segments) {
    transmission.set(seg.transmission);
    doseRates.set(seg.doseRates);
    const days: number[] = [];
    for (let d = Math.floor(seg.fromDay) + 1; d <= seg.toDay; d++) days.push(d);
    step = integrate(rhs, y, seg.fromDay, seg.toDay, days, (t, state) => record(Math.round(t), state), ws, undefined, Math.max(step, 0.05));
  }
  if (L.dosesToNonSusceptible >= 0) for (let i = 0; i < n; i++) daily.dosesToNonSusceptible[i] = Math.max(0, y[L.dosesToNonSusceptible + i]);
  return daily;
}
