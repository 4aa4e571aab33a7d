/**
 * `mixwise report FILE`: the printable policy options report as self-contained HTML (default),
 * as PDF printed by a local Chromium (--out report.pdf), or as CSV (--format csv: the options
 * table; with --series: the daily series in long format). Output goes to --out, written
 * atomically, or to the screen (HTML and CSV only).
 */
import packageJson from '../../package.json' with { type: 'json' };
import { runScenario } from '../engine/index.ts';
import { formatProblem, parseScenarioText } from '../engine/validation.ts';
import { buildReportHtml, dailySeriesCsv, optionsTableCsv, scenarioFingerprint } from '../report/index.ts';
import type { Output } from './commands.ts';
import { CliError, EXIT_CODES, type ExitCode } from './errors.ts';
import { readTextFile, writeTextFileAtomically } from './files.ts';
import { parseReportArgs, type ReportArgs } from './report-args.ts';
import { writeBytesAtomically } from './report-files.ts';
import { findChromium, printHtmlToPdf } from './report-pdf.ts';

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
  const loaded = parseScenarioText(readTextFile(args.file));
  if (!loaded.ok) {
    for (const p of loaded.problems) io.err(`mixwise: ${args.file}: ${formatProblem(p)}\n`);
    return EXIT_CODES.invalidScenario;
  }
  const results = runScenario(loaded.scenario);
  let text: string;
  if (args.format === 'csv') text = args.series ? dailySeriesCsv(results) : optionsTableCsv(results);
  else {
    const fingerprint = await scenarioFingerprint(loaded.scenario, packageJson.version);
    text = buildReportHtml(loaded.scenario, results, {
      appVersion: packageJson.version,
      generatedAt: context.now(),
      fingerprint,
      paper: args.paper,
      orientation: args.orientation,
    });
  }
  if (chromium !== null && args.out !== null) {
    writeBytesAtomically(args.out, await printHtmlToPdf(text, chromium));
  } else if (args.out !== null) writeTextFileAtomically(args.out, text);
  else io.out(text);
  return EXIT_CODES.ok;
}

/** Runs `mixwise report` with the words after "report"; never throws. */
export async function reportCommand(io: Output, words: readonly string[], context: ReportContext = processContext): Promise<ExitCode> {
  try {
    return await report(io, parseReportArgs(words), context);
  } catch (err) {
    if (err instanceof CliError) {
      io.err(`mixwise: ${err.message}\n`);
      return err.exitCode;
    }
    const message = err instanceof Error ? err.message : String(err);
    io.err(`mixwise: internal error: ${message.split('\n')[0]}\n`);
    return EXIT_CODES.internal;
  }
}
