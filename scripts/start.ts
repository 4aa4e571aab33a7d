/**
 * `npm start`: builds, then opens the app as planStart (startPlan.ts) decides: the Electron
 * desktop app; else a Chromium application window on web mode; else web mode alone. Web mode
 * serves on 127.0.0.1 and always prints its address.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync } from 'node:fs';
import { homedir } from 'node:os';
import { join } from 'node:path';
import { chromiumPath } from '../src/cli/chromium.ts';
import { electronBinaryPath } from './electronBinary.ts';
import { hasDisplay, planStart } from './startPlan.ts';

export const WEB_HOST = '127.0.0.1';
export const WEB_PORT = 4173;
const URL_SERVED = `http://${WEB_HOST}:${WEB_PORT}/`;

/** The Chromium window's own profile: the app's saved working copy lives here, apart from the user's browser. */
const PROFILE_DIR = join(process.env.XDG_CONFIG_HOME || join(homedir(), '.config'), 'mixwise', 'chromium-window');

function exitOf(child: ChildProcess): Promise<number> {
  return new Promise((resolveExit) => child.on('exit', (code) => resolveExit(code ?? 0)));
}

function run(command: string, args: string[]): ChildProcess {
  const child = spawn(command, args, { stdio: 'inherit' });
  const stop = () => child.kill('SIGTERM');
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
  return child;
}

function electronStarts(binary: string | null): boolean {
  if (binary === null) return false;
  const probe = spawnSync(binary, ['--version'], { timeout: 15_000, encoding: 'utf8' });
  return probe.status === 0;
}

/** Waits until the web server answers (at most about 30 s). */
async function served(url: string): Promise<boolean> {
  for (let k = 0; k < 120; k++) {
    try {
      if ((await fetch(url)).ok) return true;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  return false;
}

const build = spawnSync('npx', ['electron-vite', 'build'], { stdio: ['ignore', 'ignore', 'inherit'] });
if (build.status !== 0) {
  console.error('Build failed; see the messages above.');
  process.exit(build.status ?? 1);
}

const binary = electronBinaryPath();
const chromium = chromiumPath(process.env);
const plan = planStart({
  electronBinary: binary,
  electronStarts: electronStarts(binary),
  chromium: existsSync(chromium) ? chromium : null,
  hasDisplay: hasDisplay(process.platform, process.env),
  isRoot: process.getuid?.() === 0,
  url: URL_SERVED,
  profileDir: PROFILE_DIR,
});

if (plan.kind === 'electron') {
  process.exit(await exitOf(run(plan.binary, ['.'])));
}
console.log(plan.why);
console.log(`Mixwise web mode: ${plan.url}  (Ctrl+C to stop)`);
const server = run('npx', ['vite', 'preview', '--outDir', 'out/renderer', '--host', WEB_HOST, '--port', String(WEB_PORT), '--strictPort']);
if (plan.kind === 'chromium-window' && (await served(plan.url))) {
  mkdirSync(PROFILE_DIR, { recursive: true });
  const window = spawn(plan.chromium, plan.args, { stdio: 'ignore' });
  // Closing the window ends the session: stop the server too.
  window.on('exit', () => server.kill('SIGTERM'));
}
process.exit(await exitOf(server));
