import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { chmodSync, lstatSync, mkdtempSync, readdirSync, readFileSync, readlinkSync, rmSync, statSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { writeFileAtomic, writeFileAtomicSync } from '../../src/shared/atomicWrite.ts';

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'mixwise-atomic-'));
});
afterEach(() => {
  rmSync(dir, { recursive: true, force: true });
});

const writers = [
  ['writeFileAtomicSync', async (p: string, d: string | Uint8Array) => writeFileAtomicSync(p, d)],
  ['writeFileAtomic', writeFileAtomic],
] as const;

describe.each(writers)('%s', (_name, write) => {
  it.each([0o600, 0o664, 0o755])('keeps the permission bits (%o) of the file it replaces, whatever the umask', async (mode) => {
    const target = join(dir, 'secret.json');
    writeFileSync(target, 'old');
    chmodSync(target, mode);
    const before = process.umask(0o077);
    try {
      await write(target, 'new');
    } finally {
      process.umask(before);
    }
    expect(readFileSync(target, 'utf8')).toBe('new');
    expect(statSync(target).mode & 0o777).toBe(mode);
    expect(readdirSync(dir)).toEqual(['secret.json']);
  });

  it('writes through a symbolic link and leaves the link a link', async () => {
    const real = join(dir, 'real.json');
    const link = join(dir, 'link.json');
    writeFileSync(real, 'old');
    symlinkSync('real.json', link);
    await write(link, 'new');
    expect(lstatSync(link).isSymbolicLink()).toBe(true);
    expect(readlinkSync(link)).toBe('real.json');
    expect(readFileSync(real, 'utf8')).toBe('new');
    expect(readdirSync(dir).sort()).toEqual(['link.json', 'real.json']);
  });

  it('creates the file a dangling link points to', async () => {
    symlinkSync('made.json', join(dir, 'link.json'));
    await write(join(dir, 'link.json'), new Uint8Array([1, 2, 3]));
    expect([...readFileSync(join(dir, 'made.json'))]).toEqual([1, 2, 3]);
    expect(lstatSync(join(dir, 'link.json')).isSymbolicLink()).toBe(true);
  });

  it('removes its temporary file when the rename fails and keeps the old file', async () => {
    writeFileSync(join(dir, 'good.json'), 'kept');
    const blocked = join(dir, 'blocked');
    (await import('node:fs')).mkdirSync(join(blocked, 'inner'), { recursive: true });
    await expect(write(blocked, 'x')).rejects.toThrow();
    expect(readdirSync(dir).sort()).toEqual(['blocked', 'good.json']);
    expect(readFileSync(join(dir, 'good.json'), 'utf8')).toBe('kept');
  });
});

describe('a write stopped by a signal', () => {
  it.each(['SIGTERM', 'SIGINT'])('leaves no temporary file after %s, and the process still ends by the signal', (signal) => {
    const target = join(dir, 'out.csv');
    writeFileSync(target, 'old');
    const module = resolve('src/shared/atomicWrite.ts');
    // 16 MB written asynchronously; the signal arrives while the write is under way.
    const script = `
      const { writeFileAtomic } = await import(${JSON.stringify(module)});
      writeFileAtomic(${JSON.stringify(target)}, 'x'.repeat(16 * 1024 * 1024));
      process.kill(process.pid, ${JSON.stringify(signal)});
      setTimeout(() => {}, 10000);
    `;
    const child = spawnSync(process.execPath, ['--import', 'tsx', '--input-type=module', '-e', script], { encoding: 'utf8' });
    expect(child.stderr).toBe('');
    expect(child.signal).toBe(signal);
    expect(readdirSync(dir)).toEqual(['out.csv']);
    const text = readFileSync(target, 'utf8');
    expect(text === 'old' || text.length === 16 * 1024 * 1024).toBe(true);
  });
});
