/**
 * Glue between the "Fit from counts" panel and the engine's fitting functions: one request
 * (counts, window, count model, measures option) in, the fit, R0 and measures ratio out; and the
 * scenario edit that applies the fitted R0 with its record. No model math of its own.
 */
import { fitGrowth, fitRecordOf, measuresRatioForOption, r0FromFit, periodsOf, type CountModel, type DailyCounts, type FitRecord, type GrowthFit, type MeasuresRatio, type R0FromFit, type Scenario } from '../../engine/index.ts';

export interface FitRequest {
  counts: DailyCounts;
  fromDay: number;
  toDay: number;
  family: CountModel;
  dayOfWeek: boolean;
  /** Name of the option whose measures were in force during the window, or null for none. */
  measuresOption: string | null;
  scenario: Scenario;
}

export interface FitAnswer {
  fit: GrowthFit;
  r0: R0FromFit;
  /** The measures divided out (absent when the analyst said none were in force). */
  measures?: MeasuresRatio;
}

export type FitOutcome = { ok: true; value: FitAnswer } | { ok: false; problems: string[] };

const problemText = (p: { field: string; rule: string; value?: string }): string => `${p.field} ${p.rule}${p.value === undefined ? '' : `, got ${p.value}`}`;

/** Fits r over the window, then R0 for the scenario's periods, dividing out the option's measures if given. */
export function computeFit(req: FitRequest): FitOutcome {
  const fitted = fitGrowth(req.counts, { fromDay: req.fromDay, toDay: req.toDay, family: req.family, dayOfWeek: req.dayOfWeek });
  if (!fitted.ok) return { ok: false, problems: fitted.problems.map(problemText) };
  let measures: MeasuresRatio | undefined;
  if (req.measuresOption !== null) {
    const found = measuresRatioForOption(req.scenario, req.measuresOption, req.fromDay);
    if (!found.ok) return { ok: false, problems: found.problems.map(problemText) };
    measures = found.value;
  }
  const ratio = measures === undefined || measures.phase === null ? undefined : measures.ratio;
  const r0 = r0FromFit(fitted.fit, periodsOf(req.scenario), ratio);
  if (!r0.ok) return { ok: false, problems: r0.problems.map(problemText) };
  return { ok: true, value: { fit: fitted.fit, r0: r0.value, ...(measures === undefined ? {} : { measures }) } };
}

/** The fit record of an answer, for the scenario file and the report. */
export function recordOf(answer: FitAnswer, sourceFile: string, startDate: string | null): FitRecord {
  return fitRecordOf({ sourceFile, startDate, fit: answer.fit, r0: answer.r0, ...(answer.measures === undefined ? {} : { measures: answer.measures }) });
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
