/** Shared helpers for the command-line tests: in-process runs with captured output, temp files. */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { main } from '../../src/cli/main.ts';

export const ROOT = fileURLToPath(new URL('../../', import.meta.url));
export const DEMO = join(ROOT, 'resources/demo-scenario.json');

export interface Captured {
  code: number;
  stdout: string;
  stderr: string;
}

/** Runs the command line in this process and captures what it prints. */
export function runCli(...argv: string[]): Captured {
  let stdout = '';
  let stderr = '';
  const code = main(argv, { out: (t) => void (stdout += t), err: (t) => void (stderr += t) });
  return { code, stdout, stderr };
}

/** A fresh temporary folder for one test. */
export function tempDir(): string {
  return mkdtempSync(join(tmpdir(), 'mixwise-cli-'));
}

/** The demo scenario as a plain object, to alter in a test. */
export function demoJson(): Record<string, any> {
  return JSON.parse(readFileSync(DEMO, 'utf8'));
}

/** Writes `content` (object -> JSON, string as is) to `name` in a temp folder; returns the path. */
export function writeTemp(name: string, content: unknown): string {
  const path = join(tempDir(), name);
  writeFileSync(path, typeof content === 'string' ? content : JSON.stringify(content));
  return path;
}
