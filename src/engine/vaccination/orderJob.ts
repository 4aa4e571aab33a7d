/**
 * An order search request checked against the scenario and readied once: the option, its
 * campaign, the outcome and the groups (the campaign's own priority groups unless given).
 * Every problem names the request field (option, outcome, groups) and the rule.
 */
import { prepareScenario } from '../prepare.ts';
import type { Scenario } from '../scenario.ts';
import { formatProblem, type Problem } from '../problems.ts';
import { ORDER_OUTCOMES, type OrderOutcome, type OrderSearchJob } from './orderEvaluation.ts';
import { groupProblems } from './orderGroups.ts';

export interface OrderSearchRequest {
  /** Name of the policy option whose campaign is reordered. */
  option: string;
  outcome: string;
  /** Band groups to order; the campaign's priority groups when absent. */
  groups?: number[][];
}

export type PreparedOrderSearch = { ok: true; job: OrderSearchJob } | { ok: false; problems: Problem[] };

function isOrderOutcome(x: string): x is OrderOutcome {
  return (ORDER_OUTCOMES as readonly string[]).includes(x);
}

export function prepareOrderSearch(s: Scenario, request: OrderSearchRequest): PreparedOrderSearch {
  const problems: Problem[] = [];
  const option = s.options.find((o) => o.name === request.option);
  if (option === undefined) problems.push({ path: 'option', rule: `must name a policy option of the scenario (${s.options.map((o) => o.name).join(', ')})`, value: JSON.stringify(request.option) });
  const outcome = request.outcome;
  if (!isOrderOutcome(outcome)) problems.push({ path: 'outcome', rule: `must be one of ${ORDER_OUTCOMES.join(', ')}`, value: JSON.stringify(outcome) });
  else if ((outcome === 'admissions' || outcome === 'peakIcuOccupancy') && s.healthcare === undefined) {
    problems.push({ path: 'outcome', rule: 'needs the scenario\'s healthcare section (hospital ratios and beds)', value: JSON.stringify(outcome) });
  }
  if (option !== undefined && option.vaccinationCampaign === undefined) {
    problems.push({ path: 'option', rule: 'must run a vaccination campaign (this option has none)', value: JSON.stringify(option.name) });
  }
  const campaign = option?.vaccinationCampaign === undefined ? undefined : s.vaccinationCampaigns.find((c) => c.name === option.vaccinationCampaign);
  const groups = request.groups ?? campaign?.priority.map((g) => [...g]) ?? [];
  if (campaign !== undefined) problems.push(...groupProblems(groups, campaign, s.ageBands.map((b) => b.label)));
  if (problems.length > 0 || option === undefined || campaign === undefined || !isOrderOutcome(outcome)) return { ok: false, problems };

  const prepared = prepareScenario(s);
  const preparedCampaign = prepared.campaigns.get(campaign.name);
  if (preparedCampaign === undefined) return { ok: false, problems: [{ path: 'option', rule: 'names a campaign that is not in the scenario', value: JSON.stringify(campaign.name) }] };
  const eligible = (g: readonly number[]) => g.some((b) => (campaign.uptakeCeiling[b] ?? 0) * s.populationPersons[b] > 0);
  return {
    ok: true,
    job: { prepared, option, campaign: preparedCampaign, outcome, groups: groups.filter(eligible), idleGroups: groups.filter((g) => !eligible(g)) },
  };
}

/** What every worker of a pool needs to evaluate orders (orderPool.ts): plain data, cloned across the worker boundary. */
export interface OrderEvaluationContext {
  scenario: Scenario;
  request: OrderSearchRequest;
}

/** The job of a context; throws with the request's problems (callers check the request first). */
export function orderSearchJobOf(context: OrderEvaluationContext): OrderSearchJob {
  const prepared = prepareOrderSearch(context.scenario, context.request);
  if (!prepared.ok) throw new Error(prepared.problems.map(formatProblem).join('; '));
  return prepared.job;
}
