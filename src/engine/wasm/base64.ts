/**
 * Base64 (RFC 4648, section 4) to bytes, for the kernel binaries carried as text. The engine runs
 * in Node, workers and pages alike and types against ES2022 only, so it does not rely on `atob`.
 */

const ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/';

export function decodeBase64(text: string): Uint8Array {
  const values = new Int8Array(128).fill(-1);
  for (let i = 0; i < ALPHABET.length; i++) values[ALPHABET.charCodeAt(i)] = i;
  let end = text.length;
  while (end > 0 && text[end - 1] === '=') end--;
  const bytes = new Uint8Array(Math.floor((end * 6) / 8));
  let bits = 0;
  let held = 0;
  let at = 0;
  for (let i = 0; i < end; i++) {
    const code = text.charCodeAt(i);
    const v = code < 128 ? values[code] : -1;
    if (v < 0) throw new Error(`not base64: character ${JSON.stringify(text[i])} at ${i}`);
    bits = ((bits << 6) | v) & 0xffffff;
    held += 6;
    if (held >= 8) {
      held -= 8;
      bytes[at++] = (bits >> held) & 0xff;
    }
  }
  return bytes;
}
