import { describe, expect, it } from 'vitest';
import { logAxisFloor, logTickLabel } from '../../src/renderer/lib/chartAxes.ts';

describe('log axes', () => {
  it('start at one person or bed for curves reaching ten or more, else two decades below the peak', () => {
    expect(logAxisFloor(950)).toBe(1);
    expect(logAxisFloor(10)).toBe(1);
    expect(logAxisFloor(3.2)).toBeCloseTo(0.01, 12);
    expect(logAxisFloor(0.4)).toBeCloseTo(0.001, 12);
    expect(logAxisFloor(0)).toBe(1);
  });

  it('label powers of ten as plain numbers and leave the rest blank', () => {
    expect(logTickLabel(1000)).toBe('1,000');
    expect(logTickLabel(1)).toBe('1');
    expect(logTickLabel(0.01)).toBe('0.01');
    expect(logTickLabel(1e-10)).toBe('1e-10');
    expect(logTickLabel(2000)).toBe('');
    expect(logTickLabel(0)).toBe('');
  });
});
