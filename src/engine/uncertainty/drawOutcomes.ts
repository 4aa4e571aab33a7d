/**
 * One draw through the model: the pure function the draw loop maps over (on a worker pool or in
 * one thread), (prepared draws, draw index) -> numeric outcomes of every option.
 *
 * The draw's parameter values are applied to the scenario (applyDraw.ts), the result is validated
 * with the format's own rules, and every option runs on the same drawn scenario (common random
 * numbers: options are compared draw by draw). A draw that breaks a rule, or whose run fails, is
 * returned as a failure with the reason; it never throws.
 */
import { compareWithReference, referenceIndexOf } from '../reference.ts';
import { prepareScenario, type PreparedScenario } from '../prepare.ts';
import type { OptionResults, OptionSummary } from '../results.ts';
import type { PolicyOption, Scenario } from '../scenario.ts';
import { simulateOption } from '../simulate.ts';
import { formatProblem } from '../problems.ts';
import { revalidateSections, validateScenario, type ScenarioSection } from '../validation.ts';
import { applyDraw, sectionOfParameter } from './applyDraw.ts';
import { hypercubePoint, latinHypercube, type LatinHypercube } from './latinHypercube.ts';
import { distributionQuantile } from './quantiles.ts';
import type { Uncertainty } from './schema.ts';

/**
 * Which numbers a draw keeps of each option's results, and under which keys. The engine does not
 * choose them: the caller passes the outcome catalogue's reader (src/report/drawOutcomes.ts), so
 * intervals are keyed exactly as the outcomes of `mixwise run --format json`.
 */
export interface OutcomeReader {
  keys: readonly string[];
  /** Values of option `k` in `keys` order; NaN where the outcome does not exist for it. */
  read(options: readonly OptionSummary[], k: number, referenceIndex: number): Float64Array;
}

/** A slice of the draws: from..to-1 (a task of the pool's `drawRuns` job). */
export interface DrawRange {
  from: number;
  to: number;
}

/** Everything the draw loop shares: built once per process (or worker) from the scenario. */
export interface PreparedDraws {
  /** The validated scenario (central values), with its `uncertainty` section. */
  scenario: Scenario;
  uncertainty: Uncertainty;
  hypercube: LatinHypercube;
  referenceIndex: number;
  /** The sections the uncertain parameters change: the only ones a draw must check again. */
  drawnSections: ScenarioSection[];
}

/** `scenario` must be valid (validateScenario); throws when it has no `uncertainty` section (callers check first). */
export function prepareDraws(scenario: Scenario): PreparedDraws {
  const u = scenario.uncertainty;
  if (u === undefined) throw new Error('the scenario has no uncertainty section');
  return {
    scenario,
    uncertainty: u,
    hypercube: latinHypercube(u.seed, u.parameters.length, u.draws),
    referenceIndex: referenceIndexOf(scenario),
    drawnSections: [...new Set(u.parameters.map((q) => sectionOfParameter(q.name)))],
  };
}

/** Parameter values of draw i, in the order of `uncertainty.parameters`. */
export function parameterValues(p: PreparedDraws, draw: number): number[] {
  const point = hypercubePoint(p.hypercube, draw);
  return p.uncertainty.parameters.map((q, k) => distributionQuantile(q.distribution, point[k]));
}

export type DrawResult =
  | { draw: number; ok: true; /** One outcome vector per option (the reader's keys, NaN = none). */ outcomes: Float64Array[] }
  | { draw: number; ok: false; reason: string };

/**
 * One draw run through every option, before its outcomes are read: what the pool's `drawRuns`
 * job sends back (src/engine/pool/jobs.ts). Summary runs (no daily series: no outcome of a draw
 * reads them), each compared with the reference of the same draw.
 */
export type DrawRun = { draw: number; ok: true; options: OptionSummary[] } | { draw: number; ok: false; reason: string };

