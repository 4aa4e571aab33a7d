/**
 * Where the Electron binary is, without triggering electron's lazy download
 * (requiring the `electron` package would try to fetch it). Null when it is not installed.
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

export function electronBinaryPath(projectRoot: string = process.cwd()): string | null {
  const packageDir = join(projectRoot, 'node_modules', 'electron');
  const pathFile = join(packageDir, 'path.txt');
  if (!existsSync(pathFile)) return null;
  const relative = readFileSync(pathFile, 'utf8').trim();
  const distDir = process.env.ELECTRON_OVERRIDE_DIST_PATH ?? join(packageDir, 'dist');
  const executable = join(distDir, relative);
  return existsSync(executable) ? executable : null;
}
