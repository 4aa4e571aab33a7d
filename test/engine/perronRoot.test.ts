/**
 * The bounded spectral radius routine (src/engine/perronRoot.ts) on matrices chosen to break an
 * eigen solver: periodic, reducible, nearly reducible, nilpotent, entries over 600 orders of
 * magnitude, and seeded random ones. Each ends in a finite root or a clean refusal within a step
 * budget (steps counted, never timed). Exact roots come from constructions whose rho is known:
 * a diagonal similarity D A D^-1 keeps rho, rho of a row-stochastic matrix times c is c, a
 * 2 x 2 matrix has a formula, and mathjs eigs checks ordinary random ones.
 */
import { describe, expect, it } from 'vitest';
import { MAX_PERRON_STEPS, perronRoot, PerronRootNotSettled, type PerronWork } from '../../src/engine/perronRoot.ts';
import { spectralRadius } from '../../src/engine/ngm.ts';
import { formatProblem, validateScenario } from '../../src/engine/index.ts';
import { oneBand } from '../helpers/scenarios.ts';
import { dominantByMathjs } from '../helpers/byHand.ts';
import { seededRandom } from '../helpers/random.ts';
import { PERIODIC_ODD_CONTACTS, PERIODIC_ODD_POPULATION } from '../helpers/unsettledRoots.ts';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

/** rho with the work counted; every case must stay inside this budget of Noda steps. */
const BUDGET_PER_BLOCK = 40;
function root(rows: number[][]): { rho: number; steps: number } {
  const work: PerronWork = { steps: 0 };
  const rho = perronRoot(Float64Array.from(rows.flat()), rows.length, work);
  return { rho, steps: work.steps };
}

/** A random row-stochastic matrix with the given share of zero entries (at least one entry per row). */
function rowStochastic(n: number, rand: () => number, zeroShare: number): number[][] {
  return Array.from({ length: n }, (_, i) => {
    const row = Array.from({ length: n }, () => (rand() < zeroShare ? 0 : rand()));
    row[(i + 1) % n] += 0.1; // a cycle through every row keeps it irreducible
    const sum = row.reduce((a, b) => a + b, 0);
    return row.map((x) => x / sum);
  });
}

/** D A D^-1 with D_i = 10^e_i: the same eigenvalues, entries spread over many orders of magnitude. */
function similar(a: number[][], exponents: number[]): number[][] {
  return a.map((row, i) => row.map((x, j) => x * 10 ** (exponents[i] - exponents[j])));
}

