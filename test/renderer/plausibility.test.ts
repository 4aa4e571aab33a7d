import { describe, expect, it } from 'vitest';
import { r0Note } from '../../src/renderer/lib/plausibility.ts';

describe('R0 plausibility note', () => {
  it('stays silent in the usual range and speaks up above 10 or below 1', () => {
    expect(r0Note(2.5)).toBeNull();
    expect(r0Note(10)).toBeNull();
    expect(r0Note(20)).toContain('R0 = 20 is far above');
    expect(r0Note(0.8)).toContain('below 1');
  });
});
