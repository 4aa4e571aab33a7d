/**
 * `mixwise orders FILE --option NAME [--minimise OUTCOME] [--groups SPEC] [--top K]
 * [--format table|json] [--method auto|exhaustive|heuristic] [--budget N] [--seed N]
 * [--workers N]`: the best priority orders of the option's campaign groups for one outcome,
 * beside the built-in orders (search: src/engine/vaccination/orderSearch.ts), on N worker
 * threads (orderPool.ts; the same orders and numbers whatever N). A request that does not fit
 * the scenario (unknown option or outcome, an option without a campaign, groups that miss or
 * repeat a band) is one line per problem and exit code 2, like an invalid scenario.
 *
 * With an `uncertainty` section, the top orders then run under every draw (the seed of `mixwise
 * run`; --draws N to take fewer or more) and each gets the share of draws in which it is best.
 *
 * stderr gets one line when the search (and the draws) start and, on a terminal, a progress line
 * updated in place; Ctrl-C stops, prints one line and exits with code 130, writing nothing.
 */
import { availableParallelism } from 'node:os';
import {
  inThreadEvaluator,
  namedGroups,
  ORDER_OUTCOMES,
  orderComparisonOf,
  orderShares,
  orderValuesUnderDraw,
  parseGroupSpec,
  PoolCancelled,
  poolEvaluator,
  prepareOrderDraws,
  prepareOrderSearch,
  searchOrders,
  topOrdersUnderDraws,
  withDrawSettings,
  type OrderComparison,
  type OrderDrawResult,
  type OrderEvaluator,
  type OrderOutcomes,
  type OrderSearchJob,
  type OrderSearchRequest,
  type OrderSearchResult,
  type OrderSearchSettings,
  type OrderShares,
  type Scenario,
  type SearchProgress,
  type WorkerPool,
} from '../engine/index.ts';
import { gapText, orderText } from '../report/orderText.ts';
import { nodeWorkerPool } from './workerThreads.ts';
import { CAUTION } from '../report/index.ts';
import { loadScenarioOrComplain, type Output } from './commands.ts';
import { CliError, EXIT_CODES, inFile, reportFault, type ExitCode } from './errors.ts';
import { HELP_TEXT } from './help.ts';
import { groupThousands } from '../report/numberFormat.ts';
import { onlyFile, splitWords, usageError } from './words.ts';

/** What an order search needs from the command line (`orders`, and `report --orders`). */
export interface OrdersArgs {
  file: string;
  option: string;
  outcome: string;
  groups: string | null;
  format: 'table' | 'json';
  /** The flag that named the option, for messages (`--option`; `--orders` in a report). */
  optionFlag?: string;
  /** Worker threads; null = one per core from POOL_GROUPS groups up, else 1. */
  workers: number | null;
  /** Draws for the shares of draws (with an uncertainty section); null = the section's own. */
  draws: number | null;
  settings: Partial<OrderSearchSettings>;
}

const VALUE_OPTIONS = ['--option', '--minimise', '--groups', '--top', '--format', '--method', '--budget', '--seed', '--workers', '--draws'];

/** From this many groups up (720 orders), a search uses one thread per core by default; below, starting threads costs more than they save. */
export const POOL_GROUPS = 6;

function wholeNumber(name: string, text: string | undefined, min: number): number | undefined {
  if (text === undefined) return undefined;
  const x = Number(text);
  if (!(Number.isInteger(x) && x >= min)) throw usageError(`${name} must be a whole number >= ${min}, got ${JSON.stringify(text)}`);
  return x;
}

