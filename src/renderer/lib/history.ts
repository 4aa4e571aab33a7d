/**
 * Undo/redo history of document snapshots. Immutable snapshots make undo exact.
 * Steps with the same `mergeKey` pushed within `mergeWindowMs` fold into one step
 * (one slider drag = one undo step). Keeps at most `limit` past steps.
 */
export interface HistoryState<T> {
  past: T[];
  present: T;
  future: T[];
  lastMergeKey: string | null;
  lastPushAt: number;
}

export const DEFAULT_HISTORY_LIMIT = 100;
export const MERGE_WINDOW_MS = 1500;

export function startHistory<T>(present: T): HistoryState<T> {
  return { past: [], present, future: [], lastMergeKey: null, lastPushAt: 0 };
}

export function pushHistory<T>(
  h: HistoryState<T>,
  next: T,
  mergeKey: string | null,
  now: number,
  limit = DEFAULT_HISTORY_LIMIT,
): HistoryState<T> {
  const merge = mergeKey !== null && mergeKey === h.lastMergeKey && now - h.lastPushAt <= MERGE_WINDOW_MS && h.future.length === 0;
  const past = merge ? h.past : [...h.past, h.present].slice(-limit);
  return { past, present: next, future: [], lastMergeKey: mergeKey, lastPushAt: now };
}

export function undoHistory<T>(h: HistoryState<T>): HistoryState<T> {
  if (h.past.length === 0) return h;
  return { past: h.past.slice(0, -1), present: h.past[h.past.length - 1], future: [h.present, ...h.future], lastMergeKey: null, lastPushAt: 0 };
}

export function redoHistory<T>(h: HistoryState<T>): HistoryState<T> {
  if (h.future.length === 0) return h;
  return { past: [...h.past, h.present], present: h.future[0], future: h.future.slice(1), lastMergeKey: null, lastPushAt: 0 };
}
