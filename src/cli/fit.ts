/**
 * `mixwise fit CASES.csv --scenario FILE [--from D --to D] [--family poisson|negative-binomial]
 * [--day-of-week] [--measures-ratio X | --measures-option NAME] [--format table|json]`: growth
 * rate r, doubling time and R0 (for the scenario's periods) with 95% intervals, from daily case
 * counts, by the engine's `fitCaseCounts` (the app's fit panel runs the same). Without --family the
 * count model is negative binomial when the Poisson fit is overdispersed, and a note says so.
 * --measures-option takes the ratio from the phase that option has in force on the window's first
 * day. Dated counts are placed on the scenario's days when it has a start date.
 * D is a date (YYYY-MM-DD, when day 0 has one) or a day number. The words are split by
 * words.ts, as for every command.
 */
import { basename } from 'node:path';
import { fitCaseCounts, formatCsvProblem, parseCaseCountsCsv, type CaseCountFit, type CountModel, type WindowEnd } from '../engine/index.ts';
import { CAUTION } from '../report/index.ts';
import { loadScenarioOrComplain, type Output } from './commands.ts';
import { EXIT_CODES, type ExitCode } from './errors.ts';
import { readTextFile } from './files.ts';
import { HELP_TEXT } from './help.ts';
import { splitWords, usageError } from './words.ts';

interface FitArgs {
  casesFile: string;
  scenarioFile: string;
  from: string | null;
  to: string | null;
  family: CountModel | 'auto';
  dayOfWeek: boolean;
  measuresRatio: number | undefined;
  measuresOption: string | null;
  format: 'table' | 'json';
}

const VALUE_OPTIONS = ['--scenario', '--from', '--to', '--family', '--measures-ratio', '--measures-option', '--format'];
const FLAG_OPTIONS = ['--day-of-week'];
const FAMILIES: Record<string, CountModel> = { poisson: 'poisson', 'negative-binomial': 'negativeBinomial' };

function parseFitArgs(words: readonly string[]): FitArgs {
  const { positional, values: options, flags } = splitWords('fit', words, { values: VALUE_OPTIONS, flags: FLAG_OPTIONS });
  if (positional.length !== 1) throw usageError(`'fit' takes one CASES file, got ${positional.length}`);
  const scenarioFile = options.get('--scenario');
  if (scenarioFile === undefined) throw usageError(`'fit' needs --scenario FILE (its periods turn r into R0)`);
  const familyWord = options.get('--family');
  const family = familyWord === undefined ? 'auto' : Object.hasOwn(FAMILIES, familyWord) ? FAMILIES[familyWord] : undefined;
  if (family === undefined) throw usageError(`--family must be poisson or negative-binomial, got ${JSON.stringify(options.get('--family'))}`);
  const format = options.get('--format') ?? 'table';
  if (format !== 'table' && format !== 'json') throw usageError(`--format must be table or json for 'fit', got ${JSON.stringify(format)}`);
  const ratioText = options.get('--measures-ratio');
  const measuresRatio = ratioText === undefined ? undefined : Number(ratioText);
  if (measuresRatio !== undefined && !(Number.isFinite(measuresRatio) && measuresRatio > 0)) {
    throw usageError(`--measures-ratio must be a number > 0 (dominant NGM eigenvalue with measures / without), got ${JSON.stringify(ratioText)}`);
  }
  const measuresOption = options.get('--measures-option') ?? null;
  if (measuresOption !== null && measuresRatio !== undefined) throw usageError('give --measures-ratio or --measures-option, not both');
  return {
    casesFile: positional[0],
    scenarioFile,
    from: options.get('--from') ?? null,
    to: options.get('--to') ?? null,
    family,
    dayOfWeek: flags.has('--day-of-week'),
    measuresRatio,
    measuresOption,
    format,
  };
}

/** A window end as written: a whole day number, or a date (resolved by the engine against day 0). */
function windowEnd(option: string, text: string | null): WindowEnd | undefined {
  if (text === null) return undefined;
  if (/^[+-]?\d+$/.test(text)) return { day: Number(text) };
  if (/^\d{4}-\d{2}-\d{2}$/.test(text)) return { date: text };
  throw usageError(`${option} must be a day number or a date YYYY-MM-DD, got ${JSON.stringify(text)}`);
}

const num = (x: number | null, digits: number): string => (x === null ? 'unbounded' : Number.isFinite(x) ? x.toFixed(digits) : x > 0 ? '+inf' : '-inf');

