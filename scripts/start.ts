/**
 * `npm start`: builds, then runs the desktop app when the Electron runtime works here;
 * otherwise says so in one line and serves web mode on 127.0.0.1, printing the address.
 */
import { spawn, spawnSync } from 'node:child_process';
import { electronBinaryPath } from './electronBinary.ts';

export const WEB_HOST = '127.0.0.1';
export const WEB_PORT = 4173;

function run(command: string, args: string[]): Promise<number> {
  return new Promise((resolveExit) => {
    const child = spawn(command, args, { stdio: 'inherit' });
    const stop = () => child.kill('SIGTERM');
    process.once('SIGINT', stop);
    process.once('SIGTERM', stop);
    child.on('exit', (code) => resolveExit(code ?? 0));
  });
}

function electronWorks(binary: string | null): binary is string {
  if (binary === null) return false;
  const probe = spawnSync(binary, ['--version'], { timeout: 15_000, encoding: 'utf8' });
  return probe.status === 0;
}

const build = spawnSync('npx', ['electron-vite', 'build'], { stdio: ['ignore', 'ignore', 'inherit'] });
if (build.status !== 0) {
  console.error('Build failed; see the messages above.');
  process.exit(build.status ?? 1);
}

const binary = electronBinaryPath();
if (electronWorks(binary)) {
  process.exit(await run(binary, ['.']));
} else {
  console.log(`Electron runtime is missing here (${binary === null ? 'binary not installed' : 'binary does not start'}): starting web mode instead.`);
  console.log(`Mixwise web mode: http://${WEB_HOST}:${WEB_PORT}/  (Ctrl+C to stop)`);
  process.exit(await run('npx', ['vite', 'preview', '--outDir', 'out/renderer', '--host', WEB_HOST, '--port', String(WEB_PORT), '--strictPort']));
}
