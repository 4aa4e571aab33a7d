/**
 * Atomic file write: the data (text as UTF-8, or bytes) goes to a temporary file beside the target, is flushed to
 * disk, then renamed over the target. A crash leaves either the old file or the new one,
 * never a half-written file (rename within one directory is atomic on POSIX and NTFS).
 */
import { open, rename, unlink } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import { randomBytes } from 'node:crypto';

export async function writeFileAtomic(targetPath: string, data: string | Uint8Array): Promise<void> {
  const tempPath = join(dirname(targetPath), `.${basename(targetPath)}.${randomBytes(6).toString('hex')}.tmp`);
  const handle = await open(tempPath, 'wx');
  try {
    await handle.writeFile(data, typeof data === 'string' ? 'utf8' : undefined);
    await handle.sync();
  } catch (err) {
    await handle.close();
    await unlink(tempPath).catch(() => undefined);
    throw err;
  }
  await handle.close();
  try {
    await rename(tempPath, targetPath);
  } catch (err) {
    await unlink(tempPath).catch(() => undefined);
    throw err;
  }
}