function parseOrdersArgs(words: readonly string[]): OrdersArgs {
  const { positional, values } = splitWords('orders', words, { values: VALUE_OPTIONS });
  const file = onlyFile('orders', positional);
  const option = values.get('--option');
  if (option === undefined) throw usageError(`'orders' needs --option NAME (the option whose campaign is reordered)`);
  const format = values.get('--format') ?? 'table';
  if (format !== 'table' && format !== 'json') throw usageError(`--format must be table or json for 'orders', got ${JSON.stringify(format)}`);
  const method = values.get('--method') ?? 'auto';
  if (method !== 'auto' && method !== 'exhaustive' && method !== 'heuristic') throw usageError(`--method must be auto, exhaustive or heuristic, got ${JSON.stringify(method)}`);
  return {
    file,
    option,
    outcome: values.get('--minimise') ?? 'deaths',
    groups: values.get('--groups') ?? null,
    format,
    workers: wholeNumber('--workers', values.get('--workers'), 1) ?? null,
    draws: wholeNumber('--draws', values.get('--draws'), 2) ?? null,
    settings: {
      method,
      top: wholeNumber('--top', values.get('--top'), 1),
      budget: wholeNumber('--budget', values.get('--budget'), 1),
      seed: wholeNumber('--seed', values.get('--seed'), 0),
    },
  };
}

/** The request's problems become one `mixwise: FILE: --name rule` line each and exit code 2. */
function prepareRequest(scenario: Scenario, args: OrdersArgs): { job: OrderSearchJob; request: OrderSearchRequest } {
  const flag: Record<string, string> = { option: args.optionFlag ?? '--option', outcome: '--minimise', groups: '--groups' };
  let groups: number[][] | undefined;
  if (args.groups !== null) {
    const parsed = namedGroups(args.groups, scenario.ageBands.map((b) => b.lowerAgeYears)) ?? parseGroupSpec(args.groups);
    if (parsed === null) throw new CliError(`${args.file}: --groups must be ten-year, bands, or band indices and ranges separated by commas (e.g. 0-3,4-9,10-15), got ${JSON.stringify(args.groups)}`, EXIT_CODES.invalidScenario);
    groups = parsed;
  }
  const request: OrderSearchRequest = { option: args.option, outcome: args.outcome, groups };
  const prepared = prepareOrderSearch(scenario, request);
  if (!prepared.ok) {
    const lines = prepared.problems.map((p) => `${args.file}: ${flag[p.path] ?? p.path} ${p.rule}${p.value === undefined ? '' : `, got ${p.value}`}`);
    throw new CliError(lines.join('\nmixwise: '), EXIT_CODES.invalidScenario);
  }
  return { job: prepared.job, request };
}

const OUTCOME_HEADINGS: Record<keyof OrderOutcomes, string> = {
  deaths: 'Deaths',
  infections: 'Infections',
  admissions: 'Admissions',
  peakIcuOccupancy: 'Peak ICU beds',
  yearsOfLifeLost: 'Years of life lost',
};

const count = (x: number | null) => (x === null ? '-' : groupThousands(Math.round(x)));

function pad(rows: string[][]): string {
  const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => r[c].length)));
  return rows.map((r) => r.map((cell, c) => (c === 0 ? cell.padEnd(widths[c]) : cell.padStart(widths[c]))).join('  ').trimEnd()).join('\n');
}

const percent = (x: number | undefined) => (x === undefined ? '-' : `${Math.round(x * 100)}%`);

