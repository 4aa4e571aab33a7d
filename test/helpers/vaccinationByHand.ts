/**
 * The SEIR model with a vaccination campaign written out in full from the equations of seir.ts's
 * doc comment, every compartment and counter integrated (the engine derives R and X and computes
 * U in closed form instead): for the tests that check those shortcuts against the full system.
 * For band i, with s = 1 - e (leaky) or 1 (all-or-nothing), S+, W+, P+, I+ = max(0, .) and
 * share = min(1, S+ / U) while U > 0 (no doses once U = 0):
 *   lambda = sum_j M_ij I+_j
 *   dS = -lambda S+ - v share,  dW = v share - lambda W+ - W+ / delta
 *   leaky: dP = W+ / delta - s lambda P+;  all-or-nothing: dP = (1 - e) W+ / delta - lambda P+, dV = e W+ / delta
 *   dE_1 = lambda (S+ + W+ + s P+) - a_E E_1, ...,  dR = a_I I_kI
 *   dU = -v,  dX = lambda (S+ + W+ + s P+),  dXp = s lambda P+,  dQ = v (1 - share)
 * State, block-major (n each): S, E_1..E_kE, I_1..I_kI, W, P, V, U, R, X, Xp, Q.
 */
export interface ByHandVaccine {
  efficacy: number;
  protection: 'leaky' | 'allOrNothing';
  delayDays: number;
}

export function vaccinationByHand(n: number, kE: number, kI: number, latentDays: number, infectiousDays: number, vaccine: ByHandVaccine) {
  const block = (k: number) => k * n;
  const E = block(1);
  const I = block(1 + kE);
  const after = 1 + kE + kI;
  const at = { S: 0, E, I, W: block(after), P: block(after + 1), V: block(after + 2), U: block(after + 3), R: block(after + 4), X: block(after + 5), Xp: block(after + 6), Q: block(after + 7) };
  const size = block(after + 8);
  const aE = kE / latentDays;
  const aI = kI / infectiousDays;
  const e = vaccine.efficacy;
  const leaky = vaccine.protection === 'leaky';
  const s = leaky ? 1 - e : 1;
  const plus = (x: number) => Math.max(0, x);

  /** dy/dt under the transmission matrix M (n x n, row-major, per day) and dose rates v (per day). */
  const derivative = (M: ArrayLike<number>, v: ArrayLike<number>, y: ArrayLike<number>, dy: Float64Array): void => {
    const infectious = Array.from({ length: n }, (_, j) => {
      let sum = 0;
      for (let k = 0; k < kI; k++) sum += y[I + k * n + j];
      return plus(sum);
    });
    for (let i = 0; i < n; i++) {
      let lambda = 0;
      for (let j = 0; j < n; j++) lambda += M[i * n + j] * infectious[j];
      const S = plus(y[i]);
      const W = plus(y[at.W + i]);
      const P = plus(y[at.P + i]);
      const U = y[at.U + i];
      const dose = U > 0 ? v[i] : 0;
      const share = U > 0 ? Math.min(1, S / U) : 0;
      const infections = lambda * (S + W + s * P);
      dy[i] = -lambda * S - dose * share;
      dy[at.W + i] = dose * share - lambda * W - W / vaccine.delayDays;
      dy[at.P + i] = (leaky ? 1 : 1 - e) * (W / vaccine.delayDays) - s * lambda * P;
      dy[at.V + i] = leaky ? 0 : (e * W) / vaccine.delayDays;
      for (let k = 0; k < kE; k++) dy[E + k * n + i] = (k === 0 ? infections : aE * y[E + (k - 1) * n + i]) - aE * y[E + k * n + i];
      for (let k = 0; k < kI; k++) dy[I + k * n + i] = (k === 0 ? aE * y[E + (kE - 1) * n + i] : aI * y[I + (k - 1) * n + i]) - aI * y[I + k * n + i];
      dy[at.U + i] = -dose;
      dy[at.R + i] = aI * y[I + (kI - 1) * n + i];
      dy[at.X + i] = infections;
      dy[at.Xp + i] = s * lambda * P;
      dy[at.Q + i] = dose * (1 - share);
    }
  };

  /** Persons in S, E, I, W, P, V, R of band i. */
  const people = (y: ArrayLike<number>, i: number): number => {
    let sum = y[i] + y[at.W + i] + y[at.P + i] + y[at.V + i] + y[at.R + i];
    for (let k = 0; k < kE + kI; k++) sum += y[E + k * n + i];
    return sum;
  };

  /** S + W + P + V of band i: the people who can still be infected or are immune by vaccine. */
  const neverInfected = (y: ArrayLike<number>, i: number): number => y[i] + y[at.W + i] + y[at.P + i] + y[at.V + i];

  return { size, at, derivative, people, neverInfected };
}
