/**
 * The best priority orders of a campaign's groups for one outcome.
 *
 * The search is a map of one pure function, evaluateOrder(job, order) (orderEvaluation.ts), over
 * batches of orders; an `OrderEvaluator` runs a batch, in this thread or on a pool of workers.
 *
 * - Up to EXHAUSTIVE_LIMIT groups: exhaustive, as a depth-first branch and bound over order
 *   prefixes. Every order evaluated gives a lower bound on the outcome for each of its prefixes
 *   (orderEvaluation.ts says why the bound holds); a prefix whose bound is not below the K-th best
 *   value found so far cannot contain a better order and is skipped, and when a prefix already
 *   uses up the doses given within the horizon, every order that starts with it is the same
 *   campaign, counted once. The result is then the proven best K (to a relative margin of 1e-9
 *   kept against rounding).
 * - Above it: a heuristic local search, proving nothing. From every built-in order and from seeded
 *   random orders, it moves to the best neighbour (all swaps of two groups and all moves of one
 *   group to another place) while that improves the outcome, within a budget of evaluations.
 */
import { priorityFromTemplate, ORDER_TEMPLATES } from './orders.ts';
import { evaluateOrder, type OrderEvaluation, type OrderOutcome, type OrderOutcomes, type OrderSearchJob } from './orderEvaluation.ts';
import { groupPermutationFor } from './orderGroups.ts';
import { streamSeed, uniformAt } from '../uncertainty/splitmix64.ts';

/** Largest number of groups searched exhaustively (8! = 40,320 orders). */
export const EXHAUSTIVE_LIMIT = 8;
/** Default evaluation budget of the heuristic search. */
export const DEFAULT_SEARCH_BUDGET = 1500;
/** Relative margin on bounds against rounding in the integrated outcomes. */
const BOUND_MARGIN = 1e-9;

/** Runs a batch of orders (indices into the job's groups); results in the same order. */
export interface OrderEvaluator {
  evaluate(permutations: readonly (readonly number[])[]): Promise<OrderEvaluation[]>;
}

/** Evaluates in the calling thread. */
export function inThreadEvaluator(job: OrderSearchJob): OrderEvaluator {
  return { evaluate: async (perms) => perms.map((p) => evaluateOrder(job, p)) };
}

export interface OrderSearchSettings {
  /** How many of the best orders to return. */
  top: number;
  /** 'auto': exhaustive up to EXHAUSTIVE_LIMIT groups, heuristic above. */
  method: 'auto' | 'exhaustive' | 'heuristic';
  /** Heuristic only: most orders to evaluate. */
  budget: number;
  /** Heuristic only: random starts besides the built-in orders, and their seed. */
  randomStarts: number;
  seed: number;
}

export const DEFAULT_SEARCH_SETTINGS: OrderSearchSettings = { top: 5, method: 'auto', budget: DEFAULT_SEARCH_BUDGET, randomStarts: 4, seed: 1 };

export interface SearchProgress {
  /** Fraction done, 0-1 (orders accounted for in an exhaustive search; budget used in a heuristic one). */
  fraction: number;
  evaluated: number;
  /** Orders ruled out by a proven bound without being simulated (exhaustive search; 0 in a heuristic one). */
  ruledOut: number;
  best: number | null;
}

export interface SearchControl {
  onProgress?: (p: SearchProgress) => void;
  /**
   * Checked between batches; the search then stops and returns what it has. When it is true, a
   * batch the evaluator rejects (e.g. a pool map cancelled by the same signal) also ends the
   * search as cancelled instead of failing it.
   */
  isCancelled?: () => boolean;
}

export interface RankedOrder {
  /** Indices into the job's groups, first group first. */
  permutation: number[];
  value: number;
  outcomes: OrderOutcomes;
  /** value - the best value. */
  gap: number;
  /** Position from which the groups get no doses within the horizon (their order does not matter); null if all do. */
  noDosesFrom: number | null;
}

export interface BuiltInOrder {
  name: string;
  permutation: number[];
  value: number;
  outcomes: OrderOutcomes;
}

