import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { parseScenarioText, validateScenario } from '../../src/engine/validation.ts';
import { runScenario } from '../../src/engine/run.ts';
import type { Scenario } from '../../src/engine/scenario.ts';
import type { OptionResults } from '../../src/engine/results.ts';
import { documentFor } from '../../src/renderer/lib/scenarioEdits.ts';
import {
  addCampaignFromTemplate,
  campaignOfOption,
  checkCampaignName,
  compareOrders,
  ordersToCompare,
  copyCampaignForOption,
  optionsUsingCampaign,
  renameCampaign,
  setOptionCampaign,
  uniqueCampaignName,
  updateCampaign,
} from '../../src/renderer/lib/campaignEdits.ts';
import { appendBand, bandsOutsideOrder, groupLabel, mergeWithNext, moveGroup, removeGroup, sameOrder, splitGroup } from '../../src/renderer/lib/priorityOrder.ts';
import { doseGroups, dosesPerDayOfGroup } from '../../src/renderer/lib/doseGroups.ts';
import { boardCell, boardRowsFor } from '../../src/renderer/lib/boardRows.ts';
import { formatValue } from '../../src/report/numberFormat.ts';
import { NOT_APPLICABLE, outcome } from '../../src/report/outcomes.ts';
import { optionBuffers } from '../../src/engine/pool/jobs.ts';
import { curveOfOption } from '../../src/renderer/lib/seriesTotals.ts';
import { screen } from '../../src/report/numberFormat.ts';

function demo(): Scenario {
  const r = parseScenarioText(readFileSync('resources/demo-scenario.json', 'utf8'));
  if (!r.ok) throw new Error('demo scenario invalid');
  return r.scenario;
}

const valid = (s: Scenario) => validateScenario(s).ok;
const withCampaign = (s: Scenario) => s.options.findIndex((o) => o.vaccinationCampaign !== undefined);

describe('priority order edits', () => {
  const order = [[3], [2], [1, 0]];

  it('moves a group, clamped to the ends, leaving the input untouched', () => {
    expect(moveGroup(order, 2, 0)).toEqual([[1, 0], [3], [2]]);
    expect(moveGroup(order, 0, 1)).toEqual([[2], [3], [1, 0]]);
    expect(moveGroup(order, 0, -5)).toEqual(order);
    expect(moveGroup(order, 1, 99)).toEqual([[3], [1, 0], [2]]);
    expect(order).toEqual([[3], [2], [1, 0]]);
  });

  it('joins with the next group and splits back in the group\'s own order', () => {
    expect(mergeWithNext(order, 0)).toEqual([[3, 2], [1, 0]]);
    expect(mergeWithNext(order, 2)).toEqual(order);
    expect(splitGroup(order, 2)).toEqual([[3], [2], [1], [0]]);
    expect(splitGroup(order, 0)).toEqual(order);
    expect(splitGroup(mergeWithNext(order, 0), 0)).toEqual(order);
  });

  it('takes groups out and puts bands back at the end, never twice', () => {
    expect(removeGroup(order, 1)).toEqual([[3], [1, 0]]);
    expect(bandsOutsideOrder(removeGroup(order, 1), 5)).toEqual([2, 4]);
    expect(appendBand(order, 4)).toEqual([[3], [2], [1, 0], [4]]);
    expect(appendBand(order, 0)).toEqual(order);
  });

  it('compares orders ignoring band order within a group, and labels groups', () => {
    expect(sameOrder([[0, 1], [2]], [[1, 0], [2]])).toBe(true);
    expect(sameOrder([[0], [1]], [[1], [0]])).toBe(false);
    expect(sameOrder([[0, 1]], [[0], [1]])).toBe(false);
    expect(groupLabel([2, 0], ['0-4', '5-9', '10-14'])).toBe('10-14, 0-4');
  });
});

