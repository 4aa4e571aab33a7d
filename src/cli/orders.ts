/**
 * `mixwise orders FILE --option NAME [--minimise OUTCOME] [--groups SPEC] [--top K]
 * [--format table|json] [--method auto|exhaustive|heuristic] [--budget N] [--seed N]`:
 * the best priority orders of the option's campaign groups for one outcome, beside the built-in
 * orders (search: src/engine/vaccination/orderSearch.ts). A request that does not fit the
 * scenario (unknown option or outcome, an option without a campaign, groups that miss or repeat
 * a band) is one line per problem and exit code 2, like an invalid scenario.
 */
import { inThreadEvaluator, namedGroups, ORDER_OUTCOMES, parseGroupSpec, prepareOrderSearch, priorityOf, searchOrders, type OrderOutcomes, type OrderSearchJob, type OrderSearchResult, type OrderSearchSettings, type Scenario } from '../engine/index.ts';
import { orderText } from '../report/orderText.ts';
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
  settings: Partial<OrderSearchSettings>;
}

const VALUE_OPTIONS = ['--option', '--minimise', '--groups', '--top', '--format', '--method', '--budget', '--seed'];

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
    settings: {
      method,
      top: wholeNumber('--top', values.get('--top'), 1),
      budget: wholeNumber('--budget', values.get('--budget'), 1),
      seed: wholeNumber('--seed', values.get('--seed'), 0),
    },
  };
}

/** The request's problems become one `mixwise: FILE: --name rule` line each and exit code 2. */
function prepareJob(scenario: Scenario, args: OrdersArgs): OrderSearchJob {
  const flag: Record<string, string> = { option: '--option', outcome: '--minimise', groups: '--groups' };
  let groups: number[][] | undefined;
  if (args.groups !== null) {
    const parsed = namedGroups(args.groups, scenario.ageBands.map((b) => b.lowerAgeYears)) ?? parseGroupSpec(args.groups);
    if (parsed === null) throw new CliError(`${args.file}: --groups must be ten-year, bands, or band indices and ranges separated by commas (e.g. 0-3,4-9,10-15), got ${JSON.stringify(args.groups)}`, EXIT_CODES.invalidScenario);
    groups = parsed;
  }
  const prepared = prepareOrderSearch(scenario, { option: args.option, outcome: args.outcome, groups });
  if (!prepared.ok) {
    const lines = prepared.problems.map((p) => `${args.file}: ${flag[p.path] ?? p.path} ${p.rule}${p.value === undefined ? '' : `, got ${p.value}`}`);
    throw new CliError(lines.join('\nmixwise: '), EXIT_CODES.invalidScenario);
  }
  return prepared.job;
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
  const line = (text: string, value: number, outcomes: OrderOutcomes) => [text, count(value), value === best ? '0' : `+${count(value - best)}`, ...shown.map((k) => count(outcomes[k]))];
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
  const job = prepareJob(scenario, args);
  const settings = Object.fromEntries(Object.entries(args.settings).filter(([, v]) => v !== undefined)) as Partial<OrderSearchSettings>;
  const result = await searchOrders(job, inThreadEvaluator(job), settings);
  io.out(args.format === 'json' ? jsonText(scenario, job, result) : tableText(scenario, job, result));
  return EXIT_CODES.ok;
}

/** Runs `mixwise orders` with the words after "orders"; never throws. */
export async function ordersCommand(io: Output, words: readonly string[]): Promise<ExitCode> {
  try {
    return await orders(io, words);
  } catch (err) {
    return reportFault(err, (text) => io.err(text));
  }
}
