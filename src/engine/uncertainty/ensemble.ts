/**
 * Uncertainty over many draws: Latin hypercube draws of the uncertain parameters (latinHypercube.ts,
 * seeded SplitMix64 streams), each run through every option (drawOutcomes.ts, common random
 * numbers), then summarised per option: intervals of every outcome, the chance of doing better
 * than the reference and of being best (summaries.ts), and the PRCC of each parameter with each
 * compared outcome (prcc.ts).
 *
 * The summary is a pure function of the ordered list of draw results, so draws computed in slices
 * (other processes, other machines) and merged give exactly the numbers of a single run. Failed
 * draws are counted, named in the notes, and left out of every summary for all options alike, so
 * the comparisons stay paired.
 */
import type { Scenario } from '../scenario.ts';
import { type DrawResult, parameterValues, type PreparedDraws } from './drawOutcomes.ts';
import { partialRankCorrelations } from './prcc.ts';
import { type Interval, intervalOf, probabilityLower, probabilityLowest } from './summaries.ts';

/** Outcomes (lower is better) for which options are compared draw by draw and PRCCs are given. */
export const COMPARED_OUTCOMES = ['deaths', 'infections', 'admissions', 'peakIcuOccupancy'] as const;

/** How the draws were taken. */
export const SAMPLING = 'latinHypercube';

/** Failed draws named one by one in the notes; the rest are counted in one more note. */
export const FAILED_DRAWS_NAMED = 20;

export interface UncertaintyRun {
  draws: number;
  seed: number;
  intervalLevel: number;
  sampling: typeof SAMPLING;
  failedDraws: number;
  /** One line per failed draw (the first FAILED_DRAWS_NAMED), with the rule it broke. */
  notes: string[];
}

export interface OptionUncertainty {
  /** By outcome key; null when the outcome is missing in some draws (e.g. doubling time while shrinking). */
  intervals: Record<string, Interval | null>;
  probabilityBetterThanReference: Record<string, number>;
  probabilityBest: Record<string, number>;
}

export interface SensitivityEntry {
  option: string;
  outcome: string;
  parameter: string;
  /** Partial rank correlation coefficient in [-1, 1]; null when undefined (the outcome does not vary). */
  prcc: number | null;
}

export interface UncertaintyResults {
  uncertainty: UncertaintyRun;
  sensitivity: SensitivityEntry[];
  /** In the scenario's option order. */
  options: OptionUncertainty[];
}

/** The scenario with `draws` and `seed` of its uncertainty section replaced where given. */
export function withDrawSettings(s: Scenario, settings: { draws?: number; seed?: number }): Scenario {
  if (s.uncertainty === undefined) return s;
  return { ...s, uncertainty: { ...s.uncertainty, draws: settings.draws ?? s.uncertainty.draws, seed: settings.seed ?? s.uncertainty.seed } };
}

function failureNotes(failed: readonly Extract<DrawResult, { ok: false }>[]): string[] {
  const notes = failed.slice(0, FAILED_DRAWS_NAMED).map((f) => `draw ${f.draw} failed and is left out: ${f.reason}`);
  if (failed.length > FAILED_DRAWS_NAMED) notes.push(`${failed.length - FAILED_DRAWS_NAMED} more draws failed and are left out`);
  return notes;
}

/** Summaries of all draws; `results` must hold draws 0..N-1 in order, their vectors in `keys` order. */
export function summariseDraws(p: PreparedDraws, results: readonly DrawResult[], keys: readonly string[]): UncertaintyResults {
  const u = p.uncertainty;
  if (results.length !== u.draws || results.some((r, i) => r.draw !== i)) throw new Error(`expected draws 0..${u.draws - 1} in order`);
  const good = results.filter((r): r is Extract<DrawResult, { ok: true }> => r.ok);
  const failed = results.filter((r): r is Extract<DrawResult, { ok: false }> => !r.ok);
  const optionCount = p.scenario.options.length;
  /** values(k, key)[i]: option k, outcome `key`, i-th successful draw. */
  const values = (k: number, key: string): Float64Array => {
    const column = keys.indexOf(key);
    return Float64Array.from(good, (r) => r.outcomes[k][column]);
  };
  const defined = (key: string): boolean => good.length > 0 && Array.from({ length: optionCount }, (_, k) => values(k, key)).every((v) => v.every((x) => !Number.isNaN(x)));
  const presentKeys = keys.filter((key) => good.some((r) => r.outcomes.some((o) => !Number.isNaN(o[keys.indexOf(key)]))));
  const compared = COMPARED_OUTCOMES.filter(defined);
  const best = new Map(compared.map((key) => [key, probabilityLowest(Array.from({ length: optionCount }, (_, k) => values(k, key)))]));

  const options: OptionUncertainty[] = p.scenario.options.map((_, k) => ({
    intervals: Object.fromEntries(presentKeys.map((key) => [key, intervalOf(values(k, key), u.intervalLevel)])),
    probabilityBetterThanReference: Object.fromEntries(compared.map((key) => [key, probabilityLower(values(k, key), values(p.referenceIndex, key))])),
    probabilityBest: Object.fromEntries(compared.map((key) => [key, best.get(key)?.[k] ?? 0])),
  }));

  const parameterColumns = u.parameters.map(() => new Float64Array(good.length));
  good.forEach((r, i) => parameterValues(p, r.draw).forEach((x, k) => (parameterColumns[k][i] = x)));
  const sensitivity: SensitivityEntry[] = [];
  p.scenario.options.forEach((option, k) => {
    for (const outcome of compared) {
      const prcc = partialRankCorrelations(parameterColumns, values(k, outcome));
      u.parameters.forEach((q, j) => sensitivity.push({ option: option.name, outcome, parameter: q.name, prcc: prcc[j] }));
    }
  });

  return {
    uncertainty: { draws: u.draws, seed: u.seed, intervalLevel: u.intervalLevel, sampling: SAMPLING, failedDraws: failed.length, notes: failureNotes(failed) },
    sensitivity,
    options,
  };
}