describe('campaign edits', () => {
  const s = demo();
  const doc = documentFor(s);
  const o = withCampaign(s);
  const campaign = s.vaccinationCampaigns[0];
  const template = { label: 'Oldest first', priority: [[15], [14], [13]] };

  it('finds the campaign an option runs and who shares it', () => {
    expect(campaignOfOption(s, o)).toEqual({ campaign, index: 0 });
    expect(campaignOfOption(s, 0)).toBeNull();
    expect(optionsUsingCampaign(s, campaign.name)).toEqual([s.options[o].name]);
  });

  it('sets and clears an option\'s campaign, validly', () => {
    const shared = setOptionCampaign(doc, 0, campaign.name);
    expect(optionsUsingCampaign(shared.scenario, campaign.name)).toHaveLength(2);
    expect(valid(shared.scenario)).toBe(true);
    const none = setOptionCampaign(doc, o, null);
    expect('vaccinationCampaign' in none.scenario.options[o]).toBe(false);
    expect(valid(none.scenario)).toBe(true);
    expect(doc.scenario.options[o].vaccinationCampaign).toBe(campaign.name);
  });

  it('creates a valid new campaign from a template with a unique name', () => {
    const { doc: next, name } = addCampaignFromTemplate(doc, 0, template);
    expect(name).toBe('Campaign · Oldest first');
    expect(next.scenario.options[0].vaccinationCampaign).toBe(name);
    const created = next.scenario.vaccinationCampaigns.at(-1)!;
    expect(created.priority).toEqual(template.priority);
    expect(created.uptakeCeiling).toHaveLength(s.ageBands.length);
    expect(created.uptakeCeiling[0]).toBe(0);
    expect(created.uptakeCeiling[15]).toBeGreaterThan(0);
    expect(valid(next.scenario)).toBe(true);
    const again = addCampaignFromTemplate(next, 1, template);
    expect(again.name).toBe('Campaign · Oldest first (2)');
    expect(uniqueCampaignName(again.doc.scenario.vaccinationCampaigns, 'Other')).toBe('Other');
  });

  it('updates a campaign without touching the old document; invalid edits fail validation', () => {
    const next = updateCampaign(doc, 0, (c) => ({ ...c, efficacyAgainstInfection: 0.6 }));
    expect(next.scenario.vaccinationCampaigns[0].efficacyAgainstInfection).toBe(0.6);
    expect(campaign.efficacyAgainstInfection).toBe(0.5);
    const bad = updateCampaign(doc, 0, (c) => ({ ...c, efficacyAgainstDeath: 0.1 }));
    const check = validateScenario(bad.scenario);
    expect(check.ok).toBe(false);
    if (!check.ok) expect(check.problems.map((p) => p.path)).toContain('vaccinationCampaigns[0].efficacyAgainstDeath');
  });

  it('renames a campaign and its options follow; names are checked', () => {
    const next = renameCampaign(doc, 0, 'Winter campaign');
    expect(next.scenario.options[o].vaccinationCampaign).toBe('Winter campaign');
    expect(valid(next.scenario)).toBe(true);
    expect(checkCampaignName(s.vaccinationCampaigns, 0, '  ')).toEqual({ ok: false, message: 'Campaign name must not be empty.' });
    const two = addCampaignFromTemplate(doc, 0, template).doc.scenario.vaccinationCampaigns;
    expect(checkCampaignName(two, 1, campaign.name).ok).toBe(false);
    expect(checkCampaignName(two, 0, ' Renamed ')).toEqual({ ok: true, name: 'Renamed' });
  });

  it('gives an option its own copy of a shared campaign', () => {
    const shared = setOptionCampaign(doc, 0, campaign.name);
    const next = copyCampaignForOption(shared, 0);
    expect(next.scenario.options[0].vaccinationCampaign).toBe(`${campaign.name} · ${s.options[0].name}`);
    expect(next.scenario.options[o].vaccinationCampaign).toBe(campaign.name);
    expect(valid(next.scenario)).toBe(true);
  });

  it('compare orders: one copy per template right after the option, each with its own campaign copy', () => {
    const templates = [template, { label: 'Even spread across adults', priority: [[4, 5, 6], [3]] }];
    const next = compareOrders(doc, o, templates);
    const opts = next.scenario.options;
    expect(opts).toHaveLength(s.options.length + 2);
    expect(opts[o + 1].name).toBe(`${s.options[o].name} · Oldest first`);
    expect(opts[o + 2].vaccinationCampaign).toBe(`${campaign.name} · Even spread across adults`);
    const copy = next.scenario.vaccinationCampaigns.find((c) => c.name === opts[o + 2].vaccinationCampaign)!;
    expect(copy.priority).toEqual([[4, 5, 6], [3]]);
    expect(copy.schedule).toEqual(campaign.schedule);
    expect(new Set(next.colourSlots).size).toBe(next.colourSlots.length);
    expect(next.colourSlots.slice(0, o + 1)).toEqual(doc.colourSlots.slice(0, o + 1));
    expect(valid(next.scenario)).toBe(true);
    expect(compareOrders(doc, 0, templates)).toBe(doc);
    // Twice: names stay unique.
    expect(valid(compareOrders(next, o, templates).scenario)).toBe(true);
  });

  it('compare orders skips a template whose order the campaign already runs', () => {
    const own = { label: 'Its own order', priority: campaign.priority.map((g) => [...g].reverse()) };
    const other = { label: 'Even spread across adults', priority: [[4, 5, 6], [3]] };
    expect(ordersToCompare(campaign, [own, other])).toEqual({ added: [other], same: [own] });
    const next = compareOrders(doc, o, [own, other]);
    expect(next.scenario.options).toHaveLength(s.options.length + 1);
    expect(next.scenario.options[o + 1].name).toBe(`${s.options[o].name} · Even spread across adults`);
    expect(compareOrders(doc, o, [own])).toBe(doc);
    // Bands with no uptake get no doses: listing them (at the end) changes nothing.
    const unvaccinated = campaign.uptakeCeiling.flatMap((c, band) => (c === 0 ? [band] : []));
    expect(unvaccinated.length).toBeGreaterThan(0);
    const padded = { label: 'Same, all bands listed', priority: [...campaign.priority, ...unvaccinated.map((b) => [b])] };
    expect(ordersToCompare(campaign, [padded]).same).toEqual([padded]);
  });
});

