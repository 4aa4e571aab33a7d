/**
 * Root of a function of one variable inside a bracket [a, b] with f(a) and f(b) of opposite signs,
 * by Brent's method: inverse quadratic or secant interpolation while it converges, bisection
 * otherwise, so it is never slower than bisection by more than a small factor and usually needs
 * a handful of evaluations (Brent 1973, Algorithms for Minimization without Derivatives, ch. 4,
 * procedure zero). An infinite f (a point where the model cannot be fitted) forces bisection.
 * Stops when the root is known to within 2 eps |x| + tolerance/2 (absolute, in x), at an exact
 * zero, or after `maxEvaluations` further evaluations of f.
 */

export interface RootResult {
  /** The best point found: the end of the last bracket where |f| is smaller; the root lies within the bracket. */
  x: number;
  /** False when `maxEvaluations` ran out before the bracket was narrow enough. */
  converged: boolean;
}

const EPS = 2.220446049250313e-16;

/**
 * A point within tolerance of a sign change of f between a (f(a) = fa) and b (f(b) = fb).
 * `f` returning null stops the search (the caller has a reason); the result is then null.
 */
export function brentRoot(
  f: (x: number) => number | null,
  a: number,
  fa: number,
  b: number,
  fb: number,
  tolerance: number,
  maxEvaluations: number,
): RootResult | null {
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let evaluations = 0; ; evaluations++) {
    if (Math.abs(fc) < Math.abs(fb)) [a, fa, b, fb, c, fc] = [b, fb, c, fc, b, fb];
    const tol1 = 2 * EPS * Math.abs(b) + 0.5 * tolerance;
    const xm = 0.5 * (c - b);
    if (Math.abs(xm) <= tol1 || fb === 0) return { x: b, converged: true };
    if (evaluations >= maxEvaluations) return { x: b, converged: false };
    const finite = Number.isFinite(fa) && Number.isFinite(fb) && Number.isFinite(fc);
    if (finite && Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * xm * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * xm * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * xm * q - Math.abs(tol1 * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = xm;
        e = d;
      }
    } else {
      d = xm;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol1 ? d : xm > 0 ? tol1 : -tol1;
    const next = f(b);
    if (next === null) return null;
    fb = next;
    if ((fb > 0 && fc > 0) || (fb <= 0 && fc <= 0)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
  }
}
