import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { parseScenarioText, validateScenario } from '../../src/engine/validation.ts';
import { referenceIndexOf } from '../../src/engine/run.ts';
import type { Scenario } from '../../src/engine/scenario.ts';
import type { OrderComparison } from '../../src/engine/index.ts';
import {
  addOption,
  addPhase,
  checkOptionName,
  deleteOption,
  deletePhase,
  documentFor,
  duplicateOption,
  includeOrders,
  indexAfterMove,
  moveOption,
  renameOption,
  setReferenceOption,
  setSettingMultiplier,
  uniqueOptionName,
} from '../../src/renderer/lib/scenarioEdits.ts';

function demo(): Scenario {
  const r = parseScenarioText(readFileSync('resources/demo-scenario.json', 'utf8'));
  if (!r.ok) throw new Error('demo scenario invalid');
  return r.scenario;
}

const names = (s: Scenario) => s.options.map((o) => o.name);
const valid = (s: Scenario) => validateScenario(s).ok;

describe('option edits', () => {
  const doc = documentFor(demo());
  const n = doc.scenario.options.length;

  it('adds an option with a fresh colour, leaving the original untouched', () => {
    const next = addOption(doc);
    expect(next.scenario.options).toHaveLength(n + 1);
    expect(next.colourSlots[n]).toBe(n);
    expect(doc.scenario.options).toHaveLength(n);
    expect(valid(next.scenario)).toBe(true);
  });

  it('duplicates next to the source with a unique name', () => {
    const next = duplicateOption(doc, 1);
    expect(next.scenario.options[2].name).toBe(`${doc.scenario.options[1].name} copy`);
    expect(next.scenario.options[2].phases).toEqual(doc.scenario.options[1].phases);
    expect(next.scenario.options[2].phases).not.toBe(doc.scenario.options[1].phases);
    expect(valid(next.scenario)).toBe(true);
  });

  it('moves options with their colours', () => {
    const next = moveOption(doc, 0, 2);
    expect(names(next.scenario)[2]).toBe(names(doc.scenario)[0]);
    expect(next.colourSlots[2]).toBe(doc.colourSlots[0]);
    expect(moveOption(doc, 0, -1)).toBe(doc);
  });

  it('the selected option stays selected when another option moves past it', () => {
    const next = moveOption(doc, 1, 1);
    const selected = doc.scenario.options[2].name;
    expect(next.scenario.options[indexAfterMove(2, 1, 2)].name).toBe(selected);
    expect(next.scenario.options[indexAfterMove(1, 1, 2)].name).toBe(doc.scenario.options[1].name);
    const far = moveOption(doc, 0, 3);
    for (let k = 0; k < n; k++) expect(far.scenario.options[indexAfterMove(k, 0, 3)].name).toBe(doc.scenario.options[k].name);
  });

  it('moving options keeps the reference option when it is the first one by default', () => {
    const scenario = demo();
    delete scenario.referenceOption;
    const implicit = documentFor(scenario);
    const first = implicit.scenario.options[0].name;
    const referenceOf = (s: Scenario) => s.options[referenceIndexOf(s)].name;
    expect(referenceOf(moveOption(implicit, 0, 1).scenario)).toBe(first);
    expect(referenceOf(moveOption(implicit, 2, -2).scenario)).toBe(first);
    const middle = moveOption(implicit, 1, 1).scenario;
    expect(referenceOf(middle)).toBe(first);
    expect(middle.referenceOption).toBeUndefined();
    expect(valid(moveOption(implicit, 0, 1).scenario)).toBe(true);
  });

  it('renames, and the reference follows', () => {
    const ref = setReferenceOption(doc, 1);
    const next = renameOption(ref, 1, 'Schools shut');
    expect(next.scenario.referenceOption).toBe('Schools shut');
    expect(valid(next.scenario)).toBe(true);
    expect(checkOptionName(doc.scenario.options, 0, doc.scenario.options[1].name)).toMatchObject({ ok: false });
    expect(checkOptionName(doc.scenario.options, 0, '  ')).toEqual({ ok: false, message: 'Option name must not be empty.' });
  });

  it('deletes, never the last option; deleting the reference falls back to the first', () => {
    const ref = setReferenceOption(doc, 2);
    const next = deleteOption(ref, 2);
    expect(next.scenario.options).toHaveLength(n - 1);
    expect(next.scenario.referenceOption).toBeUndefined();
    expect(next.colourSlots).toEqual(doc.colourSlots.filter((_, k) => k !== 2));
    let one = doc;
    while (one.scenario.options.length > 1) one = deleteOption(one, 0);
    expect(deleteOption(one, 0)).toBe(one);
  });

  it('gives unique names', () => {
    expect(uniqueOptionName([{ name: 'A', description: '', phases: [] }, { name: 'A (2)', description: '', phases: [] }], 'A')).toBe('A (3)');
  });
});

describe('phase edits', () => {
  it('adds a phase after the last one, sets and clears multipliers, deletes', () => {
    const doc = documentFor(demo());
    const added = addPhase(doc, 1);
    expect(added).not.toBeNull();
    const phase = added!.doc.scenario.options[1].phases[added!.phaseIndex];
    expect(phase.fromDay).toBe(doc.scenario.options[1].phases.at(-1)!.toDay);
    expect(valid(added!.doc.scenario)).toBe(true);
    const closed = setSettingMultiplier(added!.doc, 1, added!.phaseIndex, 'school', 0);
    expect(closed.scenario.options[1].phases[added!.phaseIndex].settingMultipliers).toEqual({ school: 0 });
    const usual = setSettingMultiplier(closed, 1, added!.phaseIndex, 'school', 1);
    expect(usual.scenario.options[1].phases[added!.phaseIndex].settingMultipliers).toEqual({});
    expect(deletePhase(usual, 1, added!.phaseIndex).scenario.options[1].phases).toEqual(doc.scenario.options[1].phases);
  });

  it('returns null when no day is left before the horizon', () => {
    const doc = documentFor(demo());
    const full = doc.scenario.options.findIndex((o) => o.phases.some((p) => p.toDay >= doc.scenario.horizonDays));
    expect(full).toBeGreaterThanOrEqual(0);
    expect(addPhase(doc, full)).toBeNull();
  });
});

describe('an order comparison included in the report', () => {
  const comparison = { option: 'x' } as unknown as OrderComparison;
  it('stays with the document through edits and goes when left out', () => {
    const doc = includeOrders(documentFor(demo()), { comparison, revision: 'r1' });
    const edited = setReferenceOption(renameOption(addOption(doc), 0, 'Renamed'), 1);
    expect(edited.includedOrders).toEqual({ comparison, revision: 'r1' });
    expect(includeOrders(edited, null)).not.toHaveProperty('includedOrders');
  });
});
