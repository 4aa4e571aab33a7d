/**
 * Reading a scenario file and writing an output file (text or bytes), with one-line messages on failure.
 * Output is written atomically by the shared writer (src/shared/atomicWrite.ts), so a failed or
 * interrupted run never leaves a half-written file, a stray temporary file, or destroys the old one.
 */
import { readFileSync } from 'node:fs';
import { writeFileAtomicSync } from '../shared/atomicWrite.ts';
import { decodeUtf8Text } from '../shared/textFile.ts';
import { CliError, EXIT_CODES } from './errors.ts';

/** Plain words for the file-system error codes a user is likely to meet. */
function reason(err: unknown): string {
  const code = (err as NodeJS.ErrnoException | null)?.code;
  switch (code) {
    case 'ENOENT':
      return 'no such file or folder';
    case 'EACCES':
    case 'EPERM':
      return 'permission denied';
    case 'EISDIR':
      return 'is a folder, not a file';
    case 'ENOTDIR':
      return 'a part of the path is not a folder';
    case 'ENOSPC':
      return 'no space left on the device';
    case 'EROFS':
      return 'read-only file system';
    default:
      return err instanceof Error ? err.message : String(err);
  }
}

/** The text of a UTF-8 file (a byte order mark dropped); any other encoding is refused in one line. */
export function readTextFile(path: string): string {
  let bytes: Uint8Array;
  try {
    bytes = readFileSync(path);
  } catch (err) {
    throw new CliError(`cannot read ${path}: ${reason(err)}`, EXIT_CODES.fileError);
  }
  const decoded = decodeUtf8Text(bytes);
  if (!decoded.ok) throw new CliError(`${path} ${decoded.rule}`, EXIT_CODES.invalidScenario);
  return decoded.text;
}

/** Writes `content` (text as UTF-8, or bytes such as a PDF) to `path` atomically. */
export function writeFileAtomically(path: string, content: string | Uint8Array): void {
  try {
    writeFileAtomicSync(path, content);
  } catch (err) {
    throw new CliError(`cannot write ${path}: ${reason(err)}`, EXIT_CODES.fileError);
  }
}
