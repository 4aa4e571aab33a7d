/**
 * Glue between the "Fit from counts" panel and the engine's `fitCaseCounts` (the same fit
 * `mixwise fit` runs): one request in, the fit, R0, measures ratio and record out; and the
 * scenario edit that applies the fitted R0 with its record. No model math of its own.
 */
import { fitCaseCounts, type CaseCountFit, type CaseSeries, type CountModel, type FitRecord, type Scenario } from '../../engine/index.ts';

export interface FitRequest {
  series: CaseSeries;
  fileName: string;
  /** Window ends, days of the fit (the scenario's days when the counts are placed on them). */
  fromDay: number;
  toDay: number;
  /** 'auto' until the analyst picks a count model. */
  family: CountModel | 'auto';
  dayOfWeek: boolean;
  /** Name of the option whose measures were in force during the window, or null for none. */
  measuresOption: string | null;
  scenario: Scenario;
}

export type FitAnswer = CaseCountFit;

export type FitOutcome = { ok: true; value: FitAnswer } | { ok: false; problems: string[] };

/** Fits r over the window, then R0 for the scenario's periods, dividing out the option's measures if given. */
export function computeFit(req: FitRequest): FitOutcome {
  const result = fitCaseCounts({
    series: req.series,
    scenario: req.scenario,
    sourceFile: req.fileName,
    from: { day: req.fromDay },
    to: { day: req.toDay },
    family: req.family,
    dayOfWeek: req.dayOfWeek,
    measures: req.measuresOption === null ? null : { option: req.measuresOption },
  });
  return result.ok ? result : { ok: false, problems: result.problems };
}

/**
 * R0 rounded to the digits its 95% interval supports: one decimal place beyond the first one the
 * interval's half-width reaches (half-width 0.17 → 2 decimals, 0.02 → 3), at least 1 and at most 3
 * decimals; 2 decimals when the interval is open. Rounding to the uncertainty plus one digit is
 * common practice for reported estimates.
 */
export function r0RoundedToFit(r0: number, interval: readonly [number | null, number | null]): number {
  const [lo, hi] = interval;
  const half = lo !== null && hi !== null && Number.isFinite(lo) && Number.isFinite(hi) ? (hi - lo) / 2 : Number.NaN;
  const decimals = half > 0 ? Math.min(3, Math.max(1, 1 - Math.floor(Math.log10(half)))) : 2;
  return Number(r0.toFixed(decimals));
}

/**
 * A copy of the scenario whose transmission is fixed by the fitted R0 (rounded to what the fit
 * supports), with the record, carrying that same R0, kept beside it.
 */
export function scenarioWithFittedR0(scenario: Scenario, record: FitRecord): Scenario {
  const r0 = r0RoundedToFit(record.r0, record.r0Interval);
  const next = structuredClone(scenario);
  next.disease.transmission = { kind: 'r0', r0 };
  next.disease.fitRecord = { ...record, r0 };
  return next;
}
