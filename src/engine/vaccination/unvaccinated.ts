/**
 * Persons not yet vaccinated, by band, in closed form.
 *
 * Doses reach the unvaccinated at the plan's rate v_i (doses per day), constant within a segment
 * (segments.ts), so dU_i/dt = -v_i and, in the segment that starts at t0,
 *   U_i(t) = U_i(t0) - v_i (t - t0),   U_i(0) = N_i.
 * The right-hand side reads U at each stage time from here instead of integrating it: one block of
 * n components fewer for the integrator, and U exact. Units: persons, days.
 */
export class Unvaccinated {
  /** v_i in the current segment, doses per day. */
  readonly rates: Float64Array;
  /** U_i(t0), persons. */
  readonly atStart: Float64Array;
  /** t0, the current segment's start, days. */
  fromDay = 0;
  /** N_i, persons: everyone is unvaccinated on day 0. */
  readonly population: Float64Array;

  constructor(population: ArrayLike<number>) {
    this.population = Float64Array.from(population);
    this.atStart = Float64Array.from(population);
    this.rates = new Float64Array(population.length);
  }

  /** Moves on to the segment that starts at `fromDay` (not before the current one) with dose rates `rates`. */
  enter(fromDay: number, rates: Float64Array): void {
    const span = fromDay - this.fromDay;
    for (let i = 0; i < this.atStart.length; i++) this.atStart[i] -= this.rates[i] * span;
    this.rates.set(rates);
    this.fromDay = fromDay;
  }
}
