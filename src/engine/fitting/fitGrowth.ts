/**
 * Exponential growth rate r (per day) from daily case counts over a window [fromDay, toDay]
 * (both inclusive): maximum likelihood for ln E[y_t] = a + r (t - t̄) (+ weekday factors), with
 * Poisson or negative-binomial (NB2) counts, a 95% profile-likelihood interval for r, the Wald
 * standard error, the Pearson dispersion statistic, doubling/halving times and the fitted curve.
 * Formulas and sources are in the modules used: logLinkGlm (IRLS), negativeBinomialFit,
 * growthProfile and profileInterval, growthDesign, timeScales; work budgets in fitBudget.
 */
import type { DailyCounts } from './caseSeries.ts';
import { countFamily, countTable } from './countLikelihoods.ts';
import { EvaluationBudget, FIT_EVALUATIONS } from './fitBudget.ts';
import { designRow, growthDesign, weekdayClass } from './growthDesign.ts';
import { growthRateProfileInterval } from './growthProfile.ts';
import { fitLogLinkGlm, type GlmData } from './logLinkGlm.ts';
import { fitNegativeBinomial, type NegativeBinomialResult } from './negativeBinomialFit.ts';
import { timeScales, type GrowthStatus } from './timeScales.ts';

export type CountModel = 'poisson' | 'negativeBinomial';

export interface FitGrowthOptions {
  /** First day of the window (inclusive); default the first day with a count. */
  fromDay?: number;
  /** Last day of the window (inclusive); default the last day with a count. */
  toDay?: number;
  /** Add six weekday indicator columns (reporting pattern within the week). Default false. */
  dayOfWeek?: boolean;
  /** Count model. Default 'poisson'. */
  family?: CountModel;
}

/** One day of the fitted curve: expected count and its pointwise 95% Wald band (exp(η ± 1.96 SE(η))). */
export interface FittedPoint {
  day: number;
  observed: number | null;
  expected: number;
  lower: number;
  upper: number;
}

export interface GrowthFit {
  family: CountModel;
  fromDay: number;
  toDay: number;
  dayOfWeek: boolean;
  /** Days in the window that have a count, and the cases on them. */
  daysUsed: number;
  casesInWindow: number;
  /** Maximum-likelihood r, per day. */
  growthRatePerDay: number;
  /** Wald standard error of r from the inverse expected information, per day. */
  growthRateStandardError: number;
  /** 95% profile-likelihood interval for r, per day (an end may be ±Infinity if not reached within ±20/day, or not determined). */
  growthRateInterval: [number, number];
  /** Per end of that interval, null when found (or unbounded), else why it was not determined (that end is then ±Infinity). */
  growthRateIntervalNotDetermined: [string | null, string | null];
  status: GrowthStatus;
  doublingTimeDays: number | null;
  doublingTimeInterval: [number, number | null] | null;
  halvingTimeDays: number | null;
  halvingTimeInterval: [number, number | null] | null;
  dispersion: {
    /** Pearson X² / (n - p) of the Poisson fit; ≈ 1 for Poisson counts, null when n = p. */
    pearsonRatio: number | null;
    /** NB2 α (Var = mu + α mu², per case) by maximum likelihood; null for the Poisson family. */
    negativeBinomialAlpha: number | null;
  };
  /** exp(d_k) for weekday classes 0..6 (class 0 = weekday of fromDay, factor 1), or null. */
  dayOfWeekFactors: number[] | null;
  logLikelihood: number;
  fitted: FittedPoint[];
  /** Plain-language method notes for the report. */
  notes: string[];
}

export interface FitProblem {
  field: string;
  rule: string;
  value?: string;
}

export type FitGrowthResult = { ok: true; fit: GrowthFit } | { ok: false; problems: FitProblem[] };

/** Pearson ratio above this suggests overdispersion (common practice, no single source). */
export const OVERDISPERSION_THRESHOLD = 1.5;

const Z_975 = 1.959963984540054;

