/**
 * Inverse CDFs (quantile functions) of the distributions an uncertain parameter may have: a
 * Latin hypercube coordinate u in (0, 1) becomes a parameter value x = F^-1(u).
 *
 * - uniform [a, b]:              x = a + u (b - a)
 * - triangular [a, b], mode c:   x = a + sqrt(u (b - a)(c - a))            when u < (c - a)/(b - a)
 *                                x = b - sqrt((1 - u)(b - a)(b - c))       otherwise
 * - normal (mu, sd) truncated to [lo, hi]:  x = mu + sd Phi^-1(Phi(alpha) + u (Phi(beta) - Phi(alpha))),
 *                                alpha = (lo - mu)/sd, beta = (hi - mu)/sd (open ends: Phi = 0 or 1)
 * - lognormal, median m:         x = m exp(sigma Phi^-1(u)), sigma = ln(geometric sd) or
 *                                ln(high/low) / (2 z_0.975) from a central 95% range
 * (standard results; e.g. Johnson, Kotz & Balakrishnan 1994-95, Continuous Univariate Distributions.)
 */
import { normalCdf, normalQuantile, Z_975 } from './normal.ts';
import type { Distribution } from './schema.ts';

/** sigma of ln X for a lognormal parameter. */
export function lognormalSigma(d: Extract<Distribution, { kind: 'lognormal' }>): number {
  if (d.geometricSd !== undefined) return Math.log(d.geometricSd);
  const [low, high] = d.range95 ?? [d.median, d.median];
  return Math.log(high / low) / (2 * Z_975);
}

/** Probability mass of the normal between its truncation bounds. */
export function truncatedMass(d: Extract<Distribution, { kind: 'normal' }>): { from: number; mass: number } {
  const from = d.low === undefined ? 0 : normalCdf((d.low - d.mean) / d.sd);
  const to = d.high === undefined ? 1 : normalCdf((d.high - d.mean) / d.sd);
  return { from, mass: to - from };
}

/** F^-1(u) for 0 < u < 1. */
export function distributionQuantile(d: Distribution, u: number): number {
  switch (d.kind) {
    case 'uniform':
      return d.low + u * (d.high - d.low);
    case 'triangular': {
      const width = d.high - d.low;
      if (u * width < d.mode - d.low) return d.low + Math.sqrt(u * width * (d.mode - d.low));
      return d.high - Math.sqrt((1 - u) * width * (d.high - d.mode));
    }
    case 'normal': {
      const { from, mass } = truncatedMass(d);
      const x = d.mean + d.sd * normalQuantile(from + u * mass);
      // Rounding in Phi may step a hair outside the bounds: keep the draw inside them.
      return Math.min(d.high ?? Infinity, Math.max(d.low ?? -Infinity, x));
    }
    case 'lognormal':
      return d.median * Math.exp(lognormalSigma(d) * normalQuantile(u));
  }
}

/** The distribution's median F^-1(1/2), e.g. for describing it. */
export function distributionMedian(d: Distribution): number {
  return distributionQuantile(d, 0.5);
}
