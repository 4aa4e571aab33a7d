/** Orders as text: age-range labels of groups, gaps to the best that never read as none when there is one, and the report's order comparison. */
import { describe, expect, it } from 'vitest';
import type { OrderComparison, Scenario } from '../../src/engine/index.ts';
import { orderComparisonHtml } from '../../src/report/orderComparisonHtml.ts';
import { gapText, groupLabel, orderText } from '../../src/report/orderText.ts';

const BANDS = [0, 20, 50, 60].map((a, k, all) => ({ label: k === all.length - 1 ? `${a}+` : `${a}-${all[k + 1] - 1}`, lowerAgeYears: a }));

describe('order text', () => {
  it('labels consecutive bands by their age range and the open last band with a plus', () => {
    expect(groupLabel([1, 2], BANDS)).toBe('20-59');
    expect(groupLabel([2, 3], BANDS)).toBe('50+');
    expect(groupLabel([3, 0], BANDS)).toBe('0-19+60+');
    expect(orderText([[3], [1, 2], [0]], BANDS)).toBe('60+ > 20-59 > 0-19');
  });
});

describe('gap to the best', () => {
  it('prints a small gap with one decimal instead of +0', () => {
    expect(gapText(0)).toBe('0');
    expect(gapText(0.3)).toBe('+0.3');
    expect(gapText(0.49)).toBe('+0.5');
    expect(gapText(0.01)).toBe('+<0.1');
    expect(gapText(0.5)).toBe('+0.5');
    expect(gapText(0.97)).toBe('+1');
    expect(gapText(1234.4)).toBe('+1,234');
  });
});

describe('order comparison in the report', () => {
  const outcomes = (deaths: number) => ({ deaths, infections: 1000 + deaths, yearsOfLifeLost: 10 * deaths, admissions: null, peakIcuOccupancy: null });
  const comparison: OrderComparison = {
    option: 'Vaccinate',
    campaign: 'Supply',
    outcome: 'deaths',
    groups: [[3], [1, 2], [0]],
    method: 'exhaustive',
    methodNote: 'Exhaustive: all 6 orders.',
    evaluated: 5,
    ordersInAll: 6,
    proven: true,
    orders: [
      { order: [[3], [1, 2], [0]], value: 100, gap: 0, outcomes: outcomes(100), noDosesFrom: null, shareOfDrawsBest: 0.75 },
      { order: [[1, 2], [3], [0]], value: 100.3, gap: 0.3, outcomes: outcomes(100.3), noDosesFrom: null, shareOfDrawsBest: 0.25 },
    ],
    builtIn: [{ name: 'Youngest first', order: [[0], [1, 2], [3]], value: 180, outcomes: outcomes(180) }],
    draws: { draws: 40, seed: 9, failedDraws: 0 },
  };
  const scenario = { ageBands: BANDS } as unknown as Scenario;
  const html = orderComparisonHtml(comparison, scenario);

  it('prints the top orders with their gap and share of draws, then the built-in orders', () => {
    expect(html).toContain('Groups: 60+, 20-59, 0-19.');
    expect(html).toContain('Best 2 of 6 orders (5 simulated)');
    expect(html).toMatch(/<th scope="row">2\. 20-59 &gt; 60\+ &gt; 0-19<\/th><td class="num">100<\/td><td class="num">\+0\.3<\/td>.*<td class="num">25%<\/td><\/tr>/);
    expect(html).toMatch(/Youngest first: 0-19 &gt; 20-59 &gt; 60\+<\/th><td class="num">180<\/td><td class="num">\+80<\/td>/);
    expect(html).toContain('share of 40 uncertainty draws (seed 9)');
    // No hospital section: no hospital columns.
    expect(html).not.toContain('ICU');
  });
});
