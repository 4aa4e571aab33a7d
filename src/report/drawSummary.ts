/**
 * The uncertainty draws in printed words: how they were taken (draws, seed, interval level,
 * sampling, failed draws), the uncertain inputs with distribution, bounds and source, and the rows
 * of chances (better than the reference, best of all options). The intervals themselves are
 * printed by the outcome catalogue beside each value (outcomes.ts `outcomeTextWithInterval`).
 * Pure: the summary comes from the CLI's draws or the app's pool (engine `uncertaintyOnPool`).
 */
import type { Distribution, UncertainParameter, UncertaintyResults, UncertaintyRun } from '../engine/index.ts';
import { groupThousands, print, type NumberStyle, numberFormatter } from './numberFormat.ts';
import { outcome } from './outcomes.ts';

/** The summary of uncertainty draws with the inputs drawn (the scenario's `uncertainty.parameters`): what the printed outputs need. */
export interface DrawSummary {
  summary: UncertaintyResults;
  parameters: readonly UncertainParameter[];
}

/** A number of a distribution as written in the file, to six significant digits. */
const plain = (x: number): string => String(Number(x.toPrecision(6)));

/** "uniform from 2 to 3", "normal, mean 4, sd 1, kept within 2 to 6", "lognormal, median 1, 95% range 0.6 to 1.6". */
export function distributionText(d: Distribution): string {
  switch (d.kind) {
    case 'uniform':
      return `uniform from ${plain(d.low)} to ${plain(d.high)}`;
    case 'triangular':
      return `triangular from ${plain(d.low)} to ${plain(d.high)}, most likely ${plain(d.mode)}`;
    case 'normal': {
      const cut = d.low === undefined && d.high === undefined ? '' : `, kept within ${d.low === undefined ? 'no lower bound' : plain(d.low)} to ${d.high === undefined ? 'no upper bound' : plain(d.high)}`;
      return `normal, mean ${plain(d.mean)}, sd ${plain(d.sd)}${cut}`;
    }
    case 'lognormal':
      return d.range95 !== undefined ? `lognormal, median ${plain(d.median)}, 95% range ${plain(d.range95[0])} to ${plain(d.range95[1])}` : `lognormal, median ${plain(d.median)}, geometric sd ${plain(d.geometricSd ?? Number.NaN)}`;
  }
}

/** One row per uncertain input: name, distribution with its bounds, source. */
export function uncertainParameterRows(parameters: readonly UncertainParameter[]): [name: string, distribution: string, source: string][] {
  return parameters.map((q) => [q.name, distributionText(q.distribution), q.source]);
}

/** How the draws were taken, in one line each: draws and sampling, seed, interval level, failed draws. */
export function drawFacts(u: UncertaintyRun): string[] {
  const sampling = u.sampling === 'latinHypercube' ? 'Latin hypercube' : u.sampling;
  return [
    `Uncertainty draws: ${groupThousands(u.draws)} (${sampling} sampling, seed ${u.seed})`,
    `Intervals: central ${print.percent(u.intervalLevel, 0)} of the draws`,
    `Failed draws: ${groupThousands(u.failedDraws)}${u.failedDraws > 0 ? ' (left out of every interval and chance)' : ''}`,
  ];
}

/** A chance row of the options table: key, label, one cell per option (the reference's own "better than" cell reads "reference"). */
export interface ChanceRow {
  key: string;
  label: string;
  cells: string[];
}

/**
 * Rows "Deaths: chance lower than under the reference" and "Deaths: chance lowest of all options"
 * for each compared outcome of the summary, the share of draws written as a percentage.
 */
export function chanceRows(summary: UncertaintyResults, referenceIndex: number, style: NumberStyle, referenceCell: string): ChanceRow[] {
  const f = numberFormatter(style);
  const first = summary.options[0];
  if (first === undefined) return [];
  const rows: ChanceRow[] = [];
  for (const key of Object.keys(first.probabilityBetterThanReference)) {
    const label = outcome(key).label;
    rows.push({
      key: `probabilityBetterThanReference.${key}`,
      label: `${label}: chance lower than under the reference`,
      cells: summary.options.map((o, k) => (k === referenceIndex ? referenceCell : f.percent(o.probabilityBetterThanReference[key] ?? Number.NaN, 0))),
    });
  }
  for (const key of Object.keys(first.probabilityBest)) {
    rows.push({
      key: `probabilityBest.${key}`,
      label: `${outcome(key).label}: chance lowest of all options`,
      cells: summary.options.map((o) => f.percent(o.probabilityBest[key] ?? Number.NaN, 0)),
    });
  }
  return rows;
}
