/**
 * The fit of R0 to case counts, start to end, as `mixwise fit` and the app's "Fit from counts"
 * panel both run it: counts placed on the fit's days (scenarioDays.ts) → daily totals → window →
 * count model (negative binomial when the Poisson fit is overdispersed, unless the caller names
 * the model) → growth rate r with its profile interval (fitGrowth.ts) → measures ratio of the
 * option in force on the window's first day (measuresRatio.ts) → R0 with its interval
 * (r0FromFit.ts) → the record kept in the scenario (fitRecord.ts).
 */
import { periodsOf } from '../growth.ts';
import type { Scenario } from '../scenario.ts';
import { formatCsvProblem } from './caseCountsCsv.ts';
import { dailyTotals, type CaseSeries, type DailyCounts } from './caseSeries.ts';
import { fitGrowth, OVERDISPERSION_THRESHOLD, type CountModel, type FitProblem, type GrowthFit } from './fitGrowth.ts';
import { fitRecordOf } from './fitRecord.ts';
import type { FitRecord } from './fitRecordSchema.ts';
import { isoDateToEpochDay } from './isoDate.ts';
import { measuresRatioForOption, type MeasuresRatio } from './measuresRatio.ts';
import { r0FromFit, type R0FromFit } from './r0FromFit.ts';
import { placeOnScenarioDays, type DayPlacement } from './scenarioDays.ts';

/** A window end: a day of the fit (see DayPlacement), or a date YYYY-MM-DD when day 0 has one. */
export type WindowEnd = { day: number } | { date: string };

export interface CaseCountFitRequest {
  series: CaseSeries;
  scenario: Scenario;
  /** Name of the counts file, kept in the record. */
  sourceFile: string;
  /** Window ends, both included; default the first and last day with a count. */
  from?: WindowEnd;
  to?: WindowEnd;
  /** Count model; 'auto' (the default) moves to negative binomial when Poisson is overdispersed. */
  family?: CountModel | 'auto';
  dayOfWeek?: boolean;
  /** Measures in force during the window: an option's (its phase on the window's first day), an explicit ratio, or none. */
  measures?: { option: string } | { ratio: number } | null;
}

export interface CaseCountFit {
  placement: DayPlacement;
  /** Daily totals on the fit's days. */
  counts: DailyCounts;
  fit: GrowthFit;
  r0: R0FromFit;
  /** The option's measures divided out (absent for none or an explicit ratio). */
  measures?: MeasuresRatio;
  /** Why the count model was chosen for the caller ('auto' moved to negative binomial), else null. */
  familyNote: string | null;
  /** The record kept in `disease.fitRecord` if this R0 is used. */
  record: FitRecord;
}

/**
 * Problems in plain lines: `counts` ones are about the file or its window (the CSV line when
 * there is one); `request` ones name the request field (`from`, `to`, `measures`).
 */
export type CaseCountFitResult = { ok: true; value: CaseCountFit } | { ok: false; cause: 'counts' | 'request'; problems: string[] };

const problemText = (p: FitProblem): string => `${p.field} ${p.rule}${p.value === undefined ? '' : `, got ${p.value}`}`;

/** A window end as a day of the fit, or the rule it breaks. */
function windowDay(end: WindowEnd | undefined, placement: DayPlacement): number | undefined | string {
  if (end === undefined) return undefined;
  if ('day' in end) return end.day;
  const epoch = isoDateToEpochDay(end.date);
  if (epoch === null) return `must be a date written YYYY-MM-DD, got ${JSON.stringify(end.date)}`;
  const origin = placement.dayZeroDate === null ? null : isoDateToEpochDay(placement.dayZeroDate);
  if (origin === null) return `must be a day number: the counts file gives day numbers and the scenario has no start date, got ${JSON.stringify(end.date)}`;
  return epoch - origin;
}

/** Runs the whole fit; see the module comment for the steps. */
export function fitCaseCounts(req: CaseCountFitRequest): CaseCountFitResult {
  const placed = placeOnScenarioDays(req.series, req.scenario.startDate ?? null);
  if (!placed.ok) return { ok: false, cause: 'counts', problems: placed.problems.map(formatCsvProblem) };
  const { placement } = placed;
  const fromDay = windowDay(req.from, placement);
  const toDay = windowDay(req.to, placement);
  if (typeof fromDay === 'string' || typeof toDay === 'string') {
    const problems = [typeof fromDay === 'string' ? `from ${fromDay}` : null, typeof toDay === 'string' ? `to ${toDay}` : null];
    return { ok: false, cause: 'request', problems: problems.filter((p) => p !== null) };
  }

  const counts = dailyTotals(placed.series);
  const options = { fromDay, toDay, dayOfWeek: req.dayOfWeek ?? false };
  const auto = (req.family ?? 'auto') === 'auto';
  let fitted = fitGrowth(counts, { ...options, family: auto ? 'poisson' : (req.family as CountModel) });
  if (!fitted.ok) return { ok: false, cause: 'counts', problems: fitted.problems.map(problemText) };
  let familyNote: string | null = null;
  const ratio = fitted.fit.dispersion.pearsonRatio;
  if (auto && ratio !== null && ratio > OVERDISPERSION_THRESHOLD) {
    fitted = fitGrowth(counts, { ...options, family: 'negativeBinomial' });
    if (!fitted.ok) return { ok: false, cause: 'counts', problems: fitted.problems.map(problemText) };
    familyNote = `The counts vary more than Poisson allows (dispersion ${ratio.toFixed(2)}, above ${OVERDISPERSION_THRESHOLD}), so the negative-binomial model is used; its interval is wider.`;
  }
  const fit = fitted.fit;

  let measures: MeasuresRatio | undefined;
  let divideBy: number | undefined;
  if (req.measures != null && 'option' in req.measures) {
    const found = measuresRatioForOption(req.scenario, req.measures.option, fit.fromDay);
    if (!found.ok) return { ok: false, cause: 'request', problems: found.problems.map((p) => `measures ${p.rule}${p.value === undefined ? '' : `, got ${JSON.stringify(p.value)}`}`) };
    measures = found.value;
    divideBy = measures.phase === null ? undefined : measures.ratio;
  } else if (req.measures != null) divideBy = req.measures.ratio;
  const r0 = r0FromFit(fit, periodsOf(req.scenario), divideBy);
  if (!r0.ok) return { ok: false, cause: 'request', problems: r0.problems.map(problemText) };

  const record = fitRecordOf({ sourceFile: req.sourceFile, startDate: placement.dayZeroDate, dayOrigin: placement.origin, fit, r0: r0.value, ...(measures === undefined ? {} : { measures }) });
  return { ok: true, value: { placement, counts, fit, r0: r0.value, ...(measures === undefined ? {} : { measures }), familyNote, record } };
}