function checkInput(counts: DailyCounts, from: number, to: number): FitProblem[] {
  const problems: FitProblem[] = [];
  if (counts.day.length !== counts.count.length) {
    problems.push({ field: 'counts', rule: 'day and count lists must have the same length' });
    return problems;
  }
  counts.count.forEach((c, i) => {
    if (!(Number.isInteger(c) && c >= 0)) problems.push({ field: `counts.count[${i}]`, rule: 'must be a whole number >= 0', value: String(c) });
  });
  counts.day.forEach((d, i) => {
    if (!Number.isInteger(d)) problems.push({ field: `counts.day[${i}]`, rule: 'must be a whole day number', value: String(d) });
  });
  if (new Set(counts.day).size !== counts.day.length) problems.push({ field: 'counts.day', rule: 'must not repeat a day' });
  if (!Number.isInteger(from)) problems.push({ field: 'fromDay', rule: 'must be a whole day number', value: String(from) });
  if (!Number.isInteger(to)) problems.push({ field: 'toDay', rule: 'must be a whole day number', value: String(to) });
  if (!(to > from)) problems.push({ field: 'toDay', rule: `must be after fromDay (${from})`, value: String(to) });
  return problems;
}

function checkWindow(days: number[], y: number[], from: number, to: number, dayOfWeek: boolean): FitProblem[] {
  const window = `window days ${from}..${to}`;
  const positiveDays = new Set(days.filter((_, i) => y[i] > 0));
  if (days.length < 2) return [{ field: 'window', rule: `must hold counts on at least 2 days (${window} has ${days.length})` }];
  if (positiveDays.size < 2) return [{ field: 'window', rule: `must have cases on at least 2 different days, else r is infinite or undefined (${window} has ${positiveDays.size})` }];
  if (!dayOfWeek) return [];
  const problems: FitProblem[] = [];
  if (days.length < 8) problems.push({ field: 'dayOfWeek', rule: `needs counts on at least 8 days of the window (has ${days.length})` });
  for (let k = 0; k < 7; k++) {
    if (!days.some((d, i) => weekdayClass(d, from) === k && y[i] > 0)) {
      problems.push({ field: 'dayOfWeek', rule: `needs cases on at least one day of each weekday; none on days ${from + k}, ${from + k + 7}, ... of the ${window}` });
    }
  }
  return problems;
}

/** Series that no window can fit, with the reason in plain words; null when there is something to fit. */
function seriesProblemOf(counts: DailyCounts): FitProblem | null {
  if (counts.day.length === 0) return { field: 'counts', rule: 'must not be empty' };
  if (counts.day.length === 1) return { field: 'counts', rule: `must cover at least 2 days to show growth (the file has counts for day ${counts.day[0]} only)` };
  if (counts.count.every((c) => c === 0)) return { field: 'counts', rule: `must include some cases: all ${counts.count.length} days have 0, so there is no growth to fit` };
  return null;
}

