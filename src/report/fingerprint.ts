/**
 * Scenario fingerprint: a short code printed on every page of a report so that any number can be
 * traced back to the exact inputs and program version that produced it.
 *
 *   fingerprint = hex( SHA-256( UTF-8( canonicalJson(scenario) + "\nmixwise " + appVersion ) ) )
 *
 * The canonical JSON sorts object keys recursively (arrays keep their order), has no whitespace,
 * and writes numbers as JavaScript's shortest round-trip form, so two files that differ only in
 * key order or layout give the same fingerprint, while any changed value gives another. It is
 * taken over the validated scenario (defaults filled in), so writing a default out explicitly
 * does not change it. SHA-256: FIPS 180-4, through Web Crypto (`crypto.subtle`, in browsers and Node 20).
 */

/** The parts of Web Crypto and the Encoding API used here (typed locally: this module sees neither DOM nor Node types). */
interface Sha256Digest {
  digest(algorithm: 'SHA-256', data: Uint8Array): Promise<ArrayBuffer>;
}
interface WebGlobals {
  crypto?: { subtle?: Sha256Digest };
  TextEncoder?: new () => { encode(text: string): Uint8Array };
}

/** Number of hex characters shown on every page (48 bits: chance collisions are negligible). */
export const SHORT_FINGERPRINT_LENGTH = 12;

/** JSON with object keys sorted recursively; `undefined` members are left out, as JSON.stringify does. */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') {
    const text = JSON.stringify(value);
    return text === undefined ? 'null' : text;
  }
  if (Array.isArray(value)) return `[${value.map((item) => canonicalJson(item === undefined ? null : item)).join(',')}]`;
  const record = value as Record<string, unknown>;
  const members = Object.keys(record)
    .filter((key) => record[key] !== undefined)
    .sort()
    .map((key) => `${JSON.stringify(key)}:${canonicalJson(record[key])}`);
  return `{${members.join(',')}}`;
}

function webGlobals(): Required<WebGlobals> & { crypto: { subtle: Sha256Digest } } {
  const g = globalThis as WebGlobals;
  const subtle = g.crypto?.subtle;
  if (subtle === undefined || g.TextEncoder === undefined) throw new Error('Web Crypto (crypto.subtle) is not available to compute the scenario fingerprint');
  return { crypto: { subtle }, TextEncoder: g.TextEncoder };
}

/** The text the fingerprint hashes: canonical JSON of the scenario, a line break, "mixwise <version>". */
export function fingerprintInput(scenario: unknown, appVersion: string): string {
  return `${canonicalJson(scenario)}\nmixwise ${appVersion}`;
}

/** Full SHA-256 fingerprint of a scenario and the app version, 64 lower-case hex characters. */
export async function scenarioFingerprint(scenario: unknown, appVersion: string): Promise<string> {
  const text = fingerprintInput(scenario, appVersion);
  const web = webGlobals();
  const digest = await web.crypto.subtle.digest('SHA-256', new web.TextEncoder().encode(text));
  return Array.from(new Uint8Array(digest), (byte) => byte.toString(16).padStart(2, '0')).join('');
}

/** The short form printed on every page: the first 12 hex characters. */
export function shortFingerprint(fingerprint: string): string {
  return fingerprint.slice(0, SHORT_FINGERPRINT_LENGTH);
}
