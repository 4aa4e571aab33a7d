/**
 * Writing the PDF atomically, as files.ts does for text: to a temporary file beside the target,
 * then renamed over it, so a failed run never leaves a half-written report.
 */
import { renameSync, rmSync, writeFileSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { CliError, EXIT_CODES } from './errors.ts';

export function writeBytesAtomically(path: string, bytes: Uint8Array): void {
  const temporary = join(dirname(path), `.${basename(path)}.${process.pid}.${Date.now()}.tmp`);
  try {
    writeFileSync(temporary, bytes, { flag: 'wx' });
    renameSync(temporary, path);
  } catch (err) {
    rmSync(temporary, { force: true });
    const code = (err as NodeJS.ErrnoException | null)?.code;
    const why = code === 'ENOENT' ? 'no such file or folder' : code === 'EACCES' || code === 'EPERM' ? 'permission denied' : err instanceof Error ? err.message : String(err);
    throw new CliError(`cannot write ${path}: ${why}`, EXIT_CODES.fileError);
  }
}
