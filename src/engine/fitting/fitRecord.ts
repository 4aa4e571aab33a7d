/**
 * Where a scenario's R0 came from when it was fitted to case counts: an optional record kept in
 * `disease.fitRecord` so the report and the assumptions view can print the source, window,
 * count model, growth rate, doubling time and R0 with their 95% intervals, and the measures
 * divided out (schema: fitRecordSchema.ts). The record describes the fit; `fitRecordMatches` tells whether the scenario still uses its R0.
 */
import type { FitRecord } from './fitRecordSchema.ts';
import type { GrowthFit } from './fitGrowth.ts';
import type { MeasuresRatio } from './measuresRatio.ts';
import type { R0FromFit } from './r0FromFit.ts';
import { epochDayToIsoDate, isoDateToEpochDay } from './isoDate.ts';
import type { DayOrigin } from './scenarioDays.ts';

const orNull = (x: number | null): number | null => (x === null || !Number.isFinite(x) ? null : x);

export interface FitRecordInput {
  sourceFile: string;
  /** ISO date of day 0 of the fit, or null when it has none (day numbers without a start date). */
  startDate: string | null;
  /** Which days the fit used (scenarioDays.ts); left out of the record when not given. */
  dayOrigin?: DayOrigin;
  fit: GrowthFit;
  r0: R0FromFit;
  /** The measures divided out, or undefined when none were in force. */
  measures?: MeasuresRatio;
}

/** The case-file day `day` as a date, when day 0 has one. */
export function caseDayDate(startDate: string | null, day: number): string | undefined {
  if (startDate === null) return undefined;
  const origin = isoDateToEpochDay(startDate);
  return origin === null ? undefined : epochDayToIsoDate(origin + day);
}

/** Builds the record stored in the scenario from a fit and its R0. */
export function fitRecordOf(input: FitRecordInput): FitRecord {
  const { fit, r0, measures } = input;
  const fromDate = caseDayDate(input.startDate, fit.fromDay);
  const toDate = caseDayDate(input.startDate, fit.toDay);
  return {
    sourceFile: input.sourceFile,
    window: { fromDay: fit.fromDay, toDay: fit.toDay, ...(fromDate ? { fromDate } : {}), ...(toDate ? { toDate } : {}), ...(input.dayOrigin === undefined ? {} : { dayOrigin: input.dayOrigin }), daysUsed: fit.daysUsed, cases: fit.casesInWindow },
    family: fit.family,
    dayOfWeek: fit.dayOfWeek,
    growthRatePerDay: fit.growthRatePerDay,
    growthRateInterval: [orNull(fit.growthRateInterval[0]), orNull(fit.growthRateInterval[1])],
    intervalMethod: 'profile likelihood',
    doublingTimeDays: orNull(fit.doublingTimeDays),
    doublingTimeInterval: fit.doublingTimeInterval === null ? null : [orNull(fit.doublingTimeInterval[0]), orNull(fit.doublingTimeInterval[1])],
    r0: r0.r0,
    r0Interval: [orNull(r0.r0Interval[0]), orNull(r0.r0Interval[1])],
    dispersion: { negativeBinomialAlpha: orNull(fit.dispersion.negativeBinomialAlpha), pearsonRatio: orNull(fit.dispersion.pearsonRatio) },
    ...(measures !== undefined
      ? {
          measures: {
            option: measures.option,
            phaseFromDay: measures.phase?.fromDay ?? null,
            phaseToDay: measures.phase?.toDay ?? null,
            ratio: measures.ratio,
            reproductionNumberInWindow: r0.reproductionNumberInWindow,
          },
        }
      : {}),
    measuresNote: measures?.note ?? '',
    methodNotes: [...fit.notes, ...r0.notes],
  };
}

/** True when the disease's transmission is still the R0 the record gave (relative difference < 1e-9). */
export function fitRecordMatches(transmission: { kind: string; r0?: number }, record: FitRecord): boolean {
  return transmission.kind === 'r0' && transmission.r0 !== undefined && Math.abs(transmission.r0 - record.r0) <= 1e-9 * record.r0;
}
