/**
 * Years of life lost (YLL): each death counts the years the person would still have lived.
 *
 *   YLL = sum_i deaths_i x e(a_i)
 *
 * with e(a) the remaining life expectancy at age a from a reference life table (linear between
 * the table's ages; below the first age the first value, above the last age the last value) and
 * a_i the mid-age of band i: (lower_i + lower_{i+1}) / 2; the last, open band is taken as wide as
 * the band before it (common practice; a single band counts at its lower age). Using a reference
 * table rather than the local one values a death at a given age the same everywhere (the standard
 * expected YLL of burden-of-disease work: Murray & Lopez 1996, The Global Burden of Disease).
 */
import { z } from 'zod';
import { MAX_AGE_YEARS, MAX_LIFE_TABLE_ROWS, MAX_REMAINING_YEARS, between } from './limits.ts';
import type { Problem } from './problems.ts';

/** One row: remaining life expectancy (years) at an exact age (years). */
export const lifeTableRowSchema = z.object({
  ageYears: between(0, MAX_AGE_YEARS, 'years'),
  remainingYears: between(0, MAX_REMAINING_YEARS, 'years'),
});

/** A life table in the scenario: rows by increasing age, and where they come from. */
export const lifeTableSchema = z.object({
  rows: z.array(lifeTableRowSchema).min(1, { message: 'must have at least one row' }).max(MAX_LIFE_TABLE_ROWS, { message: `must have at most ${MAX_LIFE_TABLE_ROWS} rows` }),
  source: z.string().min(1, { message: 'must cite where the life table comes from' }),
});

export type LifeTable = z.output<typeof lifeTableSchema>;

/** The part of a scenario YLL needs (written out so the scenario schema can import this module without a cycle). */
type LifeTableInputs = { lifeTable?: LifeTable; ageBands: readonly { lowerAgeYears: number }[] };

/**
 * Default: the GBD 2019 reference life table (both sexes; the lowest observed mortality rates at
 * each age), GBD 2019 Demographics Collaborators 2020, The Lancet 396:1160-1203. The values below
 * are FROM MEMORY (the published table was not at hand): check them against the source before
 * citing a YLL figure, or put the table you use in the scenario's `lifeTable`.
 */
export const DEFAULT_LIFE_TABLE: LifeTable = {
  rows: [
    [0, 88.87], [1, 88.0], [5, 84.03], [10, 79.05], [15, 74.07], [20, 69.11], [25, 64.15],
    [30, 59.2], [35, 54.25], [40, 49.32], [45, 44.43], [50, 39.63], [55, 34.91], [60, 30.25],
    [65, 25.68], [70, 21.29], [75, 17.1], [80, 13.24], [85, 9.99], [90, 7.56], [95, 5.74],
  ].map(([ageYears, remainingYears]) => ({ ageYears, remainingYears })),
  source:
    'GBD 2019 reference life table (GBD 2019 Demographics Collaborators 2020, The Lancet 396:1160-1203); values from memory, to be checked against the published table.',
};

/** Remaining life expectancy at `ageYears` (years), linear between rows, flat beyond the ends. */
export function remainingLifeExpectancyAt(table: LifeTable, ageYears: number): number {
  const rows = table.rows;
  if (ageYears <= rows[0].ageYears) return rows[0].remainingYears;
  for (let k = 1; k < rows.length; k++) {
    const a = rows[k - 1];
    const b = rows[k];
    if (ageYears <= b.ageYears) return a.remainingYears + ((ageYears - a.ageYears) / (b.ageYears - a.ageYears)) * (b.remainingYears - a.remainingYears);
  }
  return rows[rows.length - 1].remainingYears;
}

/** Mid-age of each band, years (see the module comment for the open last band). */
export function bandMidAges(lowerAgesYears: readonly number[]): number[] {
  const n = lowerAgesYears.length;
  return lowerAgesYears.map((lower, i) => {
    if (i + 1 < n) return (lower + lowerAgesYears[i + 1]) / 2;
    return n > 1 ? lower + (lower - lowerAgesYears[i - 1]) / 2 : lower;
  });
}

/** e(a_i) for each band of the scenario, years: its own `lifeTable`, else the default. */
export function remainingLifeExpectancyByBand(s: LifeTableInputs): Float64Array {
  const table = s.lifeTable ?? DEFAULT_LIFE_TABLE;
  return Float64Array.from(bandMidAges(s.ageBands.map((b) => b.lowerAgeYears)), (age) => remainingLifeExpectancyAt(table, age));
}

/** deaths_i x e(a_i), person-years. */
export function yearsOfLifeLostByBand(deathsByBand: readonly number[], remainingYearsByBand: ArrayLike<number>): number[] {
  return deathsByBand.map((d, i) => d * remainingYearsByBand[i]);
}

/** The table's ages must increase row by row. */
export function lifeTableProblems(s: LifeTableInputs): Problem[] {
  const rows = s.lifeTable?.rows ?? [];
  const problems: Problem[] = [];
  for (let k = 1; k < rows.length; k++) {
    if (rows[k].ageYears <= rows[k - 1].ageYears) {
      problems.push({ path: `lifeTable.rows[${k}].ageYears`, rule: `must be greater than the row before (${rows[k - 1].ageYears})`, value: String(rows[k].ageYears) });
    }
  }
  return problems;
}
