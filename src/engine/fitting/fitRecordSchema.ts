/**
 * The stored form of a fit of R0 to case counts (`disease.fitRecord` in the scenario file): the
 * zod schema and its type only, so the scenario schema can include it without depending on the
 * fitting code. Interval ends that are unbounded are written as null (JSON has no infinity).
 * Built by `fitRecordOf` (fitRecord.ts).
 */
import { z } from 'zod';

const finite = z.number({ message: 'must be a number' });
/** A number, or null for an unbounded interval end. */
const bound = finite.nullable();
const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { message: 'must be a date written YYYY-MM-DD' });

export const fitRecordSchema = z.object({
  /** Name of the case-count file the fit used (no folder). */
  sourceFile: z.string().min(1, { message: 'must not be empty' }),
  /**
   * Fitting window, day numbers (both inclusive), and its dates when day 0 has one. `dayOrigin` says
   * which days: the scenario's (day 0 = its start date), the counts file's from its first date, or
   * the file's own day numbers; records written before it existed leave it out.
   */
  window: z.object({
    fromDay: z.number().int({ message: 'must be a whole day number' }),
    toDay: z.number().int({ message: 'must be a whole day number' }),
    fromDate: isoDate.optional(),
    toDate: isoDate.optional(),
    dayOrigin: z.enum(['scenarioStartDate', 'firstDateInFile', 'fileDayNumbers']).optional(),
    daysUsed: z.number().int().min(0).optional(),
    cases: z.number().int().min(0).optional(),
  }),
  family: z.enum(['poisson', 'negativeBinomial']),
  /** Whether weekday reporting factors were fitted. */
  dayOfWeek: z.boolean().default(false),
  /** Fitted exponential growth rate r, per day, and its 95% interval. */
  growthRatePerDay: finite,
  growthRateInterval: z.tuple([bound, bound]),
  /** Which method gave the interval for r. */
  intervalMethod: z.string().default('profile likelihood'),
  /** ln 2 / r in days; null when not growing. */
  doublingTimeDays: bound,
  doublingTimeInterval: z.tuple([bound, bound]).nullable().default(null),
  /** R0 set from the fit (without measures) and its 95% interval. */
  r0: finite.gt(0, { message: 'must be > 0' }),
  r0Interval: z.tuple([bound, bound]),
  /** NB2 dispersion alpha (negative binomial) and the Pearson ratio of the Poisson fit. */
  dispersion: z.object({ negativeBinomialAlpha: bound, pearsonRatio: bound }).optional(),
  /** Measures in force during the window, divided out of R to give R0. */
  measures: z
    .object({
      option: z.string().min(1),
      phaseFromDay: z.number().int().nullable(),
      phaseToDay: z.number().int().nullable(),
      ratio: finite.gt(0, { message: 'must be > 0' }),
      reproductionNumberInWindow: finite.min(0),
    })
    .optional(),
  /** Plain sentence on measures ('' when none were in force). */
  measuresNote: z.string().default(''),
  /** Plain-language method notes (regression, interval, Euler-Lotka relation). */
  methodNotes: z.array(z.string()).default([]),
});

export type FitRecord = z.output<typeof fitRecordSchema>;
