import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseScenarioText } from '../../src/engine/validation.ts';
import { canonicalJson, scenarioFingerprint, shortFingerprint } from '../../src/report/fingerprint.ts';
import { DEMO_PATH } from '../helpers/demo.ts';

/** Rebuilds a JSON value with every object's keys in reverse order (same content, other order). */
function reverseKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(reverseKeys);
  if (value !== null && typeof value === 'object') {
    return Object.fromEntries(Object.keys(value).reverse().map((k) => [k, reverseKeys((value as Record<string, unknown>)[k])]));
  }
  return value;
}

function parse(text: string) {
  const r = parseScenarioText(text);
  if (!r.ok) throw new Error('invalid scenario');
  return r.scenario;
}

describe('canonicalJson', () => {
  it('sorts keys recursively, keeps array order, drops undefined members', () => {
    expect(canonicalJson({ b: 1, a: { d: [3, 1, { z: 0, y: null }], c: 'x' }, u: undefined })).toBe('{"a":{"c":"x","d":[3,1,{"y":null,"z":0}]},"b":1}');
  });
});

describe('scenarioFingerprint', () => {
  const text = readFileSync(DEMO_PATH, 'utf8');

  it('is the SHA-256 of the canonical JSON and the version (checked with node:crypto)', async () => {
    const scenario = parse(text);
    const expected = createHash('sha256').update(`${canonicalJson(scenario)}\nmixwise 1.2.3`, 'utf8').digest('hex');
    expect(await scenarioFingerprint(scenario, '1.2.3')).toBe(expected);
  });

  it('does not change with key order or layout of the file', async () => {
    const shuffled = JSON.stringify(reverseKeys(JSON.parse(text)), null, 1);
    expect(shuffled).not.toBe(text);
    expect(await scenarioFingerprint(parse(shuffled), '0.1.0')).toBe(await scenarioFingerprint(parse(text), '0.1.0'));
  });

  it('changes when a value or the app version changes', async () => {
    const base = await scenarioFingerprint(parse(text), '0.1.0');
    const edited = JSON.parse(text);
    edited.populationPersons[3] += 1;
    expect(await scenarioFingerprint(parse(JSON.stringify(edited)), '0.1.0')).not.toBe(base);
    expect(await scenarioFingerprint(parse(text), '0.1.1')).not.toBe(base);
  });

  it('short form is the first 12 hex characters', async () => {
    const full = await scenarioFingerprint(parse(text), '0.1.0');
    expect(full).toMatch(/^[0-9a-f]{64}$/);
    expect(shortFingerprint(full)).toBe(full.slice(0, 12));
  });
});
