/** Orders as text: age-range labels of groups, and gaps to the best that never read as none when there is one. */
import { describe, expect, it } from 'vitest';
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
