/**
 * `mixwise orders FILE --option NAME [--minimise OUTCOME] [--groups SPEC] [--top K]
 * [--format table|json] [--method auto|exhaustive|heuristic] [--budget N] [--seed N]
 * [--workers N]`: the best priority orders of the option's campaign groups for one outcome,
 * beside the built-in orders (search: src/engine/vaccination/orderSearch.ts), on N worker
 * threads (orderPool.ts; the same orders and numbers whatever N). A request that does not fit
 * the scenario (unknown option or outcome, an option without a campaign, groups that miss or
 * repeat a band) is one line per problem and exit code 2, like an invalid scenario.
 *
 * stderr gets one line when the search starts and, on a terminal, a progress line updated in
 * place; Ctrl-C stops the search, prints one line and exits with code 130, writing nothing.
 */
import { availableParallelism } from 'node:os';
import { inThreadEvaluator, namedGroups, ORDER_OUTCOMES, parseGroupSpec, PoolCancelled, poolEvaluator, prepareOrderSearch, priorityOf, searchOrders, type OrderEvaluator, type OrderOutcomes, type OrderSearchJob, type OrderSearchRequest, type OrderSearchResult, type OrderSearchSettings, type Scenario, type SearchProgress } from '../engine/index.ts';
import { gapText, orderText } from '../report/orderText.ts';
import { nodeWorkerPool } from './workerThreads.ts';
import { CAUTION } from '../report/index.ts';
import { loadScenarioOrComplain, type Output } from './commands.ts';
import { CliError, EXIT_CODES, reportFault, type ExitCode } from './errors.ts';
import { HELP_TEXT } from './help.ts';
import { groupThousands } from '../report/numberFormat.ts';
import { onlyFile, splitWords, usageError } from './words.ts';

interface OrdersArgs {
  file: string;
  option: string;
  outcome: string;
  groups: string | null;
  format: 'table' | 'json';
  /** Worker threads; null = the default (threadsForSearch). */
  workers: number | null;
  settings: Partial<OrderSearchSettings>;
}

const VALUE_OPTIONS = ['--option', '--minimise', '--groups', '--top', '--format', '--method', '--budget', '--seed', '--workers'];

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
  const flag: Record<string, string> = { option: '--option', outcome: '--minimise', groups: '--groups' };
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

function tableText(scenario: Scenario, job: OrderSearchJob, result: OrderSearchResult): string {
  const bands = scenario.ageBands;
  const shown = ORDER_OUTCOMES.filter((k) => k !== result.outcome && (scenario.healthcare !== undefined || (k !== 'admissions' && k !== 'peakIcuOccupancy')));
  const heading = ['Order', OUTCOME_HEADINGS[result.outcome], 'Gap to best', ...shown.map((k) => OUTCOME_HEADINGS[k])];
  const best = result.orders[0]?.value ?? 0;
  const line = (text: string, value: number, outcomes: OrderOutcomes) => [text, count(value), gapText(value - best), ...shown.map((k) => count(outcomes[k]))];
  const ranked = result.orders.map((o, k) => line(`${k + 1}. ${orderText(priorityOf(job, o.permutation), bands)}${o.noDosesFrom === null ? '' : ` (groups after the first ${o.noDosesFrom} get no doses within the horizon)`}`, o.value, o.outcomes));
  const builtIn = result.builtIn.map((b) => line(`${b.name}: ${orderText(priorityOf(job, b.permutation), bands)}`, b.value, b.outcomes));
  return [
    `Best vaccination orders for option "${job.option.name}" (campaign "${job.campaign.campaign.name}"), minimising ${OUTCOME_HEADINGS[result.outcome].toLowerCase()}`,
    result.methodNote,
    '',
    pad([heading, ...ranked]),
    '',
    'Built-in orders:',
    pad([heading.map((h, k) => (k === 0 ? 'Order' : h)), ...builtIn]),
    '',
    CAUTION,
    '',
  ].join('\n');
}

function jsonText(scenario: Scenario, job: OrderSearchJob, result: OrderSearchResult): string {
  const bands = scenario.ageBands;
  const json = {
    option: job.option.name,
    campaign: job.campaign.campaign.name,
    outcome: result.outcome,
    method: result.method,
    methodNote: result.methodNote,
    evaluated: result.evaluated,
    ordersInAll: result.ordersInAll,
    proven: result.proven,
    groups: job.groups,
    orders: result.orders.map((o) => ({
      order: priorityOf(job, o.permutation),
      text: orderText(priorityOf(job, o.permutation), bands),
      value: o.value,
      gap: o.gap,
      outcomes: o.outcomes,
      noDosesFrom: o.noDosesFrom,
    })),
    builtIn: result.builtIn.map((b) => ({ name: b.name, order: priorityOf(job, b.permutation), value: b.value, outcomes: b.outcomes })),
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
  const loaded = loadScenarioOrComplain(io, args.file);
  if (loaded === null) return EXIT_CODES.invalidScenario;
  const { scenario } = loaded;
  const { job, request } = prepareRequest(scenario, args);
  const settings = Object.fromEntries(Object.entries(args.settings).filter(([, v]) => v !== undefined)) as Partial<OrderSearchSettings>;
  const threads = args.workers ?? (job.groups.length >= POOL_GROUPS ? availableParallelism() : 1);
  const stop = new AbortController();
  const onInterrupt = () => stop.abort();
  process.once('SIGINT', onInterrupt);
  const pool = threads > 1 ? nodeWorkerPool(threads) : null;
  const progress = progressLine(io);
  let result: OrderSearchResult | null = null;
  try {
    const evaluator = pool === null ? yieldingEvaluator(inThreadEvaluator(job), stop.signal) : poolEvaluator(pool, { scenario, request }, stop.signal);
    io.err(`mixwise: orders: searching the orders of ${job.groups.length} groups on ${threads === 1 ? 'one thread' : `${threads} threads`} (Ctrl-C stops)\n`);
    result = await searchOrders(job, evaluator, settings, { onProgress: progress.show, isCancelled: () => stop.signal.aborted });
  } catch (err) {
    if (!(err instanceof PoolCancelled)) throw err;
  } finally {
    process.removeListener('SIGINT', onInterrupt);
    pool?.close();
    progress.clear();
  }
  if (result === null || result.cancelled) {
    io.err(`mixwise: orders: stopped by Ctrl-C${result === null ? '' : ` after ${result.evaluated.toLocaleString('en')} orders simulated`}; nothing written\n`);
    return EXIT_CODES.cancelled;
  }
  io.out(args.format === 'json' ? jsonText(scenario, job, result) : tableText(scenario, job, result));
  return EXIT_CODES.ok;
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

/** Progress on a terminal's stderr, one line rewritten in place (nothing elsewhere). */
function progressLine(io: Output): { show(p: SearchProgress): void; clear(): void } {
  if (io.errIsTerminal !== true) return { show: () => {}, clear: () => {} };
  let shown = false;
  return {
    show(p) {
      const ruledOut = p.ruledOut > 0 ? `, ${p.ruledOut.toLocaleString('en')} ruled out by bounds` : '';
      const best = p.best === null ? '' : `, best so far ${groupThousands(p.best)}`;
      io.err(`\r\x1b[K${Math.floor(p.fraction * 100)}%: ${p.evaluated.toLocaleString('en')} orders simulated${ruledOut}${best}`);
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
