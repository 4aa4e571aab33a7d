/**
 * Maximum of a function of one variable on [a, b] by Brent's method: golden-section steps,
 * replaced by the vertex of the parabola through the three best points whenever that vertex
 * falls well inside the bracket and the steps keep shrinking (Brent 1973, Algorithms for
 * Minimization without Derivatives, ch. 5, procedure localmin). Near a smooth maximum it needs a
 * handful of evaluations where golden section alone needs one per 0.618 of the bracket.
 * Stops when the point is known to within `tolerance` (absolute, in x), or after `maxEvaluations`.
 */

const GOLDEN_STEP = (3 - Math.sqrt(5)) / 2;

export interface LineMaximum {
  x: number;
  value: number;
}

/** x in [a, b] maximising f (a local maximum when f has several); `f` may return -Infinity. */
export function brentMaximum(f: (x: number) => number, a: number, b: number, tolerance: number, maxEvaluations: number): LineMaximum {
  // Minimises g = -f, as Brent writes it.
  const g = (x: number): number => -f(x);
  let x = a + GOLDEN_STEP * (b - a);
  let w = x;
  let v = x;
  let fx = g(x);
  let fw = fx;
  let fv = fx;
  let d = 0;
  let e = 0;
  for (let evaluations = 1; evaluations < maxEvaluations; evaluations++) {
    const m = 0.5 * (a + b);
    const tol1 = 1.5e-8 * Math.abs(x) + tolerance / 3;
    const tol2 = 2 * tol1;
    if (Math.abs(x - m) <= tol2 - 0.5 * (b - a)) break;
    let parabolic = false;
    if (Math.abs(e) > tol1) {
      let r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      else q = -q;
      r = e;
      e = d;
      if (Math.abs(p) < Math.abs(0.5 * q * r) && p > q * (a - x) && p < q * (b - x)) {
        d = p / q;
        const u = x + d;
        if (u - a < tol2 || b - u < tol2) d = x < m ? tol1 : -tol1;
        parabolic = true;
      }
    }
    if (!parabolic) {
      e = (x < m ? b : a) - x;
      d = GOLDEN_STEP * e;
    }
    const u = x + (Math.abs(d) >= tol1 ? d : d > 0 ? tol1 : -tol1);
    const fu = g(u);
    if (fu <= fx) {
      if (u < x) b = x;
      else a = x;
      [v, fv, w, fw, x, fx] = [w, fw, x, fx, u, fu];
    } else {
      if (u < x) a = u;
      else b = u;
      if (fu <= fw || w === x) [v, fv, w, fw] = [w, fw, u, fu];
      else if (fu <= fv || v === x || v === w) [v, fv] = [u, fu];
    }
  }
  return { x, value: -fx };
}
