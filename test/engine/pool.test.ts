/**
 * The worker pool: a map over worker threads gives the same bytes as one thread; progress,
 * cancelling and failures behave as pool.ts says. `mixwise run` writes the same table whatever
 * the number of threads.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { nodeWorkerPool } from '../../src/cli/workerThreads.ts';
import { mainAsync } from '../../src/cli/main.ts';
import { mapInline, PoolCancelled } from '../../src/engine/pool/pool.ts';
import { runScenario, runScenarioOnPool } from '../../src/engine/run.ts';
import type { Scenario } from '../../src/engine/scenario.ts';
import { demoScenario } from '../helpers/demo.ts';
import { writeTemp } from '../cli/helpers.ts';

/** Every number of a value as its 8 bytes (typed arrays included), so equality means bit-for-bit equality. */
function bytesOf(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) => {
    if (v instanceof Float64Array) return Buffer.from(v.buffer, v.byteOffset, v.byteLength).toString('hex');
    if (typeof v === 'number') return Buffer.from(Float64Array.of(v).buffer).toString('hex');
    return v;
  });
}

/** The demo's options, repeated with their setting multipliers scaled, `count` in all. */
function manyOptions(count: number): Scenario {
  const s = demoScenario();
  const options = Array.from({ length: count }, (_, k) => {
    const base = s.options[k % s.options.length];
    const scale = 0.6 + (k % 7) / 10;
    const phases = base.phases.map((p) => ({ ...p, settingMultipliers: Object.fromEntries(Object.entries(p.settingMultipliers ?? {}).map(([name, m]) => [name, m * scale])) }));
    return { ...base, name: `option ${k}`, phases };
  });
  return { ...s, referenceOption: undefined, options };
}

const pool = nodeWorkerPool(2);
afterAll(() => pool.close());

describe('worker pool', () => {
  it('gives the same results, byte for byte, as one thread', { timeout: 180_000 }, async () => {
    const s = manyOptions(12);
    const single = runScenario(s);
    const pooled = await runScenarioOnPool(pool, s);
    expect(pooled.options).toHaveLength(12);
    expect(bytesOf(pooled)).toBe(bytesOf(single));
    // The check can fail: one option run by other rules differs.
    const other = { ...s, options: [...s.options.slice(1), s.options[0]] };
    expect(bytesOf(await runScenarioOnPool(pool, other))).not.toBe(bytesOf(single));
  });

  it('reports progress after each task and keeps task order', { timeout: 120_000 }, async () => {
    const s = manyOptions(6);
    const seen: number[] = [];
    const runs = await pool.map('optionRuns', s, [5, 0, 3], { onProgress: (done, total) => seen.push(done * 10 + total) });
    expect(runs.map((o) => o.name)).toEqual(['option 5', 'option 0', 'option 3']);
    expect(seen).toEqual([13, 23, 33]);
    expect(bytesOf(runs)).toBe(bytesOf(mapInline('optionRuns', s, [5, 0, 3])));
  });

  it('rejects a cancelled map and runs the next one', async () => {
    const s = manyOptions(40);
    const control = new AbortController();
    const cancelled = pool.map('optionRuns', s, s.options.map((_, k) => k), { onProgress: (done) => done === 2 && control.abort(), signal: control.signal });
    await expect(cancelled).rejects.toBeInstanceOf(PoolCancelled);
    const [first] = await pool.map('optionRuns', s, [0]);
    expect(first.name).toBe('option 0');
  });

  it('leaves no listener on a signal shared by maps that have settled', async () => {
    const s = manyOptions(2);
    const control = new AbortController();
    let listeners = 0;
    const signal = {
      get aborted() {
        return control.signal.aborted;
      },
      addEventListener: (type: 'abort', listener: () => void, options?: { once?: boolean }) => {
        listeners++;
        control.signal.addEventListener(type, listener, options);
      },
      removeEventListener: (type: 'abort', listener: () => void) => {
        listeners--;
        control.signal.removeEventListener(type, listener);
      },
    };
    for (let k = 0; k < 3; k++) await pool.map('optionRuns', s, [0], { signal });
    expect(listeners).toBe(0);
  });

  it('rejects a map whose task fails, with the task message', async () => {
    await expect(pool.map('optionRuns', manyOptions(2), [0, 7])).rejects.toThrow('the scenario has no option 7');
  });
});

describe('mixwise run --workers', () => {
  it('prints the same JSON table on one thread and on two', { timeout: 180_000 }, async () => {
    const file = writeTemp('many.json', manyOptions(9));
    const outputs: string[] = [];
    for (const workers of ['1', '2']) {
      let out = '';
      const code = await mainAsync(['run', file, '--format', 'json', '--workers', workers], { out: (t) => void (out += t), err: () => {} });
      expect(code).toBe(0);
      outputs.push(out);
    }
    expect(JSON.parse(outputs[0]).options).toHaveLength(9);
    expect(outputs[1]).toBe(outputs[0]);
  });
});
