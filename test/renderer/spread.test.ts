import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { parseScenarioText } from '../../src/engine/validation.ts';
import { runScenario } from '../../src/engine/run.ts';
import { evaluateDrawRange, prepareDraws } from '../../src/engine/uncertainty/drawOutcomes.ts';
import { summariseDraws } from '../../src/engine/uncertainty/ensemble.ts';
import type { Scenario } from '../../src/engine/scenario.ts';
import type { SensitivityEntry } from '../../src/engine/uncertainty/ensemble.ts';
import { catalogueReader } from '../../src/report/drawOutcomes.ts';
import { outcome } from '../../src/report/outcomes.ts';
import { cellInterval, chanceRows } from '../../src/renderer/lib/drawRows.ts';
import { ranking, sensitivityWords, spreadOutcomes, spreadRows } from '../../src/renderer/lib/spread.ts';

function demoWithDraws(): Scenario {
  const parsed = parseScenarioText(readFileSync('resources/demo-scenario.json', 'utf8'));
  if (!parsed.ok) throw new Error('demo invalid');
  const s = parsed.scenario;
  s.options = s.options.slice(0, 3);
  s.uncertainty = {
    draws: 12,
    seed: 3,
    intervalLevel: 0.9,
    parameters: [
      { name: 'r0', distribution: { kind: 'uniform', low: 2, high: 3 }, source: 'test' },
      { name: 'ifrScale', distribution: { kind: 'uniform', low: 0.99, high: 1.01 }, source: 'test' },
    ],
  };
  return s;
}

describe('board and spread view of the draws', () => {
  const s = demoWithDraws();
  const p = prepareDraws(s);
  const summary = summariseDraws(p, evaluateDrawRange(p, 0, 12, catalogueReader), catalogueReader.keys);
  const results = runScenario(s);

  it('writes a cell interval with the catalogue format, none in the reference column of a comparison row', () => {
    const deaths = outcome('deaths');
    const i = summary.options[1].intervals.deaths!;
    const text = cellInterval(deaths, 1, summary, results)!;
    expect(text).toMatch(/^[\d,]+ \([\d,]+–[\d,]+\)$/);
    expect(Number(text.split(' ')[0].replace(/,/g, ''))).toBeCloseTo(i.median, -1);
    expect(cellInterval(outcome('deathsAverted'), results.referenceIndex, summary, results)).toBeNull();
  });

  it('gives a chance row per compared outcome, none in the reference column, and the chance of fewest deaths', () => {
    const rows = chanceRows(summary, results.referenceIndex);
    expect(rows.map((r) => r.label)).toContain('Chance of fewer deaths than the reference');
    expect(rows.at(-1)?.key).toBe('best-deaths');
    const deaths = rows.find((r) => r.key === 'better-deaths')!;
    expect(deaths.values[results.referenceIndex]).toBeNull();
    expect(deaths.values[1]).toBe(summary.options[1].probabilityBetterThanReference.deaths);
    const best = rows.at(-1)!.values as number[];
    expect(best.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
  });

  it('ranks R0 first for deaths and says so in words', () => {
    const order = ranking(summary, s.options[0].name, 'deaths');
    expect(order[0].parameter).toBe('r0');
    expect(sensitivityWords(order, s.options[0].name, 'deaths')).toMatch(/^R0 explains most of the spread in deaths under “No measures” \(PRCC \+[01]\.\d\d: higher values, more deaths\)/);
    expect(spreadOutcomes(results, summary).map((e) => e.key)).toContain('deaths');
    const rows = spreadRows(outcome('deaths'), results, summary);
    expect(rows[0].low).toBeLessThanOrEqual(rows[0].median!);
  });

  it('says when no input stands out', () => {
    const flat: SensitivityEntry[] = [{ option: 'A', outcome: 'deaths', parameter: 'ifrScale', prcc: 0.05 }];
    expect(sensitivityWords(flat, 'A', 'deaths')).toBe('No uncertain input stands out for deaths under “A”: every PRCC is below 0.2 in size (largest: IFR factor (every band), +0.05).');
  });
});
