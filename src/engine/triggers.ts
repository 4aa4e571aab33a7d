/**
 * Measures switched by what the epidemic does: the rule of a phase's `trigger`.
 *
 * Rule (also in README and, in words, in the report). For a phase with a trigger, at each whole
 * day t = d with fromDay <= d < toDay the monitored quantity is read at time d:
 * - a change decided earlier and due at d takes effect first;
 * - if the measures are not in force, no change is pending and the value is above `onAbove`, they
 *   come into force at time d + lagDays;
 * - if they are in force, have been in force at least `minimumDaysOn` days at time d (d minus the
 *   day they came into force), no change is pending and the value is below `offBelow`, they lift
 *   at time d + lagDays;
 * - with lagDays = 0 the change takes effect at d itself.
 * Outside [fromDay, toDay) the measures are not in force (a pending change is dropped).
 *
 * Quantities read at time d (units: per 100,000 population, or persons):
 * - infectiousPer100k: persons in the infectious compartments at time d;
 * - dailyInfectionsPer100k: new infections of day d-1 to d (the reported daily series, day-0
 *   seeds included), 0 on day 0;
 * - dailyAdmissions, wardOccupancy, icuOccupancy: hospital admissions of day d-1 to d and mean
 *   beds in use over that day, from the hospital model (healthcare/online.ts), 0 on day 0 — the
 *   same numbers the run reports for day d-1.
 * Several phases in force at once combine (contacts.ts `effectiveContactsOfPhasesInto`).
 */
import type { TriggerOutcome } from './results.ts';
import type { Phase, PolicyOption, Trigger, TriggerQuantity } from './scenario.ts';

/** Reads a monitored quantity at the current decision time. */
export type QuantityReader = (quantity: TriggerQuantity) => number;

interface TriggeredPhase {
  /** Index of the phase in the option's `phases`. */
  index: number;
  phase: Phase;
  trigger: Trigger;
  inForce: boolean;
  /** Time the measures came into force (meaningful while in force). */
  onSince: number;
  pending: { at: number; on: boolean } | null;
  switchesOn: number;
  firstOnDay: number | null;
  /** Stretches in force, [fromDay, toDay) (toDay null while still in force). */
  periods: { fromDay: number; toDay: number | null }[];
}

export class TriggerController {
  private readonly triggered: TriggeredPhase[];

  constructor(option: PolicyOption) {
    this.triggered = option.phases.flatMap((phase, index) =>
      phase.trigger === undefined
        ? []
        : [{ index, phase, trigger: phase.trigger, inForce: false, onSince: 0, pending: null, switchesOn: 0, firstOnDay: null, periods: [] }],
    );
  }

  /** Indices (in the option's `phases`) of the triggered phases in force now, ascending. */
  indicesInForce(): number[] {
    return this.triggered.filter((t) => t.inForce).map((t) => t.index);
  }

  /**
   * Applies the rule at whole day d (call once per day, in order, from day 0). Returns true when
   * the set of triggered measures in force changes at time d.
   */
  decide(d: number, read: QuantityReader): boolean {
    let changed = false;
    for (const t of this.triggered) {
      const was = t.inForce;
      if (t.pending !== null && t.pending.at === d) {
        t.inForce = t.pending.on;
        if (t.inForce) t.onSince = d;
        t.pending = null;
      }
      if (d < t.phase.fromDay || d >= t.phase.toDay) {
        t.inForce = false;
        t.pending = null;
      } else if (t.pending === null) {
        const { onAbove, offBelow, minimumDaysOn, lagDays } = t.trigger;
        // The quantity is read only where it can decide (not while minimumDaysOn holds the measures).
        const { quantity } = t.trigger;
        const switchTo = !t.inForce ? (read(quantity) > onAbove ? true : null) : d - t.onSince >= minimumDaysOn && read(quantity) < offBelow ? false : null;
        if (switchTo !== null) {
          if (lagDays === 0) {
            t.inForce = switchTo;
            if (switchTo) t.onSince = d;
          } else {
            t.pending = { at: d + lagDays, on: switchTo };
          }
        }
      }
      if (t.inForce !== was) {
        changed = true;
        if (t.inForce) {
          t.switchesOn++;
          t.firstOnDay ??= d;
          t.periods.push({ fromDay: d, toDay: null });
        } else {
          t.periods[t.periods.length - 1].toDay = d;
        }
      }
    }
    return changed;
  }

  /** What each trigger did over a horizon of H days. */
  outcomes(horizonDays: number): TriggerOutcome[] {
    return this.triggered.map((t) => {
      const periods = t.periods.map((p) => ({ fromDay: p.fromDay, toDay: Math.min(p.toDay ?? horizonDays, horizonDays) })).filter((p) => p.toDay > p.fromDay);
      return {
        phase: t.index,
        quantity: t.trigger.quantity,
        switchesOn: t.switchesOn,
        firstOnDay: t.firstOnDay,
        daysInForce: periods.reduce((acc, p) => acc + p.toDay - p.fromDay, 0),
        periods,
      };
    });
  }
}
