/**
 * Deterministic random numbers for the fitting tests (test helper, not engine code).
 *
 * - Uniforms: xorshift32 (Marsaglia 2003, "Xorshift RNGs", J Stat Softw 8(14), shifts 13, 17, 5).
 * - Poisson(λ): Knuth's multiplication method (Knuth 1997, The Art of Computer Programming
 *   vol. 2, 3rd ed., sec. 3.4.1) on pieces of mean <= 20, summed (a sum of independent Poissons is
 *   Poisson), so large means neither underflow exp(-λ) nor lose accuracy.
 * - Gamma(shape k, scale 1), k >= 1: Marsaglia & Tsang 2000, ACM TOMS 26:363, with standard normals
 *   by Box & Muller 1958, Ann Math Stat 29:610.
 * - Negative binomial NB2 (mean mu, Var mu + α mu²): Poisson(mu · G / k) with G ~ Gamma(k = 1/α)
 *   (the gamma-Poisson mixture; Greenwood & Yule 1920, J R Stat Soc 83:255).
 */
export class SeededRandom {
  private state: number;

  constructor(seed: number) {
    this.state = (seed >>> 0) || 0x9e3779b9;
  }

  /** Uniform on (0, 1). */
  uniform(): number {
    let x = this.state;
    x ^= x << 13;
    x >>>= 0;
    x ^= x >>> 17;
    x ^= x << 5;
    x >>>= 0;
    this.state = x;
    return (x + 0.5) / 4294967296;
  }

  normal(): number {
    return Math.sqrt(-2 * Math.log(this.uniform())) * Math.cos(2 * Math.PI * this.uniform());
  }

  poisson(mean: number): number {
    let total = 0;
    let left = mean;
    while (left > 0) {
      const piece = Math.min(left, 20);
      left -= piece;
      const limit = Math.exp(-piece);
      let product = this.uniform();
      while (product > limit) {
        total++;
        product *= this.uniform();
      }
    }
    return total;
  }

  gamma(shape: number): number {
    if (shape < 1) return this.gamma(shape + 1) * Math.pow(this.uniform(), 1 / shape);
    const d = shape - 1 / 3;
    const c = 1 / Math.sqrt(9 * d);
    for (;;) {
      const z = this.normal();
      const v = (1 + c * z) ** 3;
      if (v <= 0) continue;
      if (Math.log(this.uniform()) < 0.5 * z * z + d - d * v + d * Math.log(v)) return d * v;
    }
  }

  negativeBinomial(mean: number, alpha: number): number {
    const k = 1 / alpha;
    return this.poisson((mean * this.gamma(k)) / k);
  }
}

/** Counts on days 0..n-1 with expected value y0 exp(r t) times an optional weekday factor. */
export function expectedCounts(n: number, y0: number, r: number, weekday: readonly number[] = [1]): number[] {
  return Array.from({ length: n }, (_, t) => y0 * Math.exp(r * t) * weekday[t % weekday.length]);
}
