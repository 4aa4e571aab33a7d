/**
 * Plain-language summary of a policy option's measures, phase by phase, e.g.
 * "Days 21 to 76 (56 days): school contacts 0% of usual (closed), home contacts 120% of usual."
 *
 * Day numbers count from 0, the scenario's first day. A phase in the file runs from `fromDay`
 * up to but not including `toDay`; the summary prints both ends included (fromDay to toDay - 1),
 * cut to the horizon. Settings not named in a phase stay at 100% of usual contacts.
 */
import type { AgeFactor, Campaign, MeasureBurden, OptionResults, Phase, PhaseReproduction, PolicyOption, Scenario, ScenarioResults, Trigger, TriggerOutcome, TriggerQuantity } from '../engine/index.ts';
import { dateOfDay, print } from './numberFormat.ts';

export interface PhaseSummary {
  /** "Days 21 to 76 (56 days)" or "Whole horizon (days 0 to 364)"; with a trigger, the window it may act in. */
  when: string;
  /** "school contacts 0% of usual (closed); home contacts 120% of usual". */
  what: string;
  /** For a triggered phase: its rule in words ("in force when ICU occupancy exceeds 80 beds; ..."); else null. */
  rule: string | null;
  /** For a triggered phase with results: what it did ("switched on 2 times, first on day 45, in force 63 days"); else null. */
  fired: string | null;
  /** With results: R under the phase ("R 2.16 at its start, 2.16 with everyone susceptible"); else null. */
  r: string | null;
}

/** What a trigger watches, in words, with the unit of its thresholds. */
const QUANTITY_WORDS: Record<TriggerQuantity, { name: string; unit: string }> = {
  infectiousPer100k: { name: 'the number of people infectious', unit: 'per 100,000 population' },
  dailyInfectionsPer100k: { name: 'new infections a day', unit: 'per 100,000 population' },
  dailyAdmissions: { name: 'hospital admissions a day', unit: 'admissions' },
  wardOccupancy: { name: 'ward occupancy', unit: 'beds' },
  icuOccupancy: { name: 'ICU occupancy', unit: 'beds' },
};

/**
 * A trigger's rule in words, e.g. "in force when ICU occupancy exceeds 80 beds, lifted when it
 * falls below 40 beds, decided each day with a 3-day lag, at least 14 days at a time".
 */
export function triggerRuleText(t: Trigger): string {
  const { name, unit } = QUANTITY_WORDS[t.quantity];
  const value = (x: number) => `${print.decimal(x, Number.isInteger(x) ? 0 : 1)} ${unit}`;
  const lag = t.lagDays === 0 ? 'taking effect the same day' : `with a ${t.lagDays}-day lag`;
  const minimum = t.minimumDaysOn > 0 ? `, at least ${t.minimumDaysOn} days at a time` : '';
  return `in force when ${name} exceeds ${value(t.onAbove)}, lifted when it falls below ${value(t.offBelow)}, decided each day ${lag}${minimum}`;
}

/** What a trigger did over the horizon, in words; the first day with its date when the scenario has a start date. */
export function triggerFiredText(t: TriggerOutcome, startDate: string | null = null): string {
  if (t.switchesOn === 0) return 'never came into force';
  const times = t.switchesOn === 1 ? 'once' : `${t.switchesOn} times`;
  return `came into force ${times}, first on day ${dayWithDate(t.firstOnDay, startDate)}, in force ${t.daysInForce} ${t.daysInForce === 1 ? 'day' : 'days'} in all`;
}

/**
 * The trigger rule (src/engine/triggers.ts), in words for the report: how measures switched by
 * what the epidemic does are decided.
 */
export const TRIGGER_RULE_WORDS =
  'Measures with a trigger are decided once a day, on the monitored quantity read that day (daily counts and bed occupancy: those of the day before). ' +
  'When they are not in force and the quantity is above the switch-on level, they come into force after the lag; ' +
  'when they are in force, have been for at least the minimum number of days, and the quantity is below the switch-off level, they lift after the lag. ' +
  'While a decided change waits for its lag, no new decision is taken. Outside the phase\'s days they are not in force.';

