/**
 * Reading and writing scenario files in the main process. The text is validated with the
 * engine's own rules before it is written: an invalid scenario never replaces a file.
 */
import { readFile, stat } from 'node:fs/promises';
import { basename } from 'node:path';
import { formatProblem, parseScenarioText } from '../engine/index.ts';
import { writeFileAtomic } from '../shared/atomicWrite.ts';
import { decodeUtf8Text } from '../shared/textFile.ts';
import type { OpenedScenarioFile } from '../shared/hostApi.ts';

/** Largest scenario file accepted, bytes (a 16-band scenario is ~30 kB; common practice margin). */
export const MAX_SCENARIO_BYTES = 5 * 1024 * 1024;

export async function readScenarioFile(path: string): Promise<OpenedScenarioFile> {
  const info = await stat(path);
  if (!info.isFile()) throw new Error(`${path} is not a file`);
  if (info.size > MAX_SCENARIO_BYTES) throw new Error(`${basename(path)} is larger than ${MAX_SCENARIO_BYTES / 1024 / 1024} MB`);
  const decoded = decodeUtf8Text(await readFile(path));
  if (!decoded.ok) throw new Error(`${basename(path)} ${decoded.rule}`);
  return { name: basename(path), path, text: decoded.text };
}

/** Validation problems of a scenario text, one line each (empty when valid). */
export function scenarioTextProblems(text: string): string[] {
  const result = parseScenarioText(text);
  return result.ok ? [] : result.problems.map(formatProblem);
}

/** Writes the scenario atomically after validating it; throws (and writes nothing) when invalid. */
export async function saveScenarioText(path: string, text: string): Promise<void> {
  const problems = scenarioTextProblems(text);
  if (problems.length > 0) {
    throw new Error(`Not saved: the scenario is not valid.\n${problems.slice(0, 5).join('\n')}`);
  }
  await writeFileAtomic(path, text);
}
