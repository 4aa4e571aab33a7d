import { describe, expect, it } from 'vitest';
import { MERGE_WINDOW_MS, pushHistory, redoHistory, startHistory, undoHistory } from '../../src/renderer/lib/history.ts';

describe('undo history', () => {
  it('undoes and redoes in order', () => {
    let h = startHistory(0);
    h = pushHistory(h, 1, null, 0);
    h = pushHistory(h, 2, null, 1);
    h = undoHistory(h);
    expect(h.present).toBe(1);
    h = undoHistory(h);
    expect(h.present).toBe(0);
    expect(undoHistory(h)).toBe(h);
    h = redoHistory(redoHistory(h));
    expect(h.present).toBe(2);
    expect(redoHistory(h)).toBe(h);
  });

  it('keeps at least 50 steps (limit 100 by default)', () => {
    let h = startHistory(0);
    for (let k = 1; k <= 120; k++) h = pushHistory(h, k, null, k * 10_000);
    let steps = 0;
    while (h.past.length > 0) {
      h = undoHistory(h);
      steps++;
    }
    expect(steps).toBe(100);
    expect(h.present).toBe(20);
  });

  it('folds a slider drag (same merge key, close in time) into one step', () => {
    let h = startHistory(0);
    h = pushHistory(h, 1, 'school', 0);
    h = pushHistory(h, 2, 'school', 100);
    h = pushHistory(h, 3, 'school', 200);
    expect(h.past).toEqual([0]);
    h = pushHistory(h, 4, 'school', 200 + MERGE_WINDOW_MS + 1);
    expect(h.past).toEqual([0, 3]);
    h = pushHistory(h, 5, 'work', 200 + MERGE_WINDOW_MS + 2);
    expect(h.past).toEqual([0, 3, 4]);
  });

  it('drops the redo branch on a new edit', () => {
    let h = pushHistory(pushHistory(startHistory('a'), 'b', null, 0), 'c', null, 1);
    h = pushHistory(undoHistory(h), 'd', null, 2);
    expect(h.future).toEqual([]);
    expect(h.past).toEqual(['a', 'b']);
  });
});