export interface OrderSearchResult {
  outcome: OrderOutcome;
  method: 'exhaustive' | 'heuristic';
  /** One sentence on what the method did and what it proves. */
  methodNote: string;
  /** Orders simulated. */
  evaluated: number;
  /** Orders of the groups, m!. */
  ordersInAll: number;
  /** True when the top orders are proven the best of all orders (exhaustive, not cancelled). */
  proven: boolean;
  cancelled: boolean;
  orders: RankedOrder[];
  builtIn: BuiltInOrder[];
}

const keyOf = (perm: readonly number[]) => perm.join(',');

function factorial(m: number): number {
  let f = 1;
  for (let k = 2; k <= m; k++) f *= k;
  return f;
}

/** Uniform numbers in (0, 1) for the random starts: stream 0 of the engine's one seeded generator (uncertainty/splitmix64.ts). */
function seededRandom(seed: number): () => number {
  const stream = streamSeed(seed, 0);
  let n = 0;
  return () => uniformAt(stream, n++);
}

/** The built-in orders and the option's own campaign order, as orders of the job's groups. */
export function builtInPermutations(job: OrderSearchJob): { name: string; permutation: number[] }[] {
  const own = { name: 'Campaign order', permutation: groupPermutationFor(job.groups, job.campaign.campaign.priority) };
  return [own, ...ORDER_TEMPLATES.map((t) => ({ name: t.label, permutation: groupPermutationFor(job.groups, priorityFromTemplate(t.id, job.prepared)) }))];
}

/** Evaluations so far, the best K distinct campaigns, and the bounds known for prefixes. */
class SearchState {
  readonly cache = new Map<string, OrderEvaluation>();
  /** Largest lower bound known for each prefix key. */
  readonly prefixBound = new Map<string, number>();
  /** The best K evaluations, best first, one per distinct campaign. */
  private readonly best: { e: OrderEvaluation; campaign: string }[] = [];
  private readonly horizon: number;
  constructor(
    readonly job: OrderSearchJob,
    readonly evaluator: OrderEvaluator,
    readonly top: number,
    readonly control: SearchControl,
  ) {
    this.horizon = job.prepared.scenario.horizonDays;
  }

  get evaluated(): number {
    return this.cache.size;
  }

  cancelled(): boolean {
    return this.control.isCancelled?.() ?? false;
  }

  /** Position from which the order's groups get no doses within the horizon, or -1. */
  private idleFrom(e: OrderEvaluation): number {
    return e.prefixDays.findIndex((t) => t >= this.horizon);
  }

  /** Orders that differ only after the doses run out are one campaign, listed once. */
  private note(e: OrderEvaluation): void {
    const k = this.idleFrom(e);
    const campaign = keyOf(k < 0 ? e.permutation : e.permutation.slice(0, k));
    if (this.best.some((b) => b.campaign === campaign)) return;
    const at = this.best.findIndex((b) => e.value < b.e.value || (e.value === b.e.value && keyOf(e.permutation) < keyOf(b.e.permutation)));
    this.best.splice(at < 0 ? this.best.length : at, 0, { e, campaign });
    if (this.best.length > this.top) this.best.pop();
  }

  /** Evaluates the orders not seen yet; returns every order's evaluation. */
  async evaluate(perms: readonly number[][]): Promise<OrderEvaluation[]> {
    const fresh = [...new Map(perms.filter((p) => !this.cache.has(keyOf(p))).map((p) => [keyOf(p), p])).values()];
    if (fresh.length > 0) {
      const results = await this.evaluator.evaluate(fresh);
      for (const e of results) {
        this.cache.set(keyOf(e.permutation), e);
        this.note(e);
        for (let k = 0; k < e.bounds.length; k++) {
          const key = keyOf(e.permutation.slice(0, k));
          this.prefixBound.set(key, Math.max(this.prefixBound.get(key) ?? -Infinity, e.bounds[k]));
        }
      }
    }
    return perms.map((p) => this.cache.get(keyOf(p)) as OrderEvaluation);
  }

