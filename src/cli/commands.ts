/**
 * The two commands: `run` (policy options table) and `check` (validation report).
 * Each writes through `Output` and returns its exit code; file and usage faults are thrown
 * as `CliError` and reported by main.
 */
import { formatProblem, parseScenarioText, reciprocityBySetting, runScenarioSummary, type Calibration, type DrawResult, type Scenario, type ScenarioSummary, type ValidationResult } from '../engine/index.ts';
import type { DrawOptions, OutputFormat } from './args.ts';
import { mergeParts, partFileText } from './drawParts.ts';
import { computeDraws, computeDrawsOnThreads, drawThreadsFor, scenarioForDraws, summarise } from './uncertainty.ts';
import { DRAW_OUTCOME_KEYS } from '../report/drawOutcomes.ts';
import { EXIT_CODES, inFile, type ExitCode } from './errors.ts';
import { readTextFile, writeFileAtomically } from './files.ts';
import { formatReport } from './format.ts';
import { csvSourceOf } from './nodeFingerprint.ts';
import { reciprocityNotes, reciprocityRows } from './reciprocityNotes.ts';
import { runOnThreads, threadsFor } from './runOnPool.ts';

export interface Output {
  out(text: string): void;
  err(text: string): void;
  /** True when `err` writes to a terminal: progress lines rewritten in place are then welcome. */
  errIsTerminal?: boolean;
}

function loadScenario(file: string): ValidationResult {
  return parseScenarioText(readTextFile(file));
}

/**
 * The valid scenario in `file` with its calibration, or null after writing each of its problems
 * as a `mixwise: FILE: ...` line on stderr.
 */
export function loadScenarioOrComplain(io: Output, file: string): { scenario: Scenario; calibration: Calibration } | null {
  const loaded = loadScenario(file);
  if (loaded.ok) return loaded;
  for (const p of loaded.problems) io.err(`mixwise: ${file}: ${formatProblem(p)}\n`);
  return null;
}

function writeResults(io: Output, scenario: Scenario, results: ScenarioSummary, format: OutputFormat, out: string | null): ExitCode {
  write(io, out, formatReport(results, format, csvSourceOf(scenario)));
  return EXIT_CODES.ok;
}

function write(io: Output, out: string | null, text: string): void {
  if (out === null) io.out(text);
  else writeFileAtomically(out, text);
}

/** The options report of a scenario, with the summary of its draws (draws 0..N-1 in order) when it has an uncertainty section. */
function reportText(scenario: Scenario, calibration: Calibration | undefined, format: OutputFormat, draws: () => DrawResult[]): string {
  const summary = scenario.uncertainty === undefined ? undefined : { summary: summarise(scenario, draws()), parameters: scenario.uncertainty.parameters };
  return formatReport(runScenarioSummary(scenario, calibration), format, csvSourceOf(scenario), summary);
}

/** The draws `run` computes: the `--draw-range` slice, else all of them. */
function drawRangeOf(scenario: Scenario, drawOptions: DrawOptions): { from: number; to: number } {
  return drawOptions.range ?? { from: 0, to: scenario.uncertainty?.draws ?? 0 };
}

/** What `run` writes once its draws are computed: a part file for a `--draw-range` slice, else the report. */
function drawRunText(scenario: Scenario, calibration: Calibration, format: OutputFormat, drawOptions: DrawOptions, results: DrawResult[]): string {
  const range = drawOptions.range;
  if (range !== undefined) return partFileText(scenario, DRAW_OUTCOME_KEYS, range.from, range.to, results);
  return reportText(scenario, calibration, format, () => results);
}

/** `run` on this thread; with an uncertainty section, also its draws (or the slice `--draw-range` asks for). */
export function runCommand(io: Output, file: string, format: OutputFormat, out: string | null, drawOptions: DrawOptions = {}): ExitCode {
  try {
    return runFile(io, file, format, out, drawOptions);
  } catch (err) {
    throw inFile(err, file);
  }
}

function runFile(io: Output, file: string, format: OutputFormat, out: string | null, drawOptions: DrawOptions): ExitCode {
  const loaded = loadScenarioOrComplain(io, file);
  if (loaded === null) return EXIT_CODES.invalidScenario;
  const scenario = scenarioForDraws(loaded.scenario, drawOptions);
  if (scenario.uncertainty === undefined) return writeResults(io, scenario, runScenarioSummary(scenario, loaded.calibration), format, out);
  const { from, to } = drawRangeOf(scenario, drawOptions);
  write(io, out, drawRunText(scenario, loaded.calibration, format, drawOptions, computeDraws(scenario, from, to)));
  return EXIT_CODES.ok;
}

/** `mixwise merge PART...`: the output a single run over all the parts' draws gives. */
export function mergeCommand(io: Output, files: readonly string[], format: OutputFormat, out: string | null): ExitCode {
  const merged = mergeParts(files.map((file) => ({ file, text: readTextFile(file) })), DRAW_OUTCOME_KEYS);
  write(io, out, reportText(merged.scenario, merged.calibration, format, () => merged.results));
  return EXIT_CODES.ok;
}

/**
 * `run` with the options, or the draws, spread over worker threads when there are many
 * (runOnPool.ts, uncertainty.ts); the same output as `runCommand`.
 */
export async function runCommandOnThreads(io: Output, file: string, format: OutputFormat, out: string | null, workers: number | null, drawOptions: DrawOptions = {}): Promise<ExitCode> {
  try {
    return await runFileOnThreads(io, file, format, out, workers, drawOptions);
  } catch (err) {
    throw inFile(err, file);
  }
}

async function runFileOnThreads(io: Output, file: string, format: OutputFormat, out: string | null, workers: number | null, drawOptions: DrawOptions): Promise<ExitCode> {
  const loaded = loadScenarioOrComplain(io, file);
  if (loaded === null) return EXIT_CODES.invalidScenario;
  const scenario = scenarioForDraws(loaded.scenario, drawOptions);
  if (scenario.uncertainty === undefined) return writeResults(io, scenario, await runOnThreads(scenario, loaded.calibration, threadsFor(scenario, workers)), format, out);
  const { from, to } = drawRangeOf(scenario, drawOptions);
  const results = await computeDrawsOnThreads(scenario, from, to, drawThreadsFor(to - from, workers));
  write(io, out, drawRunText(scenario, loaded.calibration, format, drawOptions, results));
  return EXIT_CODES.ok;
}

export function checkCommand(io: Output, file: string): ExitCode {
  const loaded = loadScenario(file);
  if (!loaded.ok) {
    for (const p of loaded.problems) io.out(`${file}: ${formatProblem(p)}\n`);
    const count = loaded.problems.length;
    io.out(`${file} is not valid: ${count} problem${count === 1 ? '' : 's'}\n`);
    return EXIT_CODES.invalidScenario;
  }
  const s = loaded.scenario;
  io.out(
    `${file} is valid: "${s.title}", ${s.ageBands.length} age bands, ${s.settings.length} settings, ` +
      `${s.options.length} policy options, ${s.horizonDays} days\n`,
  );
  const bandLabels = s.ageBands.map((b) => b.label);
  for (const note of reciprocityNotes(reciprocityRows(reciprocityBySetting(s), bandLabels))) io.out(`${file}: note: ${note}\n`);
  return EXIT_CODES.ok;
}
