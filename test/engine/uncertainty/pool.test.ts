/**
 * Uncertainty draws on the worker pool: the same draws, and the same summary bytes, as one thread
 * (failed draws included); progress counts draws; cancelling stops the map; `mixwise run --workers`
 * writes the same report and part files on one thread and on two.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { mainAsync } from '../../../src/cli/main.ts';
import { nodeWorkerPool } from '../../../src/cli/workerThreads.ts';
import { drawRangeOnPool, drawTasks, evaluateDrawRange, PoolCancelled, prepareDraws, summariseDraws, uncertaintyOnPool, type Scenario } from '../../../src/engine/index.ts';
import { catalogueReader, DRAW_OUTCOME_KEYS } from '../../../src/report/drawOutcomes.ts';
import { writeTemp } from '../../cli/helpers.ts';
import { demoScenario } from '../../helpers/demo.ts';

/** Every number as its 8 bytes (typed arrays included): equality means bit-for-bit equality. */
function bytesOf(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) => {
    if (v instanceof Float64Array) return Buffer.from(v.buffer, v.byteOffset, v.byteLength).toString('hex');
    if (typeof v === 'number') return Buffer.from(Float64Array.of(v).buffer).toString('hex');
    return v;
  });
}

/**
 * The demo with `draws` draws; the latent period's normal reaches below its minimum, so some draws
 * fail. Sixty days: the checks compare threads byte for byte, which needs no full epidemic (the
 * demo's 365 days made this file a quarter of the unit suite's time).
 */
function demoWithDraws(draws: number): Scenario {
  return {
    ...demoScenario(),
    horizonDays: 60,
    uncertainty: {
      draws,
      seed: 7,
      intervalLevel: 0.9,
      parameters: [
        { name: 'r0', distribution: { kind: 'uniform', low: 2, high: 3 }, source: 'test range' },
        { name: 'latentPeriodDays', distribution: { kind: 'normal', mean: 1, sd: 1 }, source: 'test range' },
        { name: 'ifrScale', distribution: { kind: 'triangular', low: 0.6, mode: 1, high: 1.5 }, source: 'test range' },
      ],
    },
  };
}

const pool = nodeWorkerPool(2);
afterAll(() => pool.close());

describe('uncertainty draws on the worker pool', () => {
  it('gives the draws and the summary of one thread, byte for byte, failed draws included', { timeout: 180_000 }, async () => {
    const s = demoWithDraws(21);
    const p = prepareDraws(s);
    const single = evaluateDrawRange(p, 0, 21, catalogueReader);
    expect(single.some((d) => !d.ok)).toBe(true);
    expect(single.some((d) => d.ok)).toBe(true);
    const seen: number[] = [];
    const pooled = await drawRangeOnPool(pool, s, catalogueReader, 0, 21, { onProgress: (done, total) => seen.push(done + total / 1000) });
    expect(bytesOf(pooled)).toBe(bytesOf(single));
    // Progress counts draws: 8, 16, then all 21 (tasks of DRAWS_PER_TASK draws).
    expect(drawTasks(0, 21)).toEqual([{ from: 0, to: 8 }, { from: 8, to: 16 }, { from: 16, to: 21 }]);
    expect(seen).toEqual([8.021, 16.021, 21.021]);
    const summary = await uncertaintyOnPool(pool, s, catalogueReader);
    expect(bytesOf(summary)).toBe(bytesOf(summariseDraws(p, single, DRAW_OUTCOME_KEYS)));
    // A slice is the same draws as in the whole run; another seed gives other draws (the check can fail).
    expect(bytesOf(await drawRangeOnPool(pool, s, catalogueReader, 5, 13))).toBe(bytesOf(single.slice(5, 13)));
    const other = { ...s, uncertainty: { ...s.uncertainty!, seed: 8 } };
    expect(bytesOf(await drawRangeOnPool(pool, other, catalogueReader, 0, 21))).not.toBe(bytesOf(single));
  });

  it('rejects a cancelled run of draws and then runs the next one', { timeout: 120_000 }, async () => {
    const s = demoWithDraws(200);
    const control = new AbortController();
    const cancelled = drawRangeOnPool(pool, s, catalogueReader, 0, 200, { onProgress: (done) => done >= 8 && control.abort(), signal: control.signal });
    await expect(cancelled).rejects.toBeInstanceOf(PoolCancelled);
    const [first] = await drawRangeOnPool(pool, s, catalogueReader, 3, 4);
    expect(first.draw).toBe(3);
  });
});

describe('mixwise run --workers with draws', () => {
  it('writes the same report and the same part file on one thread and on two', { timeout: 240_000 }, async () => {
    const file = writeTemp('uncertain.json', demoWithDraws(18));
    const outputs = new Map<string, string>();
    for (const args of [['--format', 'json'], ['--format', 'csv'], ['--draw-range', '4:15']]) {
      for (const workers of ['1', '2']) {
        let out = '';
        let err = '';
        const code = await mainAsync(['run', file, ...args, '--workers', workers], { out: (t) => void (out += t), err: (t) => void (err += t) });
        expect({ code, err }).toEqual({ code: 0, err: '' });
        const key = args.join(' ');
        if (workers === '1') outputs.set(key, out);
        else expect(out).toBe(outputs.get(key));
      }
    }
    expect(JSON.parse(outputs.get('--format json')!).uncertainty.failedDraws).toBeGreaterThan(0);
  });
});
