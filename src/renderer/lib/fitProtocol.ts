/**
 * Messages between the "Fit from counts" panel and its worker. A negative-binomial fit with its
 * profile interval takes up to about a second, so it runs off the main thread; the newest
 * request wins (replies carry the request id and older ones are ignored).
 */
import type { FitOutcome, FitRequest } from './fitFromCounts.ts';

export type FitWorkerRequest = { type: 'fit'; id: number; request: FitRequest };
export type FitWorkerReply = { type: 'fitted'; id: number; outcome: FitOutcome; computeMs: number };
