/**
 * `mixwise report FILE`: the printable policy options report as self-contained HTML (default),
 * as PDF printed by a local Chromium (--out report.pdf), or as CSV (--format csv: the options
 * table; with --series: the daily series in long format). Output goes to --out, written
 * atomically, or to the screen (HTML and CSV only). With --orders OPTION, the report also prints
 * the comparison of vaccination orders for that option's campaign (the search of `mixwise orders`).
 */
import packageJson from '../../package.json' with { type: 'json' };
import { runScenario, type Scenario } from '../engine/index.ts';
import { buildReportHtml, dailySeriesCsv, optionsTableCsv, scenarioFingerprint } from '../report/index.ts';
import { loadScenarioOrComplain, type Output } from './commands.ts';
import { EXIT_CODES, inFile, reportFault, type ExitCode } from './errors.ts';
import { writeFileAtomically } from './files.ts';
import { parseReportArgs, type ReportArgs } from './reportArgs.ts';
import { findChromium, printHtmlToPdf } from './reportPdf.ts';
import { findOrderComparison } from './orders.ts';
import { computeDrawsOnThreads, drawThreadsFor, summarise } from './uncertainty.ts';
import type { DrawSummary } from '../report/drawSummary.ts';

/** With an uncertainty section: its draws (on one thread per core from 64 draws up) and their summary, as `mixwise run` computes them. */
async function drawSummaryOf(scenario: Scenario): Promise<DrawSummary | undefined> {
  const u = scenario.uncertainty;
  if (u === undefined) return undefined;
  return { summary: summarise(scenario, await computeDrawsOnThreads(scenario, 0, u.draws, drawThreadsFor(u.draws, null))), parameters: u.parameters };
}

export interface ReportContext {
  /** Environment (CHROMIUM_PATH). */
  env: Record<string, string | undefined>;
  /** Time printed on the report. */
  now: () => Date;
}

const processContext: ReportContext = { env: process.env, now: () => new Date() };

async function report(io: Output, args: ReportArgs, context: ReportContext): Promise<ExitCode> {
  // Look for Chromium before the model runs, so a missing browser is reported at once.
  const chromium = args.format === 'pdf' ? findChromium(context.env) : null;
  const loaded = loadScenarioOrComplain(io, args.file);
  if (loaded === null) return EXIT_CODES.invalidScenario;
  const { scenario } = loaded;
  const orderComparison = args.orders === null ? undefined : await findOrderComparison(io, scenario, { file: args.file, ...args.orders, optionFlag: '--orders', format: 'table', draws: null, settings: args.orders.top === undefined ? {} : { top: args.orders.top } });
  if (orderComparison === null) return EXIT_CODES.cancelled;
  const results = runScenario(scenario, loaded.calibration);
  const draws = await drawSummaryOf(scenario);
  const fingerprint = await scenarioFingerprint(scenario, packageJson.version);
  const source = { fingerprint, appVersion: packageJson.version };
  let text: string;
  if (args.format === 'csv') text = args.series ? dailySeriesCsv(results, source) : optionsTableCsv(results, source, draws);
  else {
    text = buildReportHtml(scenario, results, {
      appVersion: packageJson.version,
      generatedAt: context.now(),
      fingerprint,
      paper: args.paper,
      orientation: args.orientation,
      ...(orderComparison === undefined ? {} : { orderComparison }),
      ...(draws === undefined ? {} : { draws: draws.summary }),
    });
  }
  if (args.out === null) io.out(text);
  else writeFileAtomically(args.out, chromium === null ? text : await printHtmlToPdf(text, chromium));
  return EXIT_CODES.ok;
}

/** Runs `mixwise report` with the words after "report"; never throws. */
export async function reportCommand(io: Output, words: readonly string[], context: ReportContext = processContext): Promise<ExitCode> {
  try {
    const args = parseReportArgs(words);
    try {
      return await report(io, args, context);
    } catch (err) {
      throw inFile(err, args.file);
    }
  } catch (err) {
    return reportFault(err, (text) => io.err(text));
  }
}