export interface OptionSummary {
  name: string;
  isReference: boolean;
  /** The analyst's own description from the scenario file (may be empty). */
  description: string;
  /** One entry per phase that falls within the horizon; empty = contacts as usual throughout. */
  phases: PhaseSummary[];
  /** One sentence for an option with no phase in the horizon, else null. */
  noMeasures: string | null;
  /** The option's vaccination campaign in plain words, or null without one. */
  vaccination: string | null;
  /** With results and measures: the contacts they removed, by setting, in full-closure days; else null. */
  burden: string | null;
}

/** "school 56.0 full-closure days; home -11.2 (contacts added)": settings whose contacts changed. */
export function burdenText(burden: MeasureBurden): string | null {
  const parts = Object.entries(burden.fullClosureDays)
    .filter(([, x]) => Math.abs(x) >= 0.05)
    .map(([setting, x]) => `${setting} ${print.decimal(x, 1)}${x < 0 ? ' (contacts added)' : ''}`);
  return parts.length === 0 ? null : `Contacts removed over the horizon, in full-closure days of each setting: ${parts.join('; ')}.`;
}

function bandList(bands: readonly number[], labels: readonly string[]): string {
  return bands.map((b) => labels[b] ?? `band ${b}`).join(', ');
}

function settingChange(setting: string, multiplier: number): string {
  const closed = multiplier === 0 ? ' (closed)' : '';
  return `${setting} contacts ${print.multiplier(multiplier)} of usual${closed}`;
}

function ageFactorText(factor: AgeFactor, labels: readonly string[]): string {
  return `${factor.setting} contacts of ages ${bandList(factor.bands, labels)} at ${print.multiplier(factor.factor)} of usual`;
}

/** What a phase changes, in plain words; "no change to contacts" when it changes nothing. */
export function phaseMeasuresText(phase: Phase, bandLabels: readonly string[]): string {
  const parts: string[] = [];
  for (const [setting, multiplier] of Object.entries(phase.settingMultipliers)) {
    if (multiplier !== 1) parts.push(settingChange(setting, multiplier));
  }
  for (const factor of phase.ageFactors) parts.push(ageFactorText(factor, bandLabels));
  if (phase.caseIsolation > 0) parts.push(`infectiousness of cases cut by ${print.percent(phase.caseIsolation, 0)} (isolation)`);
  return parts.length === 0 ? 'no change to contacts' : parts.join('; ');
}

/** "45", or "45 (2026-04-15)" with the scenario's start date. */
function dayWithDate(day: number | null, startDate: string | null): string {
  const date = startDate === null || day === null ? null : dateOfDay(startDate, day);
  return date === null ? String(day) : `${day} (${date})`;
}

/**
 * When a phase applies, both ends included, within the horizon; null when it lies outside it.
 * With the scenario's start date, the calendar dates follow: "Days 21 to 76 (56 days; 2031-03-22 to 2031-05-16)".
 */
export function phaseWhenText(phase: Phase, horizonDays: number, startDate: string | null = null): string | null {
  const first = phase.fromDay;
  const last = Math.min(phase.toDay, horizonDays) - 1;
  if (last < first) return null;
  const length = last - first + 1;
  const dates = (a: number, b: number) => {
    const from = startDate === null ? null : dateOfDay(startDate, a);
    const to = startDate === null ? null : dateOfDay(startDate, b);
    return from === null || to === null ? '' : a === b ? `; ${from}` : `; ${from} to ${to}`;
  };
  if (first === 0 && last === horizonDays - 1) return `Whole horizon (days 0 to ${last}${dates(0, last)})`;
  if (length === 1) return `Day ${first} only${startDate === null ? '' : ` (${dates(first, first).slice(2)})`}`;
  return `Days ${first} to ${last} (${length} days${dates(first, last)})`;
}

