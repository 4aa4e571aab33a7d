/**
 * `mixwise orders`: JSON shape of issue 15, agreement with `run`, the table, the same bytes on one
 * thread and on two, progress on a terminal, Ctrl-C, and bad requests (one line, exit 2).
 */
import { spawn } from 'node:child_process';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CAUTION } from '../../src/report/cautions.ts';
import { mainAsync } from '../../src/cli/main.ts';
import { runScenario } from '../../src/engine/index.ts';
import { validateScenario } from '../../src/engine/validation.ts';
import { DEMO, ROOT, demoJson, writeTemp, type Captured } from './helpers.ts';

async function runAsync(...argv: string[]): Promise<Captured> {
  let stdout = '';
  let stderr = '';
  const code = await mainAsync(argv, { out: (t) => void (stdout += t), err: (t) => void (stderr += t) });
  return { code, stdout, stderr };
}

/** As runAsync, with stderr taken for a terminal (progress lines rewritten in place). */
async function runOnTerminal(...argv: string[]): Promise<Captured> {
  let stdout = '';
  let stderr = '';
  const code = await mainAsync(argv, { out: (t) => void (stdout += t), err: (t) => void (stderr += t), errIsTerminal: true });
  return { code, stdout, stderr };
}

/** The one line the search writes to stderr when it starts (no progress off a terminal). */
const STARTED = /^mixwise: orders: searching the orders of \d+ groups on (one thread|\d+ threads) \(Ctrl-C stops\)\n$/;

const OPTION = 'Vaccinate oldest first';
// Three groups (0-19, 20-59, 60+): six orders, quick to search exhaustively.
const GROUPS = '0-3,4-11,12-15';

describe('mixwise orders --format json', async () => {
  const { code, stdout, stderr } = await runAsync('orders', DEMO, '--option', OPTION, '--minimise', 'infections', '--groups', GROUPS, '--top', '3', '--format', 'json');
  const json = JSON.parse(stdout);

  it('exits 0 with the shape of issue 15', () => {
    expect(code).toBe(0);
    expect(stderr).toMatch(STARTED);
    expect(json).toMatchObject({ option: OPTION, outcome: 'infections', method: 'exhaustive', proven: true });
    expect(json.evaluated).toBeGreaterThan(0);
    expect(json.orders).toHaveLength(3);
    for (const o of json.orders) {
      expect(o.order).toHaveLength(3);
      expect(Object.keys(o.outcomes).sort()).toEqual(['admissions', 'deaths', 'infections', 'peakIcuOccupancy', 'yearsOfLifeLost']);
      expect(o.value).toBe(o.outcomes.infections);
    }
    const values = json.orders.map((o: { value: number }) => o.value);
    expect(values).toEqual([...values].sort((a, b) => a - b));
    expect(json.builtIn.map((b: { name: string }) => b.name)).toContain('Oldest first');
    expect(json.caution).toBe(CAUTION);
  });

  it('gives the numbers `run` gives for the best order', () => {
    const input = demoJson();
    input.vaccinationCampaigns[0].priority = json.orders[0].order;
    const v = validateScenario(input);
    if (!v.ok) throw new Error('altered demo must be valid');
    const option = runScenario(v.scenario).options.find((o) => o.name === OPTION);
    expect(option?.infections).toBe(json.orders[0].value);
    expect(option?.yearsOfLifeLost).toBe(json.orders[0].outcomes.yearsOfLifeLost);
  });
});

describe('mixwise orders --workers', () => {
  // Four groups (0-19, 20-49, 50-64, 65+): 24 orders, several batches of the branch and bound.
  const words = ['orders', DEMO, '--option', OPTION, '--groups', '0-3,4-9,10-12,13-15', '--format', 'json'];
  it('prints the same bytes on one thread and on two', { timeout: 180_000 }, async () => {
    const one = await runAsync(...words, '--workers', '1');
    const two = await runAsync(...words, '--workers', '2');
    expect(one.code).toBe(0);
    expect(two.stderr).toMatch(/on 2 threads/);
    expect(JSON.parse(one.stdout).evaluated).toBeGreaterThan(4);
    expect(two.stdout).toBe(one.stdout);
  });

  it('shows progress on a terminal and clears it before the result', async () => {
    const r = await runOnTerminal(...words, '--workers', '1', '--top', '2');
    expect(r.code).toBe(0);
    expect(r.stderr).toMatch(/\r\x1b\[K\d+%: \d+ orders simulated(, \d+ ruled out by bounds)?, best so far [\d,]+/);
    expect(r.stderr.endsWith('\r\x1b[K')).toBe(true);
    expect(JSON.parse(r.stdout).orders).toHaveLength(2);
  });
});

describe('mixwise orders stopped by Ctrl-C', () => {
  it('exits 130 with one line and writes nothing', { timeout: 120_000 }, async () => {
    // Ten-year groups of the demo: thousands of orders, so the search is still going when stopped.
    const child = spawn(process.execPath, [join(ROOT, 'bin/mixwise.mjs'), 'orders', DEMO, '--option', OPTION, '--groups', 'ten-year', '--workers', '1'], { cwd: ROOT });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (d) => void (stdout += d));
    const code = await new Promise<number | null>((resolve) => {
      child.stderr.on('data', (d) => {
        stderr += d;
        if (STARTED.test(stderr)) child.kill('SIGINT');
      });
      child.on('close', (c) => resolve(c));
    });
    expect(code).toBe(130);
    expect(stdout).toBe('');
    expect(stderr.split('\n')[1]).toMatch(/^mixwise: orders: stopped by Ctrl-C( after [\d,]+ orders simulated)?; nothing written$/);
  });
});

