/**
 * Notes on contact matrices that do not balance (N_i C_ij != N_j C_ji). The engine uses the
 * matrices as given; the note tells the analyst how far off they are and where.
 */
import { RECIPROCITY_TOLERANCE, type ReciprocityCheck } from '../engine/index.ts';
import { print } from '../report/numberFormat.ts';

export interface ReciprocityRow {
  setting: string;
  /** Largest relative imbalance of N_i C_ij against N_j C_ji, fraction. */
  largestRelativeImbalance: number;
  /** Band labels of the pair where it occurs. */
  at: [string, string];
}

export function reciprocityRows(checks: readonly ReciprocityCheck[], bandLabels: readonly string[]): ReciprocityRow[] {
  const label = (i: number): string => bandLabels[i] ?? String(i);
  return checks.map((c) => ({ setting: c.setting, largestRelativeImbalance: c.largestRelativeImbalance, at: [label(c.at[0]), label(c.at[1])] }));
}

/** One sentence per setting whose imbalance is above the engine's RECIPROCITY_TOLERANCE. */
export function reciprocityNotes(rows: readonly ReciprocityRow[]): string[] {
  return rows
    .filter((r) => r.largestRelativeImbalance > RECIPROCITY_TOLERANCE)
    .map(
      (r) =>
        `contacts in setting "${r.setting}" are not reciprocal (used as given): largest imbalance ` +
        `${print.percent(r.largestRelativeImbalance)} between bands ${r.at[0]} and ${r.at[1]}`,
    );
}
