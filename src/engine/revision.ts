/**
 * The revision of a scenario: a short fingerprint of its content, so results name the scenario
 * they were computed from and a view can tell fresh results from stale ones without guessing.
 *
 * FNV-1a (Fowler, Noll & Vo's hash; 32-bit offset basis 2166136261 and prime 16777619, from
 * memory, checked in test/engine/revision.test.ts against the hash of "a", 0xe40c292c, also from
 * memory), run twice with different offset bases over the UTF-16 code units
 * of the scenario's JSON, gives 64 bits as 16 hex digits. Not a cryptographic hash (the report's
 * fingerprint is, src/report/fingerprint.ts): it only has to tell revisions of one document apart.
 */
import type { Scenario } from './scenario.ts';

const FNV_PRIME = 16777619;
const OFFSET_BASIS = 2166136261;
/** A second, arbitrary offset basis for the other 32 bits. */
const SECOND_BASIS = 0x9e3779b9;

/** 32-bit FNV-1a of the string's UTF-16 code units from `basis`. */
export function fnv1a(text: string, basis = OFFSET_BASIS): number {
  let h = basis >>> 0;
  for (let k = 0; k < text.length; k++) {
    h ^= text.charCodeAt(k);
    h = Math.imul(h, FNV_PRIME) >>> 0;
  }
  return h;
}

/** 16 hex digits that change whenever the scenario's content changes (key order included). */
export function scenarioRevision(s: Scenario): string {
  const text = JSON.stringify(s);
  return fnv1a(text, OFFSET_BASIS).toString(16).padStart(8, '0') + fnv1a(text, SECOND_BASIS).toString(16).padStart(8, '0');
}
