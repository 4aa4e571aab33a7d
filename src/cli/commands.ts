/**
 * The two commands: `run` (policy options table) and `check` (validation report).
 * Each writes through `Output` and returns its exit code; file and usage faults are thrown
 * as `CliError` and reported by main.
 */
import { formatProblem, parseScenarioText, reciprocityBySetting, runScenario, type Calibration, type Scenario, type ScenarioResults, type ValidationResult } from '../engine/index.ts';
import type { OutputFormat } from './args.ts';
import { EXIT_CODES, type ExitCode } from './errors.ts';
import { readTextFile, writeFileAtomically } from './files.ts';
import { formatReport } from './format.ts';
import { csvSourceOf } from './nodeFingerprint.ts';
import { reciprocityNotes, reciprocityRows } from './reciprocityNotes.ts';
import { runOnThreads, threadsFor } from './runOnPool.ts';

export interface Output {
  out(text: string): void;
  err(text: string): void;
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

function writeResults(io: Output, scenario: Scenario, results: ScenarioResults, format: OutputFormat, out: string | null): ExitCode {
  const text = formatReport(results, format, csvSourceOf(scenario));
  if (out === null) io.out(text);
  else writeFileAtomically(out, text);
  return EXIT_CODES.ok;
}

/** `run` on this thread. */
export function runCommand(io: Output, file: string, format: OutputFormat, out: string | null): ExitCode {
  const loaded = loadScenarioOrComplain(io, file);
  if (loaded === null) return EXIT_CODES.invalidScenario;
  return writeResults(io, loaded.scenario, runScenario(loaded.scenario, loaded.calibration), format, out);
}

/** `run` with the options spread over worker threads when there are many (runOnPool.ts); the same output. */
export async function runCommandOnThreads(io: Output, file: string, format: OutputFormat, out: string | null, workers: number | null): Promise<ExitCode> {
  const loaded = loadScenarioOrComplain(io, file);
  if (loaded === null) return EXIT_CODES.invalidScenario;
  return writeResults(io, loaded.scenario, await runOnThreads(loaded.scenario, loaded.calibration, threadsFor(loaded.scenario, workers)), format, out);
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
