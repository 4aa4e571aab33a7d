import { describe, expect, it } from 'vitest';
import { r0RoundedToFit } from '../../src/renderer/lib/fitFromCounts.ts';

describe('R0 written from a fit', () => {
  it('keeps one digit beyond the first the interval reaches, 1 to 3 decimals', () => {
    expect(r0RoundedToFit(1.73456, [1.56, 1.9])).toBe(1.73); // half-width 0.17
    expect(r0RoundedToFit(1.73456, [1.71, 1.75])).toBe(1.735); // half-width 0.02
    expect(r0RoundedToFit(1.73456, [0.9, 3.1])).toBe(1.7); // half-width 1.1
    expect(r0RoundedToFit(1.73456, [1.7345, 1.7346])).toBe(1.735); // never past 3 decimals
    expect(r0RoundedToFit(1.73456, [1.2, null])).toBe(1.73); // open interval
  });
});
