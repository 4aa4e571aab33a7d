/**
 * One draw through the model: the pure function the draw loop maps over (on a worker pool or in
 * one thread), (prepared draws, draw index) -> numeric outcomes of every option.
 *
 * The draw's parameter values are applied to the scenario (applyDraw.ts), the result is validated
 * with the format's own rules, and every option runs on the same drawn scenario (common random
 * numbers: options are compared draw by draw). A draw that breaks a rule, or whose run fails, is
 * returned as a failure with the reason; it never throws.
 */
import { compareWithReference, referenceIndexOf } from '../run.ts';
import { prepareScenario, type PreparedScenario } from '../prepare.ts';
import type { OptionResults } from '../results.ts';
import type { PolicyOption, Scenario } from '../scenario.ts';
import { simulateOption } from '../simulate.ts';
import { formatProblem } from '../problems.ts';
import { validateScenario } from '../validation.ts';
import { applyDraw } from './applyDraw.ts';
import { hypercubePoint, latinHypercube, type LatinHypercube } from './latinHypercube.ts';
import { distributionQuantile } from './quantiles.ts';
import type { Uncertainty } from './schema.ts';

/**
 * The numeric outcomes kept for every draw and option, keyed by their JSON key; null where an
 * outcome does not exist (no hospital section, not growing, no reference to compare with).
 */
export const DRAW_OUTCOMES: readonly { key: string; read: (o: OptionResults) => number | null }[] = [
  { key: 'rStart', read: (o) => o.rStart },
  { key: 'growthRatePerDay', read: (o) => o.growthRatePerDay },
  { key: 'doublingTimeDays', read: (o) => o.doublingTimeDays },
  { key: 'peakDay', read: (o) => o.peakDay },
  { key: 'peakPrevalence', read: (o) => o.peakPrevalence },
  { key: 'infections', read: (o) => o.infections },
  { key: 'attackRate', read: (o) => o.attackRate },
  { key: 'deaths', read: (o) => o.deaths },
  { key: 'yearsOfLifeLost', read: (o) => o.yearsOfLifeLost },
  { key: 'infectionsAverted', read: (o) => o.comparison?.infectionsAverted ?? null },
  { key: 'deathsAverted', read: (o) => o.comparison?.deathsAverted ?? null },
  { key: 'doses', read: (o) => o.vaccination?.doses ?? null },
  { key: 'deathsAvertedPer1000Doses', read: (o) => o.comparison?.deathsAvertedPer1000Doses ?? null },
  { key: 'admissions', read: (o) => o.healthcare?.admissions ?? null },
  { key: 'icuAdmissions', read: (o) => o.healthcare?.icuAdmissions ?? null },
  { key: 'peakWardOccupancy', read: (o) => o.healthcare?.ward.peakOccupancy ?? null },
  { key: 'wardDaysOverCapacity', read: (o) => o.healthcare?.ward.daysOverCapacity ?? null },
  { key: 'peakIcuOccupancy', read: (o) => o.healthcare?.icu.peakOccupancy ?? null },
  { key: 'peakIcuDay', read: (o) => o.healthcare?.icu.peakDay ?? null },
  { key: 'icuDaysOverCapacity', read: (o) => o.healthcare?.icu.daysOverCapacity ?? null },
  { key: 'icuFirstDayOverCapacity', read: (o) => o.healthcare?.icu.firstDayOverCapacity ?? null },
  { key: 'icuDaysOverSurgeCapacity', read: (o) => o.healthcare?.icu.daysOverSurgeCapacity ?? null },
];

export const DRAW_OUTCOME_KEYS: readonly string[] = DRAW_OUTCOMES.map((x) => x.key);

/** Outcome vector of one option in DRAW_OUTCOMES order; NaN stands for null. */
export function outcomeVector(o: OptionResults): Float64Array {
  return Float64Array.from(DRAW_OUTCOMES, ({ read }) => read(o) ?? Number.NaN);
}