function tableText(scenario: Scenario, c: OrderComparison): string {
  const bands = scenario.ageBands;
  const shown = ORDER_OUTCOMES.filter((k) => k !== c.outcome && (scenario.healthcare !== undefined || (k !== 'admissions' && k !== 'peakIcuOccupancy')));
  const withShares = c.draws !== undefined;
  const heading = ['Order', OUTCOME_HEADINGS[c.outcome], 'Gap to best', ...(withShares ? ['Best in draws'] : []), ...shown.map((k) => OUTCOME_HEADINGS[k])];
  const best = c.orders[0]?.value ?? 0;
  const line = (text: string, value: number, outcomes: OrderOutcomes, share: string) => [text, count(value), gapText(value - best), ...(withShares ? [share] : []), ...shown.map((k) => count(outcomes[k]))];
  const ranked = c.orders.map((o, k) => line(`${k + 1}. ${orderText(o.order, bands)}${o.noDosesFrom === null ? '' : ` (groups after the first ${o.noDosesFrom} get no doses within the horizon)`}`, o.value, o.outcomes, percent(o.shareOfDrawsBest)));
  const builtIn = c.builtIn.map((b) => line(`${b.name}: ${orderText(b.order, bands)}`, b.value, b.outcomes, ''));
  const drawsNote =
    c.draws === undefined
      ? []
      : [`Best in draws: share of the ${groupThousands(c.draws.draws - c.draws.failedDraws)} uncertainty draws (seed ${c.draws.seed}${c.draws.failedDraws > 0 ? `, ${c.draws.failedDraws} failed and left out` : ''}) in which the order is the best of the top ${c.orders.length}, ties split.`];
  return [
    `Best vaccination orders for option "${c.option}" (campaign "${c.campaign}"), minimising ${OUTCOME_HEADINGS[c.outcome].toLowerCase()}`,
    c.methodNote,
    ...drawsNote,
    '',
    pad([heading, ...ranked]),
    '',
    'Built-in orders:',
    pad([heading.filter((h) => h !== 'Best in draws'), ...builtIn.map((r) => r.filter((_, k) => !(withShares && k === 3)))]),
    '',
    CAUTION,
    '',
  ].join('\n');
}

function jsonText(scenario: Scenario, c: OrderComparison): string {
  const bands = scenario.ageBands;
  const json = {
    ...c,
    orders: c.orders.map((o) => ({ ...o, text: orderText(o.order, bands) })),
    caution: CAUTION,
  };
  return `${JSON.stringify(json, null, 2)}\n`;
}

async function orders(io: Output, words: readonly string[]): Promise<ExitCode> {
  if (words.includes('--help') || words.includes('-h')) {
    io.out(HELP_TEXT);
    return EXIT_CODES.ok;
  }
  const args = parseOrdersArgs(words);
  try {
    return await ordersOfFile(io, args);
  } catch (err) {
    throw inFile(err, args.file);
  }
}

async function ordersOfFile(io: Output, args: OrdersArgs): Promise<ExitCode> {
  const loaded = loadScenarioOrComplain(io, args.file);
  if (loaded === null) return EXIT_CODES.invalidScenario;
  const scenario = withDrawSettings(loaded.scenario, { draws: args.draws ?? undefined });
  const comparison = await findOrderComparison(io, scenario, args);
  if (comparison === null) return EXIT_CODES.cancelled;
  io.out(args.format === 'json' ? jsonText(scenario, comparison) : tableText(scenario, comparison));
  return EXIT_CODES.ok;
}

/**
 * Searches the orders the arguments ask for, on the pool or this thread, with progress on stderr,
 * and (with an uncertainty section) the shares of draws. Null when Ctrl-C stopped it (the line
 * saying so is written); a request that does not fit the scenario throws a CliError (exit 2).
 */
export async function findOrderComparison(io: Output, scenario: Scenario, args: OrdersArgs): Promise<OrderComparison | null> {
  const { job, request } = prepareRequest(scenario, args);
  const settings = Object.fromEntries(Object.entries(args.settings).filter(([, v]) => v !== undefined)) as Partial<OrderSearchSettings>;
  const threads = args.workers ?? (job.groups.length >= POOL_GROUPS ? availableParallelism() : 1);
  const stop = new AbortController();
  const onInterrupt = () => stop.abort();
  process.once('SIGINT', onInterrupt);
  const pool = threads > 1 ? nodeWorkerPool(threads) : null;
  const progress = progressLine(io);
  let comparison: OrderComparison | null = null;
  let evaluated: number | null = null;
  try {
    const evaluator = pool === null ? yieldingEvaluator(inThreadEvaluator(job), stop.signal) : poolEvaluator(pool, { scenario, request }, stop.signal);
    io.err(`mixwise: orders: searching the orders of ${job.groups.length} groups on ${threads === 1 ? 'one thread' : `${threads} threads`} (Ctrl-C stops)\n`);
    const result = await searchOrders(job, evaluator, settings, { onProgress: (p) => progress.show(searchProgressText(p)), isCancelled: () => stop.signal.aborted });
    evaluated = result.evaluated;
    if (!result.cancelled) {
      const shares = scenario.uncertainty === undefined ? undefined : await sharesOfDraws(io, scenario, job, result, pool, stop.signal, progress.show);
      comparison = orderComparisonOf(job, result, shares);
    }
  } catch (err) {
    if (!(err instanceof PoolCancelled)) throw err;
  } finally {
    process.removeListener('SIGINT', onInterrupt);
    pool?.close();
    progress.clear();
  }
  if (comparison === null) io.err(`mixwise: orders: stopped by Ctrl-C${evaluated === null ? '' : ` after ${evaluated.toLocaleString('en')} orders simulated`}; nothing written\n`);
  return comparison;
}