/**
 * A campaign in plain words: supply steps, priority order, uptake ceiling, efficacy, protection.
 * E.g. "Autumn campaign: from day 30, 6,000 doses a day; from day 90, 12,000 doses a day. Priority: 75+, then 70-74, ..."
 */
export function campaignText(campaign: Campaign, bandLabels: readonly string[]): string {
  const supply = [...campaign.schedule]
    .sort((a, b) => a.fromDay - b.fromDay)
    .map((step) => `from day ${step.fromDay}, ${print.persons(step.dosesPerDay)} doses a day`)
    .join('; ');
  const priority = campaign.priority.map((group) => bandList(group, bandLabels)).join(', then ');
  const ceilings = [...new Set(campaign.uptakeCeiling.filter((c) => c > 0))].map((c) => print.percent(c, 0));
  const uptake = ceilings.length === 0 ? 'no uptake in any band' : `uptake at most ${ceilings.join(' or ')} of a band (bands with 0% are not offered doses)`;
  const admission = campaign.efficacyAgainstAdmission ?? campaign.efficacyAgainstDeath;
  const protection = campaign.protection === 'leaky' ? 'leaky (each vaccinated person\'s risk cut)' : 'all-or-nothing (that share fully protected)';
  return (
    `${campaign.name}: ${supply}. Priority: ${priority}; ${uptake}. ` +
    `Efficacy against infection ${print.percent(campaign.efficacyAgainstInfection, 0)}, against hospital admission ${print.percent(admission, 0)}, ` +
    `against death ${print.percent(campaign.efficacyAgainstDeath, 0)}, ${protection}, protection after ${campaign.delayToProtectionDays} days on average`
  );
}

/** `result`: the option's results, to say what each trigger did, R under each phase and the contacts removed (omit for the measures alone). */
export function optionSummary(option: PolicyOption, scenario: Scenario, isReference: boolean, result?: OptionResults): OptionSummary {
  const triggers = result?.triggers ?? [];
  const labels = scenario.ageBands.map((b) => b.label);
  const phases: PhaseSummary[] = [];
  const ordered = option.phases.map((phase, index) => ({ phase, index })).sort((a, b) => a.phase.fromDay - b.phase.fromDay);
  for (const { phase, index } of ordered) {
    const when = phaseWhenText(phase, scenario.horizonDays, scenario.startDate ?? null);
    if (when === null) continue;
    const outcome = triggers.find((t) => t.phase === index);
    phases.push({
      when: phase.trigger === undefined ? when : `${when}, when triggered`,
      what: phaseMeasuresText(phase, labels),
      rule: phase.trigger === undefined ? null : triggerRuleText(phase.trigger),
      fired: outcome === undefined ? null : triggerFiredText(outcome, scenario.startDate ?? null),
      r: rText(result?.rByPhase[index], scenario.startDate ?? null),
    });
  }
  const campaign = option.vaccinationCampaign === undefined ? undefined : scenario.vaccinationCampaigns.find((c) => c.name === option.vaccinationCampaign);
  return {
    name: option.name,
    isReference,
    description: option.description,
    phases,
    noMeasures: phases.length === 0 ? `No contact measures: contacts as usual for all ${scenario.horizonDays} days.` : null,
    vaccination: campaign === undefined ? null : campaignText(campaign, labels),
    burden: result === undefined ? null : burdenText(result.measureBurden),
  };
}

function rText(r: PhaseReproduction | undefined, startDate: string | null): string | null {
  if (r === undefined) return null;
  return `R ${print.r(r.rAtPhaseStart)} on day ${dayWithDate(r.startDay, startDate)}, ${print.r(r.rMeasuresOnly)} with everyone susceptible`;
}

/** Summaries of every option, in the scenario's order; with `results`, what each trigger did. */
export function optionSummaries(scenario: Scenario, referenceIndex: number, results?: ScenarioResults): OptionSummary[] {
  return scenario.options.map((o, k) => optionSummary(o, scenario, k === referenceIndex, results?.options[k]));
}
