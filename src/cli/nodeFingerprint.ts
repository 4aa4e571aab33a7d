/**
 * The scenario fingerprint computed synchronously with Node's SHA-256, for the commands that do
 * not wait (`mixwise run`). It hashes the same text as `scenarioFingerprint` (src/report/fingerprint.ts,
 * Web Crypto), so both give the same 64 hex characters (checked in test/cli/csvAgreement.test.ts).
 */
import { createHash } from 'node:crypto';
import packageJson from '../../package.json' with { type: 'json' };
import type { CsvSource } from '../report/csv.ts';
import { fingerprintInput } from '../report/fingerprint.ts';

/** Full SHA-256 fingerprint (hex) of a validated scenario and the app version. */
export function scenarioFingerprintSync(scenario: unknown, appVersion: string): string {
  return createHash('sha256').update(fingerprintInput(scenario, appVersion), 'utf8').digest('hex');
}

/** The CSV header's source line for a scenario under this program's version. */
export function csvSourceOf(scenario: unknown): CsvSource {
  return { fingerprint: scenarioFingerprintSync(scenario, packageJson.version), appVersion: packageJson.version };
}
