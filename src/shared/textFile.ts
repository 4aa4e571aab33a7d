/**
 * Text files (scenarios, case counts) must be UTF-8 (RFC 3629); a leading byte order mark is
 * dropped. Any other encoding is refused with one plain line instead of being read with
 * replacement characters or echoing raw bytes. No Node or DOM imports: used by the command
 * line, the main process and the renderer alike.
 */

export type DecodedText = { ok: true; text: string } | { ok: false; rule: string };

const BOM = [0xef, 0xbb, 0xbf];

/** Byte offset of the first byte that breaks UTF-8 (RFC 3629, Table 3-7 of Unicode 15 ch. 3), or -1. */
export function firstInvalidUtf8Byte(bytes: Uint8Array): number {
  let i = 0;
  while (i < bytes.length) {
    const b = bytes[i];
    if (b < 0x80) {
      i++;
      continue;
    }
    let need: number;
    let low = 0x80;
    let high = 0xbf;
    if (b >= 0xc2 && b <= 0xdf) need = 1;
    else if (b >= 0xe0 && b <= 0xef) {
      need = 2;
      if (b === 0xe0) low = 0xa0; // no overlong forms
      if (b === 0xed) high = 0x9f; // no surrogates
    } else if (b >= 0xf0 && b <= 0xf4) {
      need = 3;
      if (b === 0xf0) low = 0x90;
      if (b === 0xf4) high = 0x8f; // nothing above U+10FFFF
    } else return i;
    for (let k = 1; k <= need; k++) {
      const c = bytes[i + k];
      if (c === undefined) return i;
      if (k === 1 ? c < low || c > high : c < 0x80 || c > 0xbf) return i;
    }
    i += need + 1;
  }
  return -1;
}

/** 1-based line of a byte offset (counting LF bytes before it). */
function lineOf(bytes: Uint8Array, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset; i++) if (bytes[i] === 0x0a) line++;
  return line;
}

const hex = (b: number): string => `0x${b.toString(16).toUpperCase().padStart(2, '0')}`;

/** The text of a UTF-8 file, or the rule it breaks (one line, no raw bytes from the file). */
export function decodeUtf8Text(bytes: Uint8Array): DecodedText {
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
    return { ok: false, rule: 'must be UTF-8 text, but it is UTF-16 (save it again as UTF-8)' };
  }
  const nul = bytes.indexOf(0);
  if (nul >= 0) {
    return { ok: false, rule: `must be UTF-8 text, but it holds a NUL byte on line ${lineOf(bytes, nul)} (UTF-16 or not a text file; save it again as UTF-8)` };
  }
  const bad = firstInvalidUtf8Byte(bytes);
  if (bad >= 0) {
    return {
      ok: false,
      rule: `must be UTF-8 text, but byte ${hex(bytes[bad])} on line ${lineOf(bytes, bad)} is not UTF-8 (perhaps Latin-1 or Windows-1252; save it again as UTF-8)`,
    };
  }
  const start = BOM.every((b, k) => bytes[k] === b) ? BOM.length : 0;
  return { ok: true, text: new TextDecoder('utf-8').decode(bytes.subarray(start)) };
}
