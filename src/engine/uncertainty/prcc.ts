/**
 * Partial rank correlation coefficient (PRCC; Blower & Dowlatabadi 1994, Int Stat Rev 62:229;
 * Marino et al. 2008, J Theor Biol 254:178): how strongly an output rises or falls with one
 * parameter once the other parameters are accounted for, robust to any monotone relation.
 *
 *   1. Replace every parameter column and the output by their ranks (ties: mean rank).
 *   2. Regress the ranks of parameter j, and the ranks of the output, on the ranks of all other
 *      parameters (least squares with an intercept) and keep the two residuals.
 *   3. PRCC_j = Pearson correlation of the two residuals, in [-1, 1].
 *
 * With one parameter this is Spearman's rank correlation. When the other parameters explain the
 * output's ranks entirely, this parameter adds nothing: 0. Null when it is undefined: the output
 * does not vary at all, or the parameter's ranks are a function of the others'.
 */
import { choleskyFactor, choleskySolve } from '../fitting/cholesky.ts';

/** Ranks 1..n with ties given their mean rank. */
export function ranks(values: ArrayLike<number>): Float64Array {
  const n = values.length;
  const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => values[a] - values[b]);
  const out = new Float64Array(n);
  for (let start = 0; start < n; ) {
    let end = start + 1;
    while (end < n && values[order[end]] === values[order[start]]) end++;
    const mean = (start + end + 1) / 2;
    for (let k = start; k < end; k++) out[order[k]] = mean;
    start = end;
  }
  return out;
}

function centred(x: Float64Array): Float64Array {
  let mean = 0;
  for (const v of x) mean += v;
  mean /= x.length;
  return x.map((v) => v - mean);
}

function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

/** Residual of centred `y` after least squares on the centred columns `xs` (the intercept is the centring). */
function residual(y: Float64Array, xs: readonly Float64Array[]): Float64Array | null {
  if (xs.length === 0) return y;
  const gram = xs.map((a) => xs.map((b) => dot(a, b)));
  const l = choleskyFactor(gram);
  if (l === null) return null;
  const coef = choleskySolve(l, xs.map((a) => dot(a, y)));
  const r = Float64Array.from(y);
  xs.forEach((x, k) => {
    for (let i = 0; i < r.length; i++) r[i] -= coef[k] * x[i];
  });
  return r;
}

/** Below this share of its own variance left, a residual counts as zero (the correlation is undefined). */
const RESIDUAL_FLOOR = 1e-12;

/**
 * PRCC of every parameter with one output. `parameters[k][i]` = parameter k in draw i,
 * `output[i]` = the output in draw i.
 */
export function partialRankCorrelations(parameters: readonly ArrayLike<number>[], output: ArrayLike<number>): (number | null)[] {
  const rankedParameters = parameters.map((x) => centred(ranks(x)));
  const rankedOutput = centred(ranks(output));
  return rankedParameters.map((xj, j) => {
    const others = rankedParameters.filter((_, k) => k !== j);
    const rx = residual(xj, others);
    const ry = residual(rankedOutput, others);
    if (rx === null || ry === null) return null;
    const sxx = dot(rx, rx);
    const syy = dot(ry, ry);
    const outputVariation = dot(rankedOutput, rankedOutput);
    if (!(outputVariation > 0) || !(sxx > RESIDUAL_FLOOR * dot(xj, xj))) return null;
    if (!(syy > RESIDUAL_FLOOR * outputVariation)) return 0;
    return Math.max(-1, Math.min(1, dot(rx, ry) / Math.sqrt(sxx * syy)));
  });
}