describe('largest eigenvalue of a non-negative matrix, with bounded work', () => {
  it('is exact on periodic matrices, where power iteration never settles', () => {
    const cycle = (n: number, c: number) => Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (j === (i + 1) % n ? c : 0)));
    expect(root(cycle(2, 3)).rho).toBeCloseTo(3, 12);
    expect(rel(root(cycle(21, 0.7)).rho, 0.7)).toBeLessThan(1e-12);
    // Bipartite [[0, B], [C, 0]]: rho^2 = rho(BC) = 6 for B = [1 2], C = [2; 2].
    expect(rel(root([[0, 1, 2], [2, 0, 0], [2, 0, 0]]).rho, Math.sqrt(6))).toBeLessThan(1e-12);
  });

  it('is exact on reducible and nearly reducible matrices', () => {
    // Two blocks of equal radius 2: power iteration from a generic start stalls between them.
    expect(root([[0, 2, 0, 0], [2, 0, 0, 0], [0, 0, 1, 1], [0, 0, 1, 1]]).rho).toBeCloseTo(2, 12);
    // Nilpotent: strictly upper triangular, rho = 0.
    expect(root([[0, 5, 1e300], [0, 0, 7], [0, 0, 0]]).rho).toBe(0);
    // Triangular with entries from 1e-250 up: rho = the largest diagonal entry.
    expect(root([[3, 1e-250, 0], [0, 1e-180, 7], [0, 0, 5]]).rho).toBeCloseTo(5, 12);
    // Two blocks coupled by 1e-300 one way only: still the larger block.
    expect(rel(root([[1, 2, 0, 0], [2, 1, 0, 0], [1e-300, 0, 4, 1], [0, 0, 1, 4]]).rho, 5)).toBeLessThan(1e-12);
    // 2 x 2 with a formula: rho = (a + d) / 2 + sqrt(((a - d) / 2)^2 + bc), here with bc = 1e-20.
    const [a, b, c, d] = [1, 1e-10, 1e-10, 1 - 1e-9];
    expect(rel(root([[a, b], [c, d]]).rho, (a + d) / 2 + Math.sqrt(((a - d) / 2) ** 2 + b * c))).toBeLessThan(1e-12);
  });

  it('finds rho = 1e200 when one entry is 1e200 among ordinary ones (the eigen decomposition used to hang there)', () => {
    expect(rel(root([[1e200, 1], [1, 2]]).rho, 1e200)).toBeLessThan(1e-12);
  });

  it('agrees with mathjs eigs on random symmetric matrices with zeros, and on their diagonal similarities', () => {
    const rand = seededRandom(11);
    for (let trial = 0; trial < 30; trial++) {
      const n = 2 + Math.floor(rand() * 20);
      const rows = Array.from({ length: n }, () => new Array<number>(n).fill(0));
      for (let i = 0; i < n; i++) for (let j = i; j < n; j++) rows[i][j] = rows[j][i] = rand() < 0.3 ? 0 : rand() * 10;
      const expected = dominantByMathjs(rows);
      for (const a of [rows, similar(rows, Array.from({ length: n }, () => (rand() - 0.5) * 40))]) {
        const { rho, steps } = root(a);
        expect(rel(rho, expected)).toBeLessThan(1e-9);
        expect(steps).toBeLessThanOrEqual(n * BUDGET_PER_BLOCK);
      }
    }
  });

  it('keeps rho under diagonal similarities spreading the entries over 600 orders of magnitude, within the step budget', () => {
    const rand = seededRandom(20261202);
    let mostSteps = 0;
    for (let trial = 0; trial < 300; trial++) {
      const n = 2 + Math.floor(rand() * 20);
      const c = 10 ** (rand() * 20 - 10);
      const spread = [1, 10, 50, 150][trial % 4];
      const a = similar(rowStochastic(n, rand, rand() * 0.9).map((row) => row.map((x) => c * x)), Array.from({ length: n }, () => (rand() - 0.5) * spread));
      const { rho, steps } = root(a);
      expect(rel(rho, c)).toBeLessThan(1e-10);
      mostSteps = Math.max(mostSteps, steps);
    }
    expect(mostSteps).toBeLessThanOrEqual(BUDGET_PER_BLOCK);
  });

  // Entries log-uniform over `decades` orders of magnitude, random sparsity. Past about 300 decades
  // the Perron vector itself can span more than doubles hold (after balancing): those end in
  // PerronRootNotSettled, a clean one-line refusal; within 100 decades every one is solved.
  it.each([
    [616, 0.1],
    [100, 0],
  ])('ends every seeded adversarial matrix with entries over %i decades in a finite root or a clean refusal (at most a share of %s), within the step budget', (decades, refusedShare) => {
    const rand = seededRandom(7);
    const trials = 2000;
    let refused = 0;
    for (let trial = 0; trial < trials; trial++) {
      const n = 1 + Math.floor(rand() * 21);
      const density = rand();
      const rows = Array.from({ length: n }, () => Array.from({ length: n }, () => (rand() < density ? 10 ** (rand() * decades - decades / 2) : 0)));
      const work: PerronWork = { steps: 0 };
      let rho: number;
      try {
        rho = perronRoot(Float64Array.from(rows.flat()), n, work);
      } catch (err) {
        expect(err).toBeInstanceOf(PerronRootNotSettled);
        expect((err as Error).message).not.toContain('\n');
        refused++;
        continue;
      } finally {
        expect(work.steps).toBeLessThanOrEqual(n * MAX_PERRON_STEPS);
      }
      expect(Number.isFinite(rho) && rho >= 0).toBe(true);
      // Perron-Frobenius bounds: rho >= every diagonal entry and rho <= the largest row sum (Horn & Johnson 2013, 8.1.22);
      // entries below 1e-300 of the largest are beyond double precision once scaled to it.
      const maxDiagonal = Math.max(...rows.map((r, i) => r[i]));
      const maxRowSum = Math.max(...rows.map((r) => r.reduce((x, y) => x + y, 0)));
      const largest = Math.max(...rows.flat());
      expect(rho).toBeGreaterThanOrEqual(maxDiagonal * (1 - 1e-12) - largest * 1e-300);
      expect(rho).toBeLessThanOrEqual(maxRowSum * (1 + 1e-12));
    }
    expect(refused).toBeLessThanOrEqual(refusedShare * trials);
  });

  it('refuses a negative or non-finite entry in one line naming its place', () => {
    expect(() => perronRoot(Float64Array.from([1, -1, 0, 1]), 2)).toThrow(/^the next-generation matrix has an entry of -1 at row 1, column 2: entries must be finite and non-negative$/);
    expect(() => perronRoot(Float64Array.from([1, 0, NaN, 1]), 2)).toThrow(/entry of NaN at row 2, column 1/);
  });

  it('is what spectralRadius falls back on when power iteration does not settle', () => {
    // A 2-cycle: the power iteration's bracket never closes, the fallback gives rho = sqrt(2 * 8) = 4.
    const v = new Float64Array(2).fill(0.5);
    expect(spectralRadius(Float64Array.from([0, 2, 8, 0]), 2, v, new Float64Array(2), 1e-12)).toBeCloseTo(4, 12);
  });

  it('turns a root it cannot pin down during calibration into a refusal naming the settings (it was a crash)', () => {
    // Found by a seeded search: contacts only between two halves of the bands (a periodic K, so
    // power iteration never settles) spread over 300 orders of magnitude.
    const c = PERIODIC_ODD_CONTACTS.map((row) => [...row]);
    const population = [...PERIODIC_ODD_POPULATION];
    const s = {
      ...oneBand({ r0: 2, horizon: 10 }),
      ageBands: population.map((_, i) => ({ label: `band ${i}`, lowerAgeYears: 10 * i })),
      populationPersons: population,
      settings: [{ name: 'all', contactsPerDay: c }],
      severity: { infectionFatalityRatio: population.map(() => 0.01), source: 'test' },
      initialState: { infectedPersons: population.map(() => 1) },
    };
    const check = validateScenario(s);
    if (check.ok) throw new Error('expected a refusal');
    expect(check.problems.map(formatProblem)).toEqual([
      expect.stringMatching(/^settings must give contacts R0 can be computed for: with these contacts and populations the largest eigenvalue of the next-generation matrix could not be pinned down \(it lies between [^)]+\); look for values many orders of magnitude from the rest \(such as 1e-300\)$/),
    ]);
  });
});