describe('dose groups', () => {
  it('joins bands by the age cut points and labels them by age', () => {
    const groups = doseGroups([0, 5, 10, 15, 20, 30, 40, 50, 60, 65, 70, 75]);
    expect(groups.map((g) => g.label)).toEqual(['0–19', '20–39', '40–59', '60–69', '70+']);
    expect(groups[0].bands).toEqual([0, 1, 2, 3]);
    expect(groups[4].bands).toEqual([10, 11]);
    expect(doseGroups([0, 65]).map((g) => g.label)).toEqual(['0–64', '65+']);
  });

  it('adds doses per day over a group\'s bands', () => {
    // 2 days x 3 bands, band-major per day.
    const doses = Float64Array.from([1, 2, 3, 10, 20, 30]);
    expect(dosesPerDayOfGroup(doses, 3, [0, 2])).toEqual([4, 40]);
    expect(dosesPerDayOfGroup(doses, 3, [])).toEqual([0, 0]);
  });
});

describe('board rows, series and transfer with hospital and vaccination results', () => {
  const s = demo();
  const results = runScenario(s);
  const o = withCampaign(s);
  const cell = (key: string, k: number) => boardCell(outcome(key), results.options[k], results);

  it('shows hospital and vaccination rows only when some option has them', () => {
    const ids = boardRowsFor(results).map((r) => r.key);
    expect(ids).toContain('peakIcuOccupancy');
    expect(ids).toContain('deathsAvertedPer1000Doses');
    const plain: OptionResults[] = results.options.map((x) => ({ ...x, healthcare: null, vaccination: null }));
    const spreadOnly = boardRowsFor({ ...results, options: plain }).map((r) => r.group);
    // The demo's options have phases, so the measures rows stay.
    expect(new Set(spreadOnly)).toEqual(new Set(['spread', 'measures']));
  });

  it('formats beds against capacity and marks over-capacity; averted numbers are the engine\'s comparison', () => {
    const icu = results.options[0].healthcare!.icu;
    expect(cell('peakIcuOccupancy', 0).text).toBe(screen.bedsAgainstCapacity(icu.peakOccupancy, icu.capacityBeds));
    expect(cell('peakIcuOccupancy', 0).over).toBe(icu.peakOccupancy > icu.capacityBeds);
    expect(cell('deathsAverted', o).value).toBe(results.options[o].comparison!.deathsAverted);
    expect(cell('deathsAvertedPer1000Doses', o).value).toBe(results.options[o].comparison!.deathsAvertedPer1000Doses);
    expect(cell('doses', 0).text).toBe(NOT_APPLICABLE.screen);
    expect(cell('doses', 0).value).toBeNull();
    expect(screen.bedsAgainstCapacity(142.4, 110)).toBe('142 / 110 beds');
    expect(formatValue(outcome('deathsAvertedPer1000Doses'), 4.105, 'screen')).toBe('4.1 per 1,000 doses');
  });

  it('ICU days over capacity: the detail gives patient-days over capacity and days (not patient-days) over surge', () => {
    const icu = results.options[0].healthcare!.icu;
    expect(icu.daysOverSurgeCapacity).not.toBeNull();
    expect(cell('daysIcuOverCapacity', 0).detail).toBe(
      `${screen.persons(icu.patientDaysOverCapacity)} patient-days over · ${icu.daysOverSurgeCapacity} days over surge`,
    );
  });

  it('reads bed curves from the hospital series', () => {
    const curve = curveOfOption(results.options[0], 'icuOccupancy');
    expect(curve).toHaveLength(s.horizonDays);
    expect(Math.max(...curve)).toBeCloseTo(results.options[0].healthcare!.icu.peakOccupancy, 9);
    expect(curveOfOption({ ...results.options[0], healthcare: null }, 'wardOccupancy')).toEqual([]);
  });

  it('transfers every series buffer, hospital and doses included, each once', () => {
    const buffers = results.options.flatMap(optionBuffers);
    expect(new Set(buffers).size).toBe(buffers.length);
    const h = results.options[0].healthcare!.series;
    for (const a of [h.admissions, h.icuAdmissions, h.wardOccupancy, h.icuOccupancy, results.options[o].series.doses]) expect(buffers).toContain(a.buffer);
    expect(buffers).toHaveLength(results.options.length * 10);
  });
});
