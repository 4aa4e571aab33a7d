import { describe, expect, it } from 'vitest';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { decodeUtf8Text, firstInvalidUtf8Byte } from '../../src/shared/textFile.ts';
import { DEMO, runCli, tempDir } from '../cli/helpers.ts';

const bytes = (...b: number[]) => Uint8Array.from(b);
const utf8 = (s: string) => new TextEncoder().encode(s);

describe('UTF-8 text files', () => {
  it('reads UTF-8, with or without a byte order mark', () => {
    expect(decodeUtf8Text(utf8('{"title": "Région Nord 🦠"}'))).toEqual({ ok: true, text: '{"title": "Région Nord 🦠"}' });
    expect(decodeUtf8Text(bytes(0xef, 0xbb, 0xbf, 0x7b, 0x7d))).toEqual({ ok: true, text: '{}' });
  });

  it('refuses Latin-1 naming the byte and its line (it was read with replacement characters)', () => {
    // "Région" in Latin-1: é is the single byte 0xE9.
    expect(decodeUtf8Text(bytes(0x7b, 0x0a, 0x52, 0xe9, 0x67, 0x7d))).toEqual({
      ok: false,
      rule: 'must be UTF-8 text, but byte 0xE9 on line 2 is not UTF-8 (perhaps Latin-1 or Windows-1252; save it again as UTF-8)',
    });
  });

  it('refuses UTF-16 with or without a byte order mark, and never echoes its NUL bytes', () => {
    const le = bytes(0xff, 0xfe, 0x7b, 0x00, 0x7d, 0x00);
    expect(decodeUtf8Text(le)).toEqual({ ok: false, rule: 'must be UTF-8 text, but it is UTF-16 (save it again as UTF-8)' });
    const bare = bytes(0x7b, 0x00, 0x0a, 0x00, 0x7d, 0x00);
    const result = decodeUtf8Text(bare);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.rule).toBe('must be UTF-8 text, but it holds a NUL byte on line 1 (UTF-16 or not a text file; save it again as UTF-8)');
  });

  it('finds overlong forms, surrogates, code points above U+10FFFF and cut sequences (RFC 3629)', () => {
    expect(firstInvalidUtf8Byte(bytes(0x41, 0xc0, 0xaf))).toBe(1); // overlong '/'
    expect(firstInvalidUtf8Byte(bytes(0xe0, 0x80, 0xaf))).toBe(0); // overlong 3-byte
    expect(firstInvalidUtf8Byte(bytes(0xed, 0xa0, 0x80))).toBe(0); // surrogate U+D800
    expect(firstInvalidUtf8Byte(bytes(0xf4, 0x90, 0x80, 0x80))).toBe(0); // above U+10FFFF
    expect(firstInvalidUtf8Byte(bytes(0x41, 0xe2, 0x82))).toBe(1); // cut short
    expect(firstInvalidUtf8Byte(utf8('€ 𝄞 é'))).toBe(-1);
  });

  it('mixwise check refuses a UTF-16 scenario in one line without raw bytes (exit 2)', () => {
    const text = readFileSync(DEMO, 'utf8');
    const file = join(tempDir(), 'utf16.json');
    writeFileSync(file, Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, 'utf16le')]));
    const r = runCli('check', file);
    expect(r.code).toBe(2);
    expect(r.stderr).toBe(`mixwise: ${file} must be UTF-8 text, but it is UTF-16 (save it again as UTF-8)\n`);
    expect(r.stdout).toBe('');
  });
});
