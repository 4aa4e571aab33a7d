/**
 * Vaccination edits of the working document, as pure functions (see scenarioEdits.ts): which
 * campaign an option runs, a campaign's settings, new campaigns from an order template, and
 * "compare orders" (one copy of an option per template). Names follow the scenario rules:
 * campaign names are unique and options refer to a campaign by name.
 */
import { ADULT_AGE_YEARS, type Scenario } from '../../engine/index.ts';
import { freeColourSlot } from './optionLines.ts';
import { sameOrder } from './priorityOrder.ts';
import { uniqueOptionName, type WorkingDocument } from './scenarioEdits.ts';

export type Campaign = Scenario['vaccinationCampaigns'][number];

/** An order template as the engine worker computed it for the scenario (vaccination/ordersInfo.ts in the engine). */
export interface TemplateOrder {
  label: string;
  priority: number[][];
}

/**
 * Starting values of a new campaign; the user is expected to replace them. Uptake ceiling 80 %
 * for adults (lower age >= 20 years, the engine's adult convention) and 0 below; supply 0.5 % of
 * the population per day from day 0; efficacies 50 % (infection) and 80 % (death and admission).
 * These are placeholders chosen by the app (common practice for a blank form), not estimates.
 */
export const NEW_CAMPAIGN_DEFAULTS = {
  adultUptakeCeiling: 0.8,
  dosesPerDayShareOfPopulation: 0.005,
  efficacyAgainstInfection: 0.5,
  efficacyAgainstDeath: 0.8,
  delayToProtectionDays: 14,
} as const;

function withScenario(doc: WorkingDocument, scenario: Scenario, colourSlots = doc.colourSlots): WorkingDocument {
  return { ...doc, scenario, colourSlots };
}

/** A campaign name not used yet: `base`, else `base (2)`, `base (3)`, ... */
export function uniqueCampaignName(campaigns: readonly Campaign[], base: string): string {
  const taken = new Set(campaigns.map((c) => c.name));
  if (!taken.has(base)) return base;
  let k = 2;
  while (taken.has(`${base} (${k})`)) k++;
  return `${base} (${k})`;
}

/** Names of the options that run campaign `name`. */
export function optionsUsingCampaign(scenario: Scenario, name: string): string[] {
  return scenario.options.filter((o) => o.vaccinationCampaign === name).map((o) => o.name);
}

/** The campaign option `optionIndex` runs, with its index in `vaccinationCampaigns`; null if none. */
export function campaignOfOption(scenario: Scenario, optionIndex: number): { campaign: Campaign; index: number } | null {
  const name = scenario.options[optionIndex]?.vaccinationCampaign;
  if (name === undefined) return null;
  const index = scenario.vaccinationCampaigns.findIndex((c) => c.name === name);
  return index < 0 ? null : { campaign: scenario.vaccinationCampaigns[index], index };
}

/** Makes option `optionIndex` run campaign `name`, or none (null). */
export function setOptionCampaign(doc: WorkingDocument, optionIndex: number, name: string | null): WorkingDocument {
  const options = doc.scenario.options.map((o, k) => {
    if (k !== optionIndex) return o;
    const next = { ...o };
    if (name === null) delete next.vaccinationCampaign;
    else next.vaccinationCampaign = name;
    return next;
  });
  return withScenario(doc, { ...doc.scenario, options });
}

/** A new campaign with the starting values above and the given priority order. */
export function startingCampaign(scenario: Scenario, name: string, priority: number[][]): Campaign {
  const population = scenario.populationPersons.reduce((a, b) => a + b, 0);
  const d = NEW_CAMPAIGN_DEFAULTS;
  return {
    name,
    schedule: [{ fromDay: 0, dosesPerDay: Math.round(population * d.dosesPerDayShareOfPopulation) }],
    uptakeCeiling: scenario.ageBands.map((b) => (b.lowerAgeYears >= ADULT_AGE_YEARS ? d.adultUptakeCeiling : 0)),
    delayToProtectionDays: d.delayToProtectionDays,
    efficacyAgainstInfection: d.efficacyAgainstInfection,
    efficacyAgainstDeath: d.efficacyAgainstDeath,
    protection: 'leaky',
    priority: priority.map((g) => [...g]),
    source: 'Starting values set by the app (placeholders): replace supply, uptake and efficacy with the vaccine\'s own figures.',
  };
}

/** Adds a new campaign ordered by `template` and makes option `optionIndex` run it. */
export function addCampaignFromTemplate(doc: WorkingDocument, optionIndex: number, template: TemplateOrder): { doc: WorkingDocument; name: string } {
  const campaigns = doc.scenario.vaccinationCampaigns;
  const name = uniqueCampaignName(campaigns, `Campaign · ${template.label}`);
  const scenario = { ...doc.scenario, vaccinationCampaigns: [...campaigns, startingCampaign(doc.scenario, name, template.priority)] };
  return { doc: setOptionCampaign(withScenario(doc, scenario), optionIndex, name), name };
}

