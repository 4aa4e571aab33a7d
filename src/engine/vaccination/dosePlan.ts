/**
 * Who gets the doses, and when: the campaign's dose rate by band as a piecewise-constant plan.
 *
 * Doses go to the first priority group until every band in it reaches its uptake ceiling
 * (ceiling_i x N_i doses, one dose per person), then to the next group. Within a group they are
 * shared in proportion to the people still eligible, rem_i, so d rem_i / dt = -D rem_i / sum rem:
 * the ratios rem_i / rem_j stay fixed, every band of the group reaches its ceiling at the same
 * moment T = sum rem / D, and each band's rate D rem_i(0) / sum rem(0) is constant until then.
 * The plan therefore changes only where the supply steps or a group completes, which is where the
 * integrator restarts. The plan does not depend on the epidemic: doses reach people whatever
 * their infection history (see seir.ts for how they split between compartments).
 */
import type { Campaign } from './schema.ts';

/** From `fromDay` to `toDay` (days, not necessarily whole), band i receives `dosesPerDay[i]`. */
export interface DosePiece {
  fromDay: number;
  toDay: number;
  dosesPerDay: Float64Array;
}

/** Shortest time a priority group takes to serve, days (about 0.1 s; common practice for a time floor). */
export const MIN_PIECE_DAYS = 1e-6;

/** The campaign's plan over [0, horizonDays]; times without a piece have no doses. */
export function dosePlan(campaign: Campaign, population: ArrayLike<number>, horizonDays: number): DosePiece[] {
  const n = population.length;
  const remaining = Float64Array.from({ length: n }, (_, i) => (campaign.uptakeCeiling[i] ?? 0) * population[i]);
  const steps = [...campaign.schedule].sort((a, b) => a.fromDay - b.fromDay);
  const pieces: DosePiece[] = [];
  let group = 0;
  for (let k = 0; k < steps.length && group < campaign.priority.length; k++) {
    const supply = steps[k].dosesPerDay;
    const stepEnd = Math.min(horizonDays, k + 1 < steps.length ? steps[k + 1].fromDay : horizonDays);
    let t = steps[k].fromDay;
    while (t < stepEnd && supply > 0 && group < campaign.priority.length) {
      const bands = campaign.priority[group];
      let left = 0;
      for (const b of bands) left += remaining[b];
      if (left <= 1e-9) {
        group++;
        continue;
      }
      // A group is never served faster than MIN_PIECE_DAYS: with a supply of 1e20 a day, t + left / supply
      // would round back to t and the doses would vanish in a piece of zero length.
      const duration = Math.max(left / supply, MIN_PIECE_DAYS);
      const finish = t + duration;
      const end = Math.min(stepEnd, finish);
      const rates = new Float64Array(n);
      for (const b of bands) rates[b] = remaining[b] / duration;
      pieces.push({ fromDay: t, toDay: end, dosesPerDay: rates });
      for (const b of bands) remaining[b] = end === finish ? 0 : remaining[b] - rates[b] * (end - t);
      if (end === finish) group++;
      t = end;
    }
  }
  return pieces;
}

/** Total doses by band that the plan gives before `untilDay`. */
export function dosesByBandUntil(plan: readonly DosePiece[], bands: number, untilDay: number): Float64Array {
  const total = new Float64Array(bands);
  for (const piece of plan) {
    const span = Math.min(piece.toDay, untilDay) - piece.fromDay;
    if (span <= 0) continue;
    for (let i = 0; i < bands; i++) total[i] += piece.dosesPerDay[i] * span;
  }
  return total;
}

/** The piece in force at time t, or null (no doses). */
export function dosePieceAt(plan: readonly DosePiece[], t: number): DosePiece | null {
  for (const piece of plan) if (t >= piece.fromDay && t < piece.toDay) return piece;
  return null;
}