describe('mixwise orders with an uncertainty section', async () => {
  const file = writeTemp('uncertain.json', {
    ...demoJson(),
    uncertainty: {
      draws: 50,
      seed: 7,
      parameters: [
        { name: 'r0', distribution: { kind: 'uniform', low: 1.8, high: 3.2 }, source: 'test range' },
        { name: 'ifrScale', distribution: { kind: 'uniform', low: 0.5, high: 2 }, source: 'test range' },
      ],
    },
  });
  const words = ['orders', file, '--option', OPTION, '--minimise', 'infections', '--groups', GROUPS, '--top', '3', '--draws', '4'];
  const json = await runAsync(...words, '--format', 'json');
  const table = await runAsync(...words);

  it('gives each top order the share of draws in which it is best, summing to 1', () => {
    expect(json.code).toBe(0);
    expect(json.stderr).toMatch(/running the top 3 orders under 4 draws \(seed 7\)/);
    const out = JSON.parse(json.stdout);
    expect(out.draws).toEqual({ draws: 4, seed: 7, failedDraws: 0 });
    const shares = out.orders.map((o: { shareOfDrawsBest: number }) => o.shareOfDrawsBest);
    expect(shares).toHaveLength(3);
    for (const x of shares) expect(x * 4).toBeCloseTo(Math.round(x * 4 * 2) / 2, 12);
    expect(shares.reduce((a: number, b: number) => a + b, 0)).toBeCloseTo(1, 12);
  });

  it('prints the shares as a column of the table', () => {
    expect(table.code).toBe(0);
    expect(table.stdout).toMatch(/Best in draws/);
    expect(table.stdout).toMatch(/share of the 4 uncertainty draws \(seed 7\)/);
    expect(table.stdout).toMatch(/^1\. .*\s\d+%\s/m);
  });
});

describe('mixwise orders (table)', async () => {
  const { code, stdout } = await runAsync('orders', DEMO, '--option', OPTION, '--groups', GROUPS, '--top', '2');
  it('lists the best orders by age range, the built-in orders and the caution', () => {
    expect(code).toBe(0);
    expect(stdout).toMatch(/minimising deaths/);
    expect(stdout).toMatch(/^1\. 60\+ > /m);
    expect(stdout).toMatch(/Built-in orders:/);
    expect(stdout).toMatch(/Exhaustive: all 6 orders of 3 groups/);
    expect(stdout.trimEnd().endsWith(CAUTION)).toBe(true);
  });
});

describe('mixwise orders with a request that does not fit', () => {
  const cases: [string, string[], RegExp][] = [
    ['an unknown option', ['--option', 'Nope'], /--option must name a policy option of the scenario .*, got "Nope"/],
    ['an unknown outcome', ['--option', OPTION, '--minimise', 'cost'], /--minimise must be one of deaths, infections, admissions, peakIcuOccupancy, yearsOfLifeLost, got "cost"/],
    ['an option without a campaign', ['--option', 'No measures'], /--option must run a vaccination campaign/],
    ['groups that repeat a band', ['--option', OPTION, '--groups', '0-5,5-15'], /--groups must not repeat a band: band 5 \(25-29\) appears twice/],
    ['groups that miss a band', ['--option', OPTION, '--groups', '0-9,10-14'], /--groups must include band 15 \(75\+\), which the campaign can vaccinate/],
    ['groups that are not band indices', ['--option', OPTION, '--groups', 'young,old'], /--groups must be ten-year, bands, or band indices and ranges/],
  ];
  for (const [what, words, message] of cases) {
    it(`exits 2 with one line for ${what}`, async () => {
      const r = await runAsync('orders', DEMO, ...words);
      expect(r.code).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
      expect(r.stderr).toMatch(message);
    });
  }

  it('exits 2 for hospital outcomes without a healthcare section', async () => {
    const input = demoJson();
    delete input.healthcare;
    const r = await runAsync('orders', writeTemp('no-hospital.json', input), '--option', OPTION, '--minimise', 'admissions');
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--minimise needs the scenario's healthcare section/);
  });

  it('exits 1 without --option or with a bad --top', async () => {
    expect((await runAsync('orders', DEMO)).code).toBe(1);
    expect((await runAsync('orders', DEMO, '--option', OPTION, '--top', '0')).code).toBe(1);
  });
});