/** Replaces campaign `index` with `update(copy)`. */
export function updateCampaign(doc: WorkingDocument, index: number, update: (c: Campaign) => Campaign): WorkingDocument {
  const vaccinationCampaigns = doc.scenario.vaccinationCampaigns.map((c, k) => (k === index ? update(structuredClone(c)) : c));
  return withScenario(doc, { ...doc.scenario, vaccinationCampaigns });
}

/** Renames campaign `index`; options that run it follow the rename. */
export function renameCampaign(doc: WorkingDocument, index: number, name: string): WorkingDocument {
  const old = doc.scenario.vaccinationCampaigns[index].name;
  const renamed = updateCampaign(doc, index, (c) => ({ ...c, name }));
  const options = renamed.scenario.options.map((o) => (o.vaccinationCampaign === old ? { ...o, vaccinationCampaign: name } : o));
  return withScenario(renamed, { ...renamed.scenario, options });
}

/** Checks a typed campaign name: not empty, at most 60 characters, not another campaign's. */
export function checkCampaignName(campaigns: readonly Campaign[], index: number, name: string): { ok: true; name: string } | { ok: false; message: string } {
  const trimmed = name.trim();
  if (trimmed === '') return { ok: false, message: 'Campaign name must not be empty.' };
  if (trimmed.length > 60) return { ok: false, message: 'Campaign name must be at most 60 characters.' };
  if (campaigns.some((c, k) => k !== index && c.name === trimmed)) return { ok: false, message: `Another campaign is already called "${trimmed}".` };
  return { ok: true, name: trimmed };
}

/**
 * The order as it acts for this campaign: bands whose uptake ceiling is 0 never get a dose, so
 * they (and groups left empty) make no difference to where doses go.
 */
function effectiveOrder(priority: readonly (readonly number[])[], uptakeCeiling: readonly number[]): number[][] {
  return priority.map((group) => group.filter((band) => (uptakeCeiling[band] ?? 0) > 0)).filter((group) => group.length > 0);
}

/**
 * The templates worth a copy of a campaign: those whose order gives doses differently from the
 * campaign's own (`same`: the ones it already runs, up to bands that get no doses, which would
 * only duplicate the original).
 */
export function ordersToCompare(campaign: Campaign, templates: readonly TemplateOrder[]): { added: TemplateOrder[]; same: TemplateOrder[] } {
  const own = effectiveOrder(campaign.priority, campaign.uptakeCeiling);
  const same = templates.filter((t) => sameOrder(effectiveOrder(t.priority, campaign.uptakeCeiling), own));
  return { added: templates.filter((t) => !same.includes(t)), same };
}

/**
 * Compare orders: after option `optionIndex`, adds one copy of it per template whose order differs
 * from its campaign's, each running a copy of its campaign ordered by that template
 * ("<campaign> · <template>"), option named "<option> · <template>". One document, so one undo
 * step. Unchanged when the option has no campaign or every template is its own order.
 */
export function compareOrders(doc: WorkingDocument, optionIndex: number, templates: readonly TemplateOrder[]): WorkingDocument {
  const found = campaignOfOption(doc.scenario, optionIndex);
  if (found === null) return doc;
  const { added: differing } = ordersToCompare(found.campaign, templates);
  if (differing.length === 0) return doc;
  const source = doc.scenario.options[optionIndex];
  const campaigns = [...doc.scenario.vaccinationCampaigns];
  const options = [...doc.scenario.options];
  const slots = [...doc.colourSlots];
  const added = differing.map((t) => {
    const campaignName = uniqueCampaignName(campaigns, `${found.campaign.name} · ${t.label}`);
    campaigns.push({ ...structuredClone(found.campaign), name: campaignName, priority: t.priority.map((g) => [...g]) });
    const optionName = uniqueOptionName(options, `${source.name} · ${t.label}`);
    const option = { ...structuredClone(source), name: optionName, vaccinationCampaign: campaignName };
    options.push(option);
    slots.push(freeColourSlot(slots));
    return option;
  });
  // Put the copies right after the source option (they were pushed at the end to reserve names and slots).
  const n = added.length;
  const newSlots = slots.slice(-n);
  const nextOptions = [...doc.scenario.options.slice(0, optionIndex + 1), ...added, ...doc.scenario.options.slice(optionIndex + 1)];
  const nextSlots = [...doc.colourSlots.slice(0, optionIndex + 1), ...newSlots, ...doc.colourSlots.slice(optionIndex + 1)];
  return withScenario(doc, { ...doc.scenario, options: nextOptions, vaccinationCampaigns: campaigns }, nextSlots);
}

/** Gives option `optionIndex` its own copy of the campaign it shares ("<campaign> · <option>"), so edits touch only it. */
export function copyCampaignForOption(doc: WorkingDocument, optionIndex: number): WorkingDocument {
  const found = campaignOfOption(doc.scenario, optionIndex);
  if (found === null) return doc;
  const campaigns = doc.scenario.vaccinationCampaigns;
  const name = uniqueCampaignName(campaigns, `${found.campaign.name} · ${doc.scenario.options[optionIndex].name}`);
  const scenario = { ...doc.scenario, vaccinationCampaigns: [...campaigns, { ...structuredClone(found.campaign), name }] };
  return setOptionCampaign(withScenario(doc, scenario), optionIndex, name);
}
