/**
 * An option's horizon cut where the right-hand side jumps: where the measures change and where
 * the vaccination dose plan changes (supply steps, priority groups completed). Within a segment
 * the transmission matrix and the dose rates are constant, so the integrator restarts only there.
 */
import { changeDays, phaseAt } from './phases.ts';
import type { PreparedScenario } from './prepare.ts';
import type { PolicyOption } from './scenario.ts';
import { phaseTransmission } from './phaseTransmission.ts';
import { dosePieceAt, type DosePiece } from './vaccination/dosePlan.ts';

export interface Segment {
  /** Start and end, days (dose-plan changes need not fall on whole days). */
  fromDay: number;
  toDay: number;
  /** M (n x n, per day) under the measures in force; shared by every run (phaseTransmission.ts), read-only. */
  transmission: Float64Array;
  /** Doses per day by band (zeros without vaccination). */
  doseRates: Float64Array;
  /** True when the measures (not just the doses) differ from the segment before. */
  measuresChange: boolean;
}

export function segmentsOf(p: PreparedScenario, option: PolicyOption, plan: readonly DosePiece[]): Segment[] {
  const s = p.scenario;
  const n = p.bands.bands;
  const H = s.horizonDays;
  const measureDays = changeDays(option, H);
  const bounds = new Set<number>([0, H, ...measureDays]);
  for (const piece of plan) for (const t of [piece.fromDay, piece.toDay]) if (t > 0 && t < H) bounds.add(t);
  const sorted = [...bounds].sort((a, b) => a - b);
  const segments: Segment[] = [];
  let transmission: Float64Array | null = null;
  for (let k = 0; k + 1 < sorted.length; k++) {
    const from = sorted[k];
    const changes = transmission === null || measureDays.includes(from);
    if (changes) transmission = phaseTransmission(p, phaseAt(option, from));
    const piece = dosePieceAt(plan, from);
    segments.push({
      fromDay: from,
      toDay: sorted[k + 1],
      transmission: transmission as Float64Array,
      doseRates: piece === null ? new Float64Array(n) : piece.dosesPerDay,
      measuresChange: changes,
    });
  }
  return segments;
}