/** Fits r over the window with the chosen count model. */
export function fitGrowth(counts: DailyCounts, options: FitGrowthOptions = {}): FitGrowthResult {
  const seriesProblem = seriesProblemOf(counts);
  if (seriesProblem !== null) return { ok: false, problems: [seriesProblem] };
  // Loops, not Math.min(...days): spreading a long series exhausts the call stack.
  let firstDay = Infinity;
  let lastDay = -Infinity;
  for (const d of counts.day) {
    if (d < firstDay) firstDay = d;
    if (d > lastDay) lastDay = d;
  }
  const fromDay = options.fromDay ?? firstDay;
  const toDay = options.toDay ?? lastDay;
  const dayOfWeek = options.dayOfWeek ?? false;
  const family = options.family ?? 'poisson';
  const inputProblems = checkInput(counts, fromDay, toDay);
  if (inputProblems.length > 0) return { ok: false, problems: inputProblems };

  const inWindow = counts.day.map((d, i) => ({ d, c: counts.count[i] })).filter((p) => p.d >= fromDay && p.d <= toDay).sort((a, b) => a.d - b.d);
  const days = inWindow.map((p) => p.d);
  const y = inWindow.map((p) => p.c);
  const windowProblems = checkWindow(days, y, fromDay, toDay, dayOfWeek);
  if (windowProblems.length > 0) return { ok: false, problems: windowProblems };

  const design = growthDesign(days, fromDay, dayOfWeek);
  const data: GlmData = { x: design.x, y, offset: days.map(() => 0) };
  const table = countTable(y);
  const budget = new EvaluationBudget(FIT_EVALUATIONS);
  const poisson = fitLogLinkGlm(data, countFamily(0, table), { budget });
  if (!poisson.ok) return { ok: false, problems: [{ field: 'window', rule: `cannot be fitted: ${poisson.reason}` }] };
  const main: NegativeBinomialResult = family === 'poisson' ? { ok: true, fit: poisson.fit, alpha: 0 } : fitNegativeBinomial(data, { table, budget });
  if (!main.ok) return { ok: false, problems: [{ field: 'window', rule: `cannot be fitted: ${main.reason}` }] };
  const { fit, alpha } = main;
  const r = fit.coefficients[1];
  const se = Math.sqrt(fit.covariance[1][1]);
  const profiled = growthRateProfileInterval({
    design,
    y,
    table,
    negativeBinomial: family === 'negativeBinomial',
    coefficients: fit.coefficients,
    alpha,
    logLikelihood: fit.logLikelihood,
    standardError: se,
  });
  const { interval, notDetermined } = profiled;

  const p = design.x[0].length;
  const pearsonSum = y.reduce((s, yi, i) => s + (yi - poisson.fit.mu[i]) ** 2 / poisson.fit.mu[i], 0);
  const pearsonRatio = y.length > p ? pearsonSum / (y.length - p) : null;

  const observed = new Map(days.map((d, i) => [d, y[i]]));
  const fitted: FittedPoint[] = [];
  for (let day = fromDay; day <= toDay; day++) {
    const row = designRow(day, design.centreDay, dayOfWeek, fromDay);
    const eta = row.reduce((s, v, j) => s + v * fit.coefficients[j], 0);
    const varEta = row.reduce((s, v, j) => s + v * row.reduce((t, w, k) => t + fit.covariance[j][k] * w, 0), 0);
    const half = Z_975 * Math.sqrt(Math.max(0, varEta));
    fitted.push({ day, observed: observed.get(day) ?? null, expected: Math.exp(eta), lower: Math.exp(eta - half), upper: Math.exp(eta + half) });
  }

  const scales = timeScales(r, interval);
  const notes = [
    family === 'poisson'
      ? 'Poisson regression of daily counts on day (log link), maximum likelihood by iteratively reweighted least squares.'
      : `Negative-binomial regression (NB2, variance mu + alpha mu^2) of daily counts on day (log link); alpha by maximum likelihood = ${alpha === 0 ? '0' : alpha.toPrecision(3)}${alpha === 0 ? ' (no overdispersion found: same as Poisson)' : ''}.`,
    `Window: days ${fromDay} to ${toDay}, ${days.length} days with counts, ${y.reduce((s, v) => s + v, 0)} cases.`,
    '95% interval for r: profile likelihood (not assuming a symmetric likelihood); doubling time and R intervals are its image under monotone maps.',
  ];
  if (dayOfWeek) notes.push(`Day-of-week effect: six weekday factors relative to the weekday of day ${fromDay}.`);
  if (pearsonRatio !== null) {
    const over = pearsonRatio > OVERDISPERSION_THRESHOLD;
    notes.push(
      `Pearson dispersion of the Poisson fit: ${pearsonRatio.toFixed(2)} (about 1 for Poisson counts; above ${OVERDISPERSION_THRESHOLD}, common practice, means overdispersion${over && family === 'poisson' ? ': prefer the negative-binomial fit' : ''}).`,
    );
  }
  for (const reason of notDetermined) if (reason !== null) notes.push(`The ${reason}; that end is left open.`);
  const unbounded = interval.some((end, k) => !Number.isFinite(end) && notDetermined[k] === null);
  if (unbounded) notes.push('The interval for r is unbounded on one side: the window holds too little information.');
  if (scales.status === 'not growing') notes.push('r is 0 within the solver tolerance: not growing, no doubling or halving time.');

  return {
    ok: true,
    fit: {
      family,
      fromDay,
      toDay,
      dayOfWeek,
      daysUsed: days.length,
      casesInWindow: y.reduce((s, v) => s + v, 0),
      growthRatePerDay: r,
      growthRateStandardError: se,
      growthRateInterval: interval,
      growthRateIntervalNotDetermined: notDetermined,
      status: scales.status,
      doublingTimeDays: scales.doublingTimeDays,
      doublingTimeInterval: scales.doublingTimeInterval,
      halvingTimeDays: scales.halvingTimeDays,
      halvingTimeInterval: scales.halvingTimeInterval,
      dispersion: { pearsonRatio, negativeBinomialAlpha: family === 'negativeBinomial' ? alpha : null },
      dayOfWeekFactors: dayOfWeek ? [1, ...fit.coefficients.slice(2).map(Math.exp)] : null,
      logLikelihood: fit.logLikelihood,
      fitted,
      notes,
    },
  };
}
