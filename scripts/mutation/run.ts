/**
 * Mutation pass over src/engine: applies each mutant of mutants.ts, one at a time, to a copy of
 * the tree in the system's temporary folder, runs the engine tests there and counts the mutants
 * the tests kill (some test fails or the run exceeds its time) and those that survive.
 *
 *   nice -n 19 node --import tsx scripts/mutation/run.ts [--only id,id] [--tests test/engine,...] [--out file.json]
 *
 * A mutant counts as killed when a test fails, or when its run takes over four times as long as
 * the unmutated run (at least five minutes), which a busy machine alone does not cause.
 * `--tests` with a few files gives a lower bound on the kills (what a subset kills, the whole
 * suite kills too), handy to check new tests against the mutants they aim at.
 *
 * Slow by nature (one engine test run per mutant): run it by hand, never in CI.
 */
import { spawnSync } from 'node:child_process';
import { cpSync, existsSync, mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { MUTANTS, type Mutant } from './mutants.ts';

const root = resolve(import.meta.dirname, '..', '..');
const COPIED = ['src', 'test', 'resources', 'package.json', 'tsconfig.json', 'tsconfig.engine.json', 'tsconfig.web.json', 'vitest.config.ts'];

type Outcome = 'killed' | 'survived' | 'timeout' | 'stale';

function option(name: string): string | undefined {
  const k = process.argv.indexOf(name);
  return k >= 0 ? process.argv[k + 1] : undefined;
}

function copyTree(): string {
  const dir = mkdtempSync(join(tmpdir(), 'mixwise-mutants-'));
  for (const entry of COPIED) if (existsSync(join(root, entry))) cpSync(join(root, entry), join(dir, entry), { recursive: true });
  symlinkSync(join(root, 'node_modules'), join(dir, 'node_modules'));
  return dir;
}

/** Runs the tests in `dir` (failing fast), within `limitMs` when given. */
function runTests(dir: string, tests: string[], limitMs?: number): { pass: boolean; timedOut: boolean; failed: string; ms: number } {
  const start = Date.now();
  const r = spawnSync(join(dir, 'node_modules', '.bin', 'vitest'), ['run', ...tests, '--bail', '1', '--reporter', 'dot'], {
    cwd: dir,
    encoding: 'utf8',
    timeout: limitMs,
    env: { ...process.env, FORCE_COLOR: '0' },
  });
  const timedOut = r.error !== undefined && (r.error as NodeJS.ErrnoException).code === 'ETIMEDOUT';
  const failed = (r.stdout + r.stderr).split('\n').find((l) => l.includes('FAIL')) ?? '';
  return { pass: r.status === 0, timedOut, failed: failed.trim(), ms: Date.now() - start };
}

function apply(dir: string, m: Mutant): string | null {
  const path = join(dir, m.file);
  if (!existsSync(path)) return null;
  const text = readFileSync(path, 'utf8');
  const at = text.indexOf(m.find);
  if (at < 0 || text.indexOf(m.find, at + 1) >= 0) return null;
  writeFileSync(path, text.slice(0, at) + m.replace + text.slice(at + m.find.length));
  return text;
}

const only = option('--only')?.split(',');
const tests = (option('--tests') ?? 'test/engine').split(',');
const out = option('--out');
const mutants = only === undefined ? MUTANTS : MUTANTS.filter((m) => only.includes(m.id));
const dir = copyTree();
try {
  const baseline = runTests(dir, tests);
  if (!baseline.pass) throw new Error(`the unmutated tree fails its tests (${baseline.failed || 'no test failed: see the vitest output'}); fix that first`);
  const limitMs = Math.max(300_000, 4 * baseline.ms);
  const results: { id: string; outcome: Outcome; what: string; failed: string }[] = [];
  for (const m of mutants) {
    const original = apply(dir, m);
    let outcome: Outcome = 'stale';
    let failed = '';
    if (original !== null) {
      const r = runTests(dir, tests, limitMs);
      outcome = r.timedOut ? 'timeout' : r.pass ? 'survived' : 'killed';
      failed = r.failed;
      writeFileSync(join(dir, m.file), original);
    }
    results.push({ id: m.id, outcome, what: m.what, failed });
    console.log(`${outcome.padEnd(8)} ${m.id.padEnd(26)} ${m.what}${failed ? `  [${failed}]` : ''}`);
  }
  const count = (o: Outcome) => results.filter((r) => r.outcome === o).length;
  const tried = results.length - count('stale');
  console.log(`\n${tried} mutants tried: ${count('killed')} killed, ${count('timeout')} timed out (killed), ${count('survived')} survived; ${count('stale')} stale`);
  if (out !== undefined) writeFileSync(out, JSON.stringify(results, null, 2));
} finally {
  rmSync(dir, { recursive: true, force: true });
}