function tableText(file: string, answer: CaseCountFit, scenarioTitle: string): string {
  const { fit, r0, measures } = answer;
  // An end the profile search gave up on says so rather than printing as unbounded.
  const [lo, hi] = fit.growthRateInterval.map((end, k) => (fit.growthRateIntervalNotDetermined[k] === null ? num(end, 4) : 'not determined'));
  const lines = [
    `Growth-rate fit of ${file}: days ${fit.fromDay} to ${fit.toDay}${datesOf(answer)}, ${fit.daysUsed} days with counts, ${fit.casesInWindow} cases, ${fit.family === 'poisson' ? 'Poisson' : 'negative-binomial'} counts`,
    `Growth rate r:      ${num(fit.growthRatePerDay, 4)} per day (95% interval ${lo} to ${hi}, profile likelihood)`,
  ];
  if (fit.doublingTimeDays !== null && fit.doublingTimeInterval !== null) {
    lines.push(`Doubling time:      ${num(fit.doublingTimeDays, 1)} days (${num(fit.doublingTimeInterval[0], 1)} to ${num(fit.doublingTimeInterval[1], 1)})`);
  } else if (fit.halvingTimeDays !== null && fit.halvingTimeInterval !== null) {
    lines.push(`Halving time:       ${num(fit.halvingTimeDays, 1)} days (${num(fit.halvingTimeInterval[0], 1)} to ${num(fit.halvingTimeInterval[1], 1)})`);
  } else lines.push('Doubling time:      not growing');
  lines.push(`R0 for "${scenarioTitle}": ${num(r0.r0, 2)} (95% interval ${num(r0.r0Interval[0], 2)} to ${num(r0.r0Interval[1], 2)})`);
  if (fit.dispersion.negativeBinomialAlpha !== null) lines.push(`Dispersion alpha:   ${fit.dispersion.negativeBinomialAlpha.toPrecision(3)}`);
  for (const note of notesOf(answer)) lines.push(`note: ${note}`);
  lines.push(CAUTION);
  return `${lines.join('\n')}\n`;
}

/** " (2031-03-10 to 2031-03-23)" when day 0 has a date. */
const datesOf = (answer: CaseCountFit): string => {
  const w = answer.record.window;
  return w.fromDate === undefined || w.toDate === undefined ? '' : ` (${w.fromDate} to ${w.toDate})`;
};

/** Which days, why this count model, then the method and measures notes. */
function notesOf(answer: CaseCountFit): string[] {
  const family = answer.familyNote === null ? [] : [`${answer.familyNote} Give --family poisson to compare.`];
  return [answer.placement.note, ...family, ...answer.fit.notes, ...answer.r0.notes, ...(answer.measures === undefined ? [] : [answer.measures.note])];
}

/** An engine request problem ("from ...", "measures ...") named by the option that set it. */
const asOption = (problem: string): string => problem.replace(/^(from|to) /, '--$1 ').replace(/^measures /, '--measures-option ');

/** Runs `mixwise fit`; `words` are the arguments after `fit`. */
export function fitCommand(io: Output, words: readonly string[]): ExitCode {
  if (words.includes('--help') || words.includes('-h')) {
    io.out(HELP_TEXT);
    return EXIT_CODES.ok;
  }
  const args = parseFitArgs(words);
  const loaded = loadScenarioOrComplain(io, args.scenarioFile);
  if (loaded === null) return EXIT_CODES.invalidScenario;
  const { scenario } = loaded;
  const cases = parseCaseCountsCsv(readTextFile(args.casesFile));
  if (!cases.ok) {
    for (const p of cases.problems) io.err(`mixwise: ${args.casesFile}: ${formatCsvProblem(p)}\n`);
    return EXIT_CODES.invalidScenario;
  }
  const result = fitCaseCounts({
    series: cases.series,
    scenario,
    sourceFile: basename(args.casesFile),
    from: windowEnd('--from', args.from),
    to: windowEnd('--to', args.to),
    family: args.family,
    dayOfWeek: args.dayOfWeek,
    measures: args.measuresOption !== null ? { option: args.measuresOption } : args.measuresRatio !== undefined ? { ratio: args.measuresRatio } : null,
  });
  if (!result.ok) {
    if (result.cause === 'request') throw usageError(result.problems.map(asOption).join('; '));
    for (const p of result.problems) io.err(`mixwise: ${args.casesFile}: ${p}\n`);
    return EXIT_CODES.invalidScenario;
  }
  const answer = result.value;
  const { fit, r0, measures } = answer;
  if (args.format === 'json') {
    const w = answer.record.window;
    const json = {
      growthRatePerDay: fit.growthRatePerDay,
      growthRateInterval: fit.growthRateInterval,
      growthRateIntervalNotDetermined: fit.growthRateIntervalNotDetermined,
      doublingTimeDays: fit.doublingTimeDays,
      r0: r0.r0,
      r0Interval: r0.r0Interval,
      doublingTimeInterval: fit.doublingTimeInterval,
      halvingTimeDays: fit.halvingTimeDays,
      halvingTimeInterval: fit.halvingTimeInterval,
      status: fit.status,
      family: fit.family,
      window: {
        fromDay: fit.fromDay,
        toDay: fit.toDay,
        startDate: answer.placement.dayZeroDate,
        dayOrigin: answer.placement.origin,
        ...(w.fromDate === undefined ? {} : { fromDate: w.fromDate, toDate: w.toDate }),
        daysUsed: fit.daysUsed,
        cases: fit.casesInWindow,
      },
      dispersion: fit.dispersion,
      measuresRatio: r0.measuresRatio,
      ...(measures === undefined ? {} : { measures: { option: measures.option, day: measures.day, phase: measures.phase, reproductionNumberInWindow: r0.reproductionNumberInWindow } }),
      notes: notesOf(answer),
      caution: CAUTION,
    };
    // JSON has no infinity: an unbounded interval end is written as null (growthRateIntervalNotDetermined says why, when it was not found).
    io.out(`${JSON.stringify(json, null, 2)}\n`);
  } else io.out(tableText(args.casesFile, answer, scenario.title));
  return EXIT_CODES.ok;
}