  /** The K-th best value so far (+Infinity until K campaigns are known). */
  threshold(): number {
    return this.best.length < this.top ? Infinity : this.best[this.top - 1].e.value;
  }

  bestValue(): number | null {
    return this.best[0]?.e.value ?? null;
  }

  /** Largest bound known for any prefix of `perm` (of length < perm.length). */
  boundOf(perm: readonly number[]): number {
    let bound = -Infinity;
    for (let k = 0; k < perm.length; k++) bound = Math.max(bound, this.prefixBound.get(keyOf(perm.slice(0, k))) ?? -Infinity);
    return bound;
  }

  ranked(): RankedOrder[] {
    const first = this.best[0]?.e.value ?? 0;
    return this.best.map(({ e }) => {
      const k = this.idleFrom(e);
      return { permutation: e.permutation, value: e.value, outcomes: e.outcomes, gap: e.value - first, noDosesFrom: k >= 0 && k < e.permutation.length ? k : null };
    });
  }
}

/** Exhaustive branch and bound (module comment); returns false when cancelled. */
async function exhaustive(state: SearchState, start: number[]): Promise<boolean> {
  const m = state.job.groups.length;
  const H = state.job.prepared.scenario.horizonDays;
  const total = factorial(m);
  let accounted = 0;
  let ruledOut = 0;
  const report = () => state.control.onProgress?.({ fraction: accounted / total, evaluated: state.evaluated, ruledOut, best: state.bestValue() });

  // `leaf` is an evaluated order that starts with `prefix`.
  const visit = async (prefix: number[], leaf: OrderEvaluation): Promise<boolean> => {
    const depth = prefix.length;
    if (depth === m) {
      accounted += 1;
      return true;
    }
    if (leaf.prefixDays[depth] >= H) {
      // No doses beyond this prefix within the horizon: every completion is this same campaign.
      accounted += factorial(m - depth);
      return true;
    }
    if (state.cancelled()) return false;
    const rest = leaf.permutation.slice(depth);
    const children = rest.map((g) => [...prefix, g, ...rest.filter((x) => x !== g)]);
    const evaluations = await state.evaluate(children);
    report();
    const order = evaluations.map((e, k) => ({ e, k, bound: e.bounds[depth + 1] })).sort((a, b) => a.bound - b.bound || a.k - b.k);
    for (const { e } of order) {
      const childPrefix = e.permutation.slice(0, depth + 1);
      const bound = Math.max(e.bounds[depth + 1], state.prefixBound.get(keyOf(childPrefix)) ?? -Infinity);
      const threshold = state.threshold();
      if (bound >= threshold + BOUND_MARGIN * Math.abs(threshold)) {
        accounted += factorial(m - depth - 1);
        ruledOut += factorial(m - depth - 1);
        continue;
      }
      if (!(await visit(childPrefix, e))) return false;
    }
    return true;
  };
  const [root] = await state.evaluate([start]);
  const done = await visit([], root);
  report();
  return done;
}

function neighbours(perm: readonly number[]): number[][] {
  const m = perm.length;
  const out: number[][] = [];
  for (let i = 0; i < m; i++) {
    for (let j = i + 1; j < m; j++) {
      const swapped = [...perm];
      [swapped[i], swapped[j]] = [swapped[j], swapped[i]];
      out.push(swapped);
    }
  }
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < m; j++) {
      if (Math.abs(i - j) <= 1) continue; // adjacent moves are swaps, listed above
      const moved = [...perm];
      const [g] = moved.splice(i, 1);
      moved.splice(j, 0, g);
      out.push(moved);
    }
  }
  return out;
}

