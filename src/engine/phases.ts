/**
 * Phases of a policy option on the day axis: which measures are in force on a day, and the days
 * on which they change (where the integrator must restart, as the right-hand side jumps there).
 */
import type { Phase, PolicyOption } from './scenario.ts';

/** The phase in force at time t (days; fromDay inclusive, toDay exclusive), or null for none. */
export function phaseAt(option: PolicyOption, t: number): Phase | null {
  for (const p of option.phases) if (t >= p.fromDay && t < p.toDay) return p;
  return null;
}

/** Sorted days in (0, horizon) on which the measures change. */
export function changeDays(option: PolicyOption, horizonDays: number): number[] {
  const days = new Set<number>();
  for (const p of option.phases) {
    for (const d of [p.fromDay, p.toDay]) if (d > 0 && d < horizonDays) days.add(d);
  }
  return [...days].sort((a, b) => a - b);
}

/** True when the same measures hold on every day of the horizon. */
export function measuresConstant(option: PolicyOption, horizonDays: number): boolean {
  return changeDays(option, horizonDays).length === 0;
}
