/**
 * `mixwise fit CASES.csv --scenario FILE [--from D --to D] [--family poisson|negative-binomial]
 * [--day-of-week] [--measures-ratio X | --measures-option NAME] [--format table|json]`: growth
 * rate r, doubling time and R0 (for the scenario's periods) with 95% intervals, from daily case
 * counts. --measures-option takes the ratio from the phase that option has in force on the
 * window's first day (measuresRatioForOption).
 * D is a date (YYYY-MM-DD, when the file has dates) or a day number. The words are split by
 * words.ts, as for every command.
 */
import { periodsOf, dailyTotals, fitGrowth, formatCsvProblem, isoDateToEpochDay, measuresRatioForOption, parseCaseCountsCsv, r0FromFit, type CaseSeries, type CountModel, type GrowthFit, type MeasuresRatio, type R0FromFit } from '../engine/index.ts';
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
  family: CountModel;
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
  const family = FAMILIES[options.get('--family') ?? 'poisson'];
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

/** A window end given as a date (files with dates) or a whole day number. */
function windowDay(option: string, text: string | null, series: CaseSeries): number | undefined {
  if (text === null) return undefined;
  if (/^[+-]?\d+$/.test(text)) return Number(text);
  const epoch = isoDateToEpochDay(text);
  const start = series.startDate === null ? null : isoDateToEpochDay(series.startDate);
  if (epoch === null || start === null) {
    throw usageError(`${option} must be a day number${series.startDate === null ? '' : ' or a date YYYY-MM-DD'}, got ${JSON.stringify(text)}`);
  }
  return epoch - start;
}

const num = (x: number | null, digits: number): string => (x === null ? 'unbounded' : Number.isFinite(x) ? x.toFixed(digits) : x > 0 ? '+inf' : '-inf');

function tableText(file: string, fit: GrowthFit, r0: R0FromFit, scenarioTitle: string, measures: MeasuresRatio | undefined): string {
  const [lo, hi] = fit.growthRateInterval;
  const lines = [
    `Growth-rate fit of ${file}: days ${fit.fromDay} to ${fit.toDay}, ${fit.daysUsed} days with counts, ${fit.casesInWindow} cases`,
    `Growth rate r:      ${num(fit.growthRatePerDay, 4)} per day (95% interval ${num(lo, 4)} to ${num(hi, 4)}, profile likelihood)`,
  ];
  if (fit.doublingTimeDays !== null && fit.doublingTimeInterval !== null) {
    lines.push(`Doubling time:      ${num(fit.doublingTimeDays, 1)} days (${num(fit.doublingTimeInterval[0], 1)} to ${num(fit.doublingTimeInterval[1], 1)})`);
  } else if (fit.halvingTimeDays !== null && fit.halvingTimeInterval !== null) {
    lines.push(`Halving time:       ${num(fit.halvingTimeDays, 1)} days (${num(fit.halvingTimeInterval[0], 1)} to ${num(fit.halvingTimeInterval[1], 1)})`);
  } else lines.push('Doubling time:      not growing');
  lines.push(`R0 for "${scenarioTitle}": ${num(r0.r0, 2)} (95% interval ${num(r0.r0Interval[0], 2)} to ${num(r0.r0Interval[1], 2)})`);
  if (fit.dispersion.negativeBinomialAlpha !== null) lines.push(`Dispersion alpha:   ${fit.dispersion.negativeBinomialAlpha.toPrecision(3)}`);
  for (const note of [...fit.notes, ...r0.notes, ...(measures === undefined ? [] : [measures.note])]) lines.push(`note: ${note}`);
  lines.push(CAUTION);
  return `${lines.join('\n')}\n`;
}

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
  const result = fitGrowth(dailyTotals(cases.series), {
    fromDay: windowDay('--from', args.from, cases.series),
    toDay: windowDay('--to', args.to, cases.series),
    dayOfWeek: args.dayOfWeek,
    family: args.family,
  });
  if (!result.ok) {
    for (const p of result.problems) io.err(`mixwise: ${args.casesFile}: ${p.field} ${p.rule}${p.value === undefined ? '' : `, got ${p.value}`}\n`);
    return EXIT_CODES.invalidScenario;
  }
  let measures: MeasuresRatio | undefined;
  if (args.measuresOption !== null) {
    const found = measuresRatioForOption(scenario, args.measuresOption, result.fit.fromDay);
    if (!found.ok) throw usageError(found.problems.map((p) => `--measures-option ${p.rule}, got ${JSON.stringify(p.value)}`).join('; '));
    measures = found.value;
  }
  const r0 = r0FromFit(result.fit, periodsOf(scenario), measures === undefined ? args.measuresRatio : measures.phase === null ? undefined : measures.ratio);
  if (!r0.ok) throw usageError(r0.problems.map((p) => `${p.field} ${p.rule}`).join('; '));
  const fit = result.fit;
  if (args.format === 'json') {
    const json = {
      growthRatePerDay: fit.growthRatePerDay,
      growthRateInterval: fit.growthRateInterval,
      doublingTimeDays: fit.doublingTimeDays,
      r0: r0.value.r0,
      r0Interval: r0.value.r0Interval,
      doublingTimeInterval: fit.doublingTimeInterval,
      halvingTimeDays: fit.halvingTimeDays,
      halvingTimeInterval: fit.halvingTimeInterval,
      status: fit.status,
      family: fit.family,
      window: { fromDay: fit.fromDay, toDay: fit.toDay, startDate: cases.series.startDate, daysUsed: fit.daysUsed, cases: fit.casesInWindow },
      dispersion: fit.dispersion,
      measuresRatio: r0.value.measuresRatio,
      ...(measures === undefined ? {} : { measures: { option: measures.option, day: measures.day, phase: measures.phase, reproductionNumberInWindow: r0.value.reproductionNumberInWindow } }),
      notes: [...fit.notes, ...r0.value.notes, ...(measures === undefined ? [] : [measures.note])],
      caution: CAUTION,
    };
    // JSON has no infinity: an unbounded interval end is written as null.
    io.out(`${JSON.stringify(json, null, 2)}\n`);
  } else io.out(tableText(args.casesFile, fit, r0.value, scenario.title, measures));
  return EXIT_CODES.ok;
}