/** Heuristic local search (module comment); returns false when cancelled. */
async function localSearch(state: SearchState, starts: number[][], budget: number): Promise<boolean> {
  const report = () => state.control.onProgress?.({ fraction: Math.min(1, state.evaluated / budget), evaluated: state.evaluated, ruledOut: 0, best: state.bestValue() });
  for (const start of starts) {
    if (state.evaluated >= budget) break;
    let [current] = await state.evaluate([start]);
    for (;;) {
      if (state.cancelled()) return false;
      const room = budget - state.evaluated;
      if (room <= 0) break;
      // A neighbour whose prefix is already bounded at or above the current value cannot improve on it.
      const candidates = neighbours(current.permutation).filter((p) => !state.cache.has(keyOf(p)) && state.boundOf(p) < current.value).slice(0, room);
      const seen = neighbours(current.permutation).filter((p) => state.cache.has(keyOf(p)));
      const evaluated = [...(await state.evaluate(candidates)), ...(await state.evaluate(seen))];
      report();
      const best = evaluated.reduce<OrderEvaluation | null>((a, e) => (a === null || e.value < a.value ? e : a), null);
      if (best === null || !(best.value < current.value)) break;
      current = best;
    }
  }
  report();
  return true;
}

function randomPermutation(m: number, random: () => number): number[] {
  const p = Array.from({ length: m }, (_, k) => k);
  for (let k = m - 1; k > 0; k--) {
    const j = Math.floor(random() * (k + 1));
    [p[k], p[j]] = [p[j], p[k]];
  }
  return p;
}

/** Searches the orders of the job's groups. Deterministic for a job and settings, whatever the evaluator. */
export async function searchOrders(job: OrderSearchJob, evaluator: OrderEvaluator, settings: Partial<OrderSearchSettings> = {}, control: SearchControl = {}): Promise<OrderSearchResult> {
  const s = { ...DEFAULT_SEARCH_SETTINGS, ...settings };
  const m = job.groups.length;
  const state = new SearchState(job, evaluator, Math.max(1, s.top), control);
  const builtIns = builtInPermutations(job);
  const builtInEvaluations = await state.evaluate(builtIns.map((b) => b.permutation));
  const builtIn = builtIns.map((b, k) => ({ ...b, value: builtInEvaluations[k].value, outcomes: builtInEvaluations[k].outcomes }));
  const method = s.method === 'auto' ? (m <= EXHAUSTIVE_LIMIT ? 'exhaustive' : 'heuristic') : s.method;
  let completed: boolean;
  let methodNote: string;
  const ordersInAll = factorial(m);
  // A batch rejected because the search was cancelled ends it like a cancel between batches.
  const unlessCancelled = (run: Promise<boolean>) =>
    run.catch((err: unknown) => {
      if (state.cancelled()) return false;
      throw err;
    });
  if (method === 'exhaustive') {
    const start = builtIn.reduce((a, b) => (b.value < a.value ? b : a)).permutation;
    completed = await unlessCancelled(exhaustive(state, start));
    methodNote = completed
      ? `Exhaustive: all ${ordersInAll.toLocaleString('en')} orders of ${m} groups accounted for, ${state.evaluated.toLocaleString('en')} simulated; the rest were ruled out by proven lower bounds or give the same campaign. The top orders are the best of all orders.`
      : `Exhaustive search cancelled after ${state.evaluated.toLocaleString('en')} orders: the top orders are the best found so far, not proven best.`;
  } else {
    const random = seededRandom(s.seed);
    const starts = [...builtIns.map((b) => b.permutation), ...Array.from({ length: s.randomStarts }, () => randomPermutation(m, random))];
    completed = await unlessCancelled(localSearch(state, starts, s.budget));
    methodNote = `Heuristic: local search (swaps and moves of groups) from ${builtIns.length} built-in and ${s.randomStarts} random orders (seed ${s.seed}); ${state.evaluated.toLocaleString('en')} of ${ordersInAll.toLocaleString('en')} orders simulated. The top orders are the best found, not proven best.${completed ? '' : ' Cancelled before the end.'}`;
  }
  return {
    outcome: job.outcome,
    method,
    methodNote,
    evaluated: state.evaluated,
    ordersInAll,
    proven: method === 'exhaustive' && completed,
    cancelled: !completed,
    orders: state.ranked(),
    builtIn,
  };
}
