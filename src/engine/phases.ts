/**
 * Phases of a policy option on the day axis: which measures are in force on a day, and the days
 * on which they change (where the integrator must restart, as the right-hand side jumps there).
 */
import type { Phase, PolicyOption } from './scenario.ts';

/**
 * The fixed-day phase in force at time t (days; fromDay inclusive, toDay exclusive), or null for
 * none. Fixed phases never overlap (validation.ts); triggered phases are not fixed and are left
 * to the trigger controller (triggers.ts).
 */
export function phaseAt(option: PolicyOption, t: number): Phase | null {
  for (const p of option.phases) if (p.trigger === undefined && t >= p.fromDay && t < p.toDay) return p;
  return null;
}

/** True when the option has at least one phase switched by a trigger. */
export function hasTriggers(option: PolicyOption): boolean {
  return option.phases.some((p) => p.trigger !== undefined);
}

/** Sorted days in (0, horizon) on which the fixed-day measures change. */
export function changeDays(option: PolicyOption, horizonDays: number): number[] {
  const days = new Set<number>();
  for (const p of option.phases) {
    if (p.trigger !== undefined) continue;
    for (const d of [p.fromDay, p.toDay]) if (d > 0 && d < horizonDays) days.add(d);
  }
  return [...days].sort((a, b) => a - b);
}

/** True when the same measures hold on every day of the horizon (never with a trigger). */
export function measuresConstant(option: PolicyOption, horizonDays: number): boolean {
  return !hasTriggers(option) && changeDays(option, horizonDays).length === 0;
}
