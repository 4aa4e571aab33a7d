/**
 * The one atomic file writer of the command line and the main process.
 *
 * The data (text as UTF-8, or bytes such as a PDF) goes to a temporary file beside the target,
 * is flushed to disk (fsync), then renamed over the target; the folder is flushed after the
 * rename so the new name survives a power cut. A crash leaves either the old file or the new
 * one, never a half-written file (rename within one folder is atomic on POSIX and NTFS).
 *
 * - The target keeps its permission bits (a 600 file stays 600); a new file gets the usual
 *   0666 minus the umask.
 * - A target that is a symbolic link is written through: the file it points to is replaced and
 *   the link stays a link.
 * - The temporary file is removed when the write fails, and when the process is stopped by
 *   SIGINT, SIGTERM or SIGHUP (or exits) while a write is under way. The signal then keeps its
 *   usual effect: when no one else listens for it, it is raised again and ends the process.
 */
import { close, closeSync, fchmodSync, fsync, fsyncSync, lstatSync, openSync, readlinkSync, renameSync, statSync, unlinkSync, write, writeSync } from 'node:fs';
import { rename } from 'node:fs/promises';
import { promisify } from 'node:util';
import { randomBytes } from 'node:crypto';
import { basename, dirname, join, resolve } from 'node:path';

/** Most links followed before giving up (as the kernel's own limit, common practice). */
const MAX_LINK_HOPS = 40;
const STOP_SIGNALS = ['SIGINT', 'SIGTERM', 'SIGHUP'] as const;

/** Temporary files of writes under way, removed if the process is stopped. */
const liveTemporaries = new Set<string>();
let cleanupInstalled = false;

function removeLiveTemporaries(): void {
  for (const path of liveTemporaries) {
    try {
      unlinkSync(path);
    } catch {
      // Already gone (renamed or removed): nothing to clean.
    }
  }
  liveTemporaries.clear();
}

function onStopSignal(signal: NodeJS.Signals): void {
  removeLiveTemporaries();
  // Ours was the only listener: restore the default action and raise the signal again, so the
  // process ends as it would have without us.
  if (process.listenerCount(signal) === 1) {
    process.removeListener(signal, onStopSignal);
    process.kill(process.pid, signal);
  }
}

function installCleanup(): void {
  if (cleanupInstalled) return;
  cleanupInstalled = true;
  for (const signal of STOP_SIGNALS) process.on(signal, onStopSignal);
  process.on('exit', removeLiveTemporaries);
}

/** The real file a path names: symbolic links followed (also a link to a file not yet made). */
export function resolveWriteTarget(path: string): string {
  let current = resolve(path);
  for (let hop = 0; hop < MAX_LINK_HOPS; hop++) {
    let isLink: boolean;
    try {
      isLink = lstatSync(current).isSymbolicLink();
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT') return current;
      throw err;
    }
    if (!isLink) return current;
    current = resolve(dirname(current), readlinkSync(current));
  }
  throw Object.assign(new Error(`too many symbolic links: ${path}`), { code: 'ELOOP' });
}

/** Permission bits of an existing target, or null for a new file. */
function existingMode(target: string): number | null {
  try {
    return statSync(target).mode & 0o7777;
  } catch {
    return null;
  }
}

function temporaryBeside(target: string): string {
  return join(dirname(target), `.${basename(target)}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`);
}

/** Flushes a folder's entries (the rename) to disk; not possible on every platform, so best effort. */
function syncFolder(folder: string): void {
  let fd: number | null = null;
  try {
    fd = openSync(folder, 'r');
    fsyncSync(fd);
  } catch {
    // Windows cannot open a folder; the rename is still atomic there.
  } finally {
    if (fd !== null) closeSync(fd);
  }
}

function bytesOf(data: string | Uint8Array): Uint8Array {
  return typeof data === 'string' ? Buffer.from(data, 'utf8') : data;
}

/**
 * Creates the temporary file beside `target` with the target's permission bits (synchronous, so
 * the file is listed for clean-up from the moment it exists).
 */
function createTemporary(target: string): { temporary: string; fd: number } {
  installCleanup();
  const mode = existingMode(target);
  const temporary = temporaryBeside(target);
  const fd = openSync(temporary, 'wx', mode ?? 0o666);
  liveTemporaries.add(temporary);
  try {
    if (mode !== null) fchmodSync(fd, mode);
  } catch (err) {
    discard(temporary, fd);
    throw err;
  }
  return { temporary, fd };
}

function discard(temporary: string, fd: number | null): void {
  if (fd !== null) {
    try {
      closeSync(fd);
    } catch {
      // Already closed.
    }
  }
  try {
    unlinkSync(temporary);
  } catch {
    // Already renamed or removed.
  }
  liveTemporaries.delete(temporary);
}

/** Writes `data` to `path` atomically and durably (synchronous, for the command line). */
export function writeFileAtomicSync(path: string, data: string | Uint8Array): void {
  const target = resolveWriteTarget(path);
  const { temporary, fd } = createTemporary(target);
  let open: number | null = fd;
  try {
    const bytes = bytesOf(data);
    let written = 0;
    while (written < bytes.length) written += writeSync(fd, bytes, written, bytes.length - written);
    fsyncSync(fd);
    closeSync(fd);
    open = null;
    renameSync(temporary, target);
  } catch (err) {
    discard(temporary, open);
    throw err;
  }
  liveTemporaries.delete(temporary);
  syncFolder(dirname(target));
}

const writeAsync = promisify(write);
const fsyncAsync = promisify(fsync);
const closeAsync = promisify(close);

/** Writes `data` to `path` atomically and durably (for the main process, which must not block on the data). */
export async function writeFileAtomic(path: string, data: string | Uint8Array): Promise<void> {
  const target = resolveWriteTarget(path);
  const { temporary, fd } = createTemporary(target);
  let open: number | null = fd;
  try {
    const bytes = bytesOf(data);
    let written = 0;
    while (written < bytes.length) written += (await writeAsync(fd, bytes, written, bytes.length - written)).bytesWritten;
    await fsyncAsync(fd);
    await closeAsync(fd);
    open = null;
    await rename(temporary, target);
  } catch (err) {
    discard(temporary, open);
    throw err;
  }
  liveTemporaries.delete(temporary);
  syncFolder(dirname(target));
}
