/** Results name the scenario revision they belong to; the engine assembles reference and averted quantities once. */
import { describe, expect, it } from 'vitest';
import { fnv1a, scenarioRevision } from '../../src/engine/revision.ts';
import { assembleResults, runScenario } from '../../src/engine/run.ts';
import { PoolCancelled } from '../../src/engine/pool/pool.ts';
import { demoScenario } from '../helpers/demo.ts';

describe('scenario revision', () => {
  it('is FNV-1a: the hash of "a" and of the empty string (values from memory)', () => {
    expect(fnv1a('a')).toBe(0xe40c292c);
    expect(fnv1a('')).toBe(0x811c9dc5);
  });

  it('changes with any edit, and results carry the revision of their scenario', () => {
    const s = demoScenario();
    const edited = { ...s, options: s.options.map((o, k) => (k === 1 ? { ...o, name: `${o.name}.` } : o)) };
    expect(scenarioRevision(s)).toMatch(/^[0-9a-f]{16}$/);
    expect(scenarioRevision(edited)).not.toBe(scenarioRevision(s));
    expect(scenarioRevision(structuredClone(s))).toBe(scenarioRevision(s));
    expect(runScenario(s).revision).toBe(scenarioRevision(s));
  });
});

describe('the engine assembles the results', () => {
  it('fills every comparison against the reference option once', () => {
    const s = { ...demoScenario(), referenceOption: 'Work contacts halved' };
    const r = runScenario(s);
    expect(r.referenceIndex).toBe(2);
    for (const o of r.options) {
      expect(o.comparison?.reference).toBe('Work contacts halved');
      expect(o.comparison?.deathsAverted).toBeCloseTo(r.options[2].deaths - o.deaths, 9);
    }
    expect(() => assembleResults(s, r, r.options.slice(1))).toThrow('expected results for 5 options, got 4');
  });

  it('runs option by option: progress after each, cancel between options', () => {
    const s = demoScenario();
    const seen: number[] = [];
    const control = new AbortController();
    expect(() => runScenario(s, undefined, { onProgress: (done) => (seen.push(done), done === 2 && control.abort()), signal: control.signal })).toThrow(PoolCancelled);
    expect(seen).toEqual([1, 2]);
  });
});