/** The top orders under every draw of the scenario's uncertainty section (seed as `mixwise run`), on the pool or this thread. */
async function sharesOfDraws(io: Output, scenario: Scenario, job: OrderSearchJob, result: OrderSearchResult, pool: WorkerPool | null, signal: AbortSignal, show: (text: string) => void): Promise<OrderShares> {
  const u = scenario.uncertainty as NonNullable<Scenario['uncertainty']>;
  const context = { scenario, ...topOrdersUnderDraws(job, result) };
  const draws = Array.from({ length: u.draws }, (_, i) => i);
  io.err(`mixwise: orders: running the top ${result.orders.length} orders under ${groupThousands(u.draws)} draws (seed ${u.seed})\n`);
  const onProgress = (done: number, total: number) => show(`draws: ${done.toLocaleString('en')} of ${total.toLocaleString('en')}`);
  const prepared = prepareOrderDraws(context);
  let results: OrderDrawResult[];
  if (pool !== null) results = await pool.map('orderDraws', context, draws, { signal, onProgress });
  else {
    results = [];
    for (const i of draws) {
      await new Promise((resolve) => setImmediate(resolve));
      if (signal.aborted) throw new PoolCancelled();
      results.push(orderValuesUnderDraw(prepared, i));
      onProgress(i + 1, draws.length);
    }
  }
  return orderShares(prepared, results);
}

/**
 * The in-thread evaluator, giving the event loop a turn before each batch so Ctrl-C is heard
 * (a batch runs synchronously); a batch asked for after the signal is rejected as cancelled.
 */
function yieldingEvaluator(inner: OrderEvaluator, signal: AbortSignal): OrderEvaluator {
  return {
    async evaluate(permutations) {
      await new Promise((resolve) => setImmediate(resolve));
      if (signal.aborted) throw new PoolCancelled();
      return inner.evaluate(permutations);
    },
  };
}

function searchProgressText(p: SearchProgress): string {
  const ruledOut = p.ruledOut > 0 ? `, ${p.ruledOut.toLocaleString('en')} ruled out by bounds` : '';
  const best = p.best === null ? '' : `, best so far ${groupThousands(p.best)}`;
  return `${Math.floor(p.fraction * 100)}%: ${p.evaluated.toLocaleString('en')} orders simulated${ruledOut}${best}`;
}

/** Progress on a terminal's stderr, one line rewritten in place (nothing elsewhere). */
function progressLine(io: Output): { show(text: string): void; clear(): void } {
  if (io.errIsTerminal !== true) return { show: () => {}, clear: () => {} };
  let shown = false;
  return {
    show(text) {
      io.err(`\r\x1b[K${text}`);
      shown = true;
    },
    clear() {
      if (shown) io.err('\r\x1b[K');
    },
  };
}

/** Runs `mixwise orders` with the words after "orders"; never throws. */
export async function ordersCommand(io: Output, words: readonly string[]): Promise<ExitCode> {
  try {
    return await orders(io, words);
  } catch (err) {
    return reportFault(err, (text) => io.err(text));
  }
}
