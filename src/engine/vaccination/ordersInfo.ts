/**
 * What the app shows about vaccination orders for one option: every built-in template's priority
 * groups for the scenario's bands, and the coverage needed for R < 1 under the option's campaign.
 */
import type { PreparedScenario } from '../prepare.ts';
import { type CoverageNeeded, coverageNeededForRBelowOne } from './coverage.ts';
import { ORDER_TEMPLATES, type OrderTemplate, priorityFromTemplate } from './orders.ts';

export interface OrdersInfo {
  /** Every built-in template with its priority groups for this scenario's bands. */
  templates: { id: OrderTemplate; label: string; description: string; priority: number[][] }[];
  /** Coverage needed for R < 1 under the option's campaign and day-0 measures; null without a campaign. */
  coverage: CoverageNeeded | null;
}

export function ordersInfo(p: PreparedScenario, optionIndex: number): OrdersInfo {
  const option = p.scenario.options[optionIndex];
  const campaign = p.scenario.vaccinationCampaigns.find((c) => c.name === option?.vaccinationCampaign);
  return {
    templates: ORDER_TEMPLATES.map((t) => ({ ...t, priority: priorityFromTemplate(t.id, p) })),
    coverage: option !== undefined && campaign !== undefined ? coverageNeededForRBelowOne(p, option, campaign) : null,
  };
}
