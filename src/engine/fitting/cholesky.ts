/**
 * Cholesky factorisation A = L L^T of a small symmetric positive-definite matrix, used to solve
 * the weighted normal equations (X^T W X) b = X^T W z of each IRLS step and to invert the
 * information matrix (Golub & Van Loan 2013, Matrix Computations, 4th ed., sec. 4.2).
 */
import { CholeskyDecomposition, Matrix } from 'ml-matrix';

/**
 * Lower-triangular L with A = L L^T (ml-matrix's CholeskyDecomposition, a direct method with no
 * iteration), or null when A is not (numerically) positive definite: a pivot l_jj^2 at or below
 * 1e-13 max(1, |a_jj|) counts as zero. Only the lower triangle of A is read (mirrored, as the
 * library wants an exactly symmetric matrix).
 */
export function choleskyFactor(a: number[][]): number[][] | null {
  const lowerMirrored = a.map((row, i) => row.map((v, j) => (j <= i ? v : a[j][i])));
  const decomposition = new CholeskyDecomposition(new Matrix(lowerMirrored));
  if (!decomposition.isPositiveDefinite()) return null;
  const l = decomposition.lowerTriangularMatrix.to2DArray();
  for (let j = 0; j < a.length; j++) {
    if (!(l[j][j] * l[j][j] > 1e-13 * Math.max(1, Math.abs(a[j][j])))) return null;
  }
  return l;
}

/** Solves L L^T x = b by forward then back substitution. */
export function choleskySolve(l: number[][], b: number[]): number[] {
  const n = l.length;
  const y = new Array<number>(n);
  for (let i = 0; i < n; i++) {
    let s = b[i];
    for (let k = 0; k < i; k++) s -= l[i][k] * y[k];
    y[i] = s / l[i][i];
  }
  const x = new Array<number>(n);
  for (let i = n - 1; i >= 0; i--) {
    let s = y[i];
    for (let k = i + 1; k < n; k++) s -= l[k][i] * x[k];
    x[i] = s / l[i][i];
  }
  return x;
}

/** A^{-1} from its Cholesky factor, column by column. */
export function choleskyInverse(l: number[][]): number[][] {
  const n = l.length;
  const inv = l.map(() => new Array<number>(n).fill(0));
  for (let j = 0; j < n; j++) {
    const e = new Array<number>(n).fill(0);
    e[j] = 1;
    const col = choleskySolve(l, e);
    for (let i = 0; i < n; i++) inv[i][j] = col[i];
  }
  return inv;
}