/** Everything the draw loop shares: built once per process (or worker) from the scenario. */
export interface PreparedDraws {
  /** The scenario as written (central values), with its `uncertainty` section. */
  scenario: Scenario;
  uncertainty: Uncertainty;
  hypercube: LatinHypercube;
  referenceIndex: number;
}

/** Throws when the scenario has no `uncertainty` section (callers check first). */
export function prepareDraws(scenario: Scenario): PreparedDraws {
  const u = scenario.uncertainty;
  if (u === undefined) throw new Error('the scenario has no uncertainty section');
  return { scenario, uncertainty: u, hypercube: latinHypercube(u.seed, u.parameters.length, u.draws), referenceIndex: referenceIndexOf(scenario) };
}

/** Parameter values of draw i, in the order of `uncertainty.parameters`. */
export function parameterValues(p: PreparedDraws, draw: number): number[] {
  const point = hypercubePoint(p.hypercube, draw);
  return p.uncertainty.parameters.map((q, k) => distributionQuantile(q.distribution, point[k]));
}

export type DrawResult =
  | { draw: number; ok: true; /** One outcome vector per option (DRAW_OUTCOMES order, NaN = null). */ outcomes: Float64Array[] }
  | { draw: number; ok: false; reason: string };

/** The scenario of draw i, prepared for running, or the rule it breaks. */
export function preparedScenarioOfDraw(p: PreparedDraws, draw: number): { ok: true; prepared: PreparedScenario } | { ok: false; reason: string } {
  const values = parameterValues(p, draw);
  const drawn = applyDraw(p.scenario, p.uncertainty.parameters.map((q) => q.name), values);
  const checked = validateScenario(drawn);
  if (!checked.ok) return { ok: false, reason: formatProblem(checked.problems[0]) };
  return { ok: true, prepared: prepareScenario(checked.scenario, checked.calibration) };
}

function failure(draw: number, err: unknown): DrawResult {
  return { draw, ok: false, reason: `the run failed: ${err instanceof Error ? err.message.split('\n')[0] : String(err)}` };
}

/** Every option of the scenario under draw i (comparisons against the reference of the same draw). */
export function evaluateDraw(p: PreparedDraws, draw: number): DrawResult {
  try {
    const prepared = preparedScenarioOfDraw(p, draw);
    if (!prepared.ok) return { draw, ok: false, reason: prepared.reason };
    const results = prepared.prepared.scenario.options.map((o) => simulateOption(prepared.prepared, o));
    const reference = results[p.referenceIndex];
    for (const r of results) r.comparison = compareWithReference(r, reference);
    return { draw, ok: true, outcomes: results.map(outcomeVector) };
  } catch (err) {
    return failure(draw, err);
  }
}

/**
 * One option (which need not be one of the scenario's, e.g. a candidate vaccination order) under
 * draw i, without comparison: its outcome vector, or the reason the draw fails. Measures of the
 * option are adjusted for `measureAdherence` as the scenario's own options are.
 */
export function evaluateOptionUnderDraw(p: PreparedDraws, draw: number, option: PolicyOption): { ok: true; outcomes: Float64Array } | { ok: false; reason: string } {
  try {
    const values = parameterValues(p, draw);
    const withOption: Scenario = { ...p.scenario, options: [option], referenceOption: undefined };
    const drawn = applyDraw(withOption, p.uncertainty.parameters.map((q) => q.name), values);
    const checked = validateScenario(drawn);
    if (!checked.ok) return { ok: false, reason: formatProblem(checked.problems[0]) };
    return { ok: true, outcomes: outcomeVector(simulateOption(prepareScenario(checked.scenario, checked.calibration), checked.scenario.options[0])) };
  } catch (err) {
    return { ok: false, reason: `the run failed: ${err instanceof Error ? err.message : String(err)}` };
  }
}

/** Draws from..to-1, in order. */
export function evaluateDrawRange(p: PreparedDraws, from: number, to: number): DrawResult[] {
  const out: DrawResult[] = [];
  for (let i = from; i < to; i++) out.push(evaluateDraw(p, i));
  return out;
}
