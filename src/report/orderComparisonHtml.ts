/**
 * The order comparison of a vaccination order search (engine: vaccination/orderComparison.ts) as
 * a section of the printed report: the option and outcome, the groups, the method and how many
 * orders were simulated, the top orders with their outcomes, the gap to the best and (with
 * uncertainty) the share of draws in which each is best, then the built-in orders.
 */
import type { OrderComparison, OrderOutcomes, Scenario } from '../engine/index.ts';
import { escapeMarkup as esc } from './escape.ts';
import { print } from './numberFormat.ts';
import { gapText, groupLabel, orderText } from './orderText.ts';
import { outcome } from './outcomes.ts';

const OUTCOME_KEYS: (keyof OrderOutcomes)[] = ['deaths', 'infections', 'yearsOfLifeLost', 'admissions', 'peakIcuOccupancy'];

/** The outcome keys the comparison prints: the searched one first, hospital ones only when the scenario has them. */
function columns(c: OrderComparison, scenario: Scenario): (keyof OrderOutcomes)[] {
  const present = OUTCOME_KEYS.filter((k) => scenario.healthcare !== undefined || (k !== 'admissions' && k !== 'peakIcuOccupancy'));
  return [c.outcome, ...present.filter((k) => k !== c.outcome)];
}

/** One sentence on how the shares of draws were found, or null without uncertainty. */
export function drawsSentence(c: OrderComparison): string | null {
  if (c.draws === undefined) return null;
  const used = c.draws.draws - c.draws.failedDraws;
  const failed = c.draws.failedDraws > 0 ? `; ${c.draws.failedDraws} failed and are left out` : '';
  return `Best in draws: the share of ${used} uncertainty draws (seed ${c.draws.seed}${failed}) in which the order is the best of the top ${c.orders.length}, ties split.`;
}

export function orderComparisonHtml(c: OrderComparison, scenario: Scenario): string {
  const bands = scenario.ageBands;
  const keys = columns(c, scenario);
  const withShares = c.draws !== undefined;
  const best = c.orders[0]?.value ?? 0;
  const cell = (x: number | null) => `<td class="num">${x === null ? '-' : esc(print.persons(x))}</td>`;
  const head =
    `<th scope="col">Order</th>${keys.map((k, i) => `<th class="num" scope="col">${esc(outcome(k).label)}</th>${i === 0 ? '<th class="num" scope="col">Gap to best</th>' : ''}`).join('')}` +
    (withShares ? '<th class="num" scope="col">Best in draws</th>' : '');
  const row = (label: string, value: number, outcomes: OrderOutcomes, share: string | null, testid: string) =>
    `<tr data-row="${esc(testid)}"><th scope="row">${esc(label)}</th>${keys.map((k, i) => `${cell(k === c.outcome ? value : outcomes[k])}${i === 0 ? `<td class="num">${esc(gapText(value - best))}</td>` : ''}`).join('')}${withShares ? `<td class="num">${share ?? ''}</td>` : ''}</tr>`;
  const top = c.orders.map((o, k) => row(`${k + 1}. ${orderText(o.order, bands)}`, o.value, o.outcomes, o.shareOfDrawsBest === undefined ? null : print.percent(o.shareOfDrawsBest, 0), `order-${k}`));
  const builtIn = c.builtIn.map((b, k) => row(`${b.name}: ${orderText(b.order, bands)}`, b.value, b.outcomes, null, `built-in-${k}`));
  const span = keys.length + 2 + (withShares ? 1 : 0);
  const shares = drawsSentence(c);
  return (
    `<section id="orders" class="order-comparison"><h3>Vaccination orders compared</h3>` +
    `<p>Priority orders of the campaign "${esc(c.campaign)}" of option "${esc(c.option)}" (its supply, uptake ceilings, efficacy and delay unchanged), searched for the lowest ${esc(outcome(c.outcome).label.toLowerCase())}. ` +
    `Groups: ${esc(c.groups.map((g) => groupLabel(g, bands)).join(', '))}. ${esc(c.methodNote)}</p>` +
    `<table class="orders-table"><caption>Best ${c.orders.length} of ${esc(c.ordersInAll.toLocaleString('en'))} orders (${esc(c.evaluated.toLocaleString('en'))} simulated)</caption>` +
    `<thead><tr>${head}</tr></thead><tbody>${top.join('')}<tr><th colspan="${span}" scope="rowgroup">Built-in orders</th></tr>${builtIn.join('')}</tbody></table>` +
    (shares === null ? '' : `<p class="notes">${esc(shares)}</p>`) +
    `</section>`
  );
}