/**
 * The scenario of draw i, prepared for running, or the rule it breaks. Only the sections the
 * parameters change are checked again (revalidateSections: the same rules and messages as a full
 * validation, for a scenario that was valid before).
 */
export function preparedScenarioOfDraw(p: PreparedDraws, draw: number): { ok: true; prepared: PreparedScenario } | { ok: false; reason: string } {
  const values = parameterValues(p, draw);
  const drawn = applyDraw(p.scenario, p.uncertainty.parameters.map((q) => q.name), values);
  const checked = revalidateSections(drawn, p.drawnSections);
  if (!checked.ok) return { ok: false, reason: formatProblem(checked.problems[0]) };
  return { ok: true, prepared: prepareScenario(checked.scenario, checked.calibration) };
}

function failureReason(err: unknown): string {
  return `the run failed: ${err instanceof Error ? err.message.split('\n')[0] : String(err)}`;
}

/** Every option of the scenario under draw i, compared with the reference of the same draw; never throws. */
export function runDraw(p: PreparedDraws, draw: number): DrawRun {
  try {
    const prepared = preparedScenarioOfDraw(p, draw);
    if (!prepared.ok) return { draw, ok: false, reason: prepared.reason };
    const results = prepared.prepared.scenario.options.map((o) => simulateOption(prepared.prepared, o, { series: 'summary' }));
    const reference = results[p.referenceIndex];
    for (const r of results) r.comparison = compareWithReference(r, reference);
    return { draw, ok: true, options: results };
  } catch (err) {
    return { draw, ok: false, reason: failureReason(err) };
  }
}

/** Draws from..to-1 run through every option, in order (the pool's task). */
export function runDrawRange(p: PreparedDraws, from: number, to: number): DrawRun[] {
  const out: DrawRun[] = [];
  for (let i = from; i < to; i++) out.push(runDraw(p, i));
  return out;
}

/** The outcomes `reader` keeps of a run draw; a reader that throws fails the draw, as a failed run does. */
export function readDraw(run: DrawRun, reader: OutcomeReader, referenceIndex: number): DrawResult {
  if (!run.ok) return run;
  try {
    return { draw: run.draw, ok: true, outcomes: run.options.map((_, k) => reader.read(run.options, k, referenceIndex)) };
  } catch (err) {
    return { draw: run.draw, ok: false, reason: failureReason(err) };
  }
}

/** Every option of the scenario under draw i (comparisons against the reference of the same draw). */
export function evaluateDraw(p: PreparedDraws, draw: number, reader: OutcomeReader): DrawResult {
  return readDraw(runDraw(p, draw), reader, p.referenceIndex);
}

/**
 * One option (which need not be one of the scenario's, e.g. a candidate vaccination order) under
 * draw i, without comparison: its results, or the reason the draw fails. Measures of the option
 * are adjusted for `measureAdherence` as the scenario's own options are.
 */
export function evaluateOptionUnderDraw(p: PreparedDraws, draw: number, option: PolicyOption): { ok: true; results: OptionResults } | { ok: false; reason: string } {
  try {
    const values = parameterValues(p, draw);
    const withOption: Scenario = { ...p.scenario, options: [option], referenceOption: undefined };
    const drawn = applyDraw(withOption, p.uncertainty.parameters.map((q) => q.name), values);
    const checked = validateScenario(drawn);
    if (!checked.ok) return { ok: false, reason: formatProblem(checked.problems[0]) };
    return { ok: true, results: simulateOption(prepareScenario(checked.scenario, checked.calibration), checked.scenario.options[0]) };
  } catch (err) {
    return { ok: false, reason: `the run failed: ${err instanceof Error ? err.message : String(err)}` };
  }
}

/** Draws from..to-1, in order. */
export function evaluateDrawRange(p: PreparedDraws, from: number, to: number, reader: OutcomeReader): DrawResult[] {
  const out: DrawResult[] = [];
  for (let i = from; i < to; i++) out.push(evaluateDraw(p, i, reader));
  return out;
}
