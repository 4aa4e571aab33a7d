/**
 * Edits of the working document, as pure functions: each returns a new document and
 * leaves the old one untouched (the undo history keeps the old ones).
 *
 * The working document is the validated scenario plus one colour slot per option, moved
 * along with its option so an option keeps its colour when others are added, moved or deleted.
 * It may also carry an order comparison included in the report (includedOrders).
 */
import type { OrderComparison, Phase, PolicyOption, Scenario } from '../../engine/index.ts';
import { freeColourSlot } from './optionLines.ts';

export interface WorkingDocument {
  scenario: Scenario;
  /** colourSlots[o] is option o's colour slot (see palette.ts). */
  colourSlots: number[];
  /**
   * An order comparison the analyst chose to include in the report, with the revision of the
   * scenario it was found for (scenarioRevision): the report prints it only while the scenario
   * is still that one. Kept through edits so undo and redo bring it back with the scenario.
   */
  includedOrders?: IncludedOrders;
}

export interface IncludedOrders {
  comparison: OrderComparison;
  revision: string;
}

export function documentFor(scenario: Scenario): WorkingDocument {
  return { scenario, colourSlots: scenario.options.map((_, o) => o) };
}

function withOptions(doc: WorkingDocument, options: PolicyOption[], colourSlots: number[], referenceOption: string | undefined): WorkingDocument {
  const scenario: Scenario = { ...doc.scenario, options };
  if (referenceOption === undefined) delete scenario.referenceOption;
  else scenario.referenceOption = referenceOption;
  return { ...doc, scenario, colourSlots };
}

/** A name not used by any option: `base`, else `base (2)`, `base (3)`, ... */
export function uniqueOptionName(options: readonly PolicyOption[], base: string): string {
  const taken = new Set(options.map((o) => o.name));
  if (!taken.has(base)) return base;
  let k = 2;
  while (taken.has(`${base} (${k})`)) k++;
  return `${base} (${k})`;
}

/** Adds an option without measures at the end. */
export function addOption(doc: WorkingDocument): WorkingDocument {
  const { options } = doc.scenario;
  const option: PolicyOption = { name: uniqueOptionName(options, 'New option'), description: '', phases: [] };
  return withOptions(doc, [...options, option], [...doc.colourSlots, freeColourSlot(doc.colourSlots)], doc.scenario.referenceOption);
}

/** Adds a copy of option `index` right after it. */
export function duplicateOption(doc: WorkingDocument, index: number): WorkingDocument {
  const { options } = doc.scenario;
  const source = options[index];
  const copy: PolicyOption = { ...structuredClone(source), name: uniqueOptionName(options, `${source.name} copy`) };
  const next = [...options.slice(0, index + 1), copy, ...options.slice(index + 1)];
  const slots = [...doc.colourSlots.slice(0, index + 1), freeColourSlot(doc.colourSlots), ...doc.colourSlots.slice(index + 1)];
  return withOptions(doc, next, slots, doc.scenario.referenceOption);
}

export type RenameCheck = { ok: true; name: string } | { ok: false; message: string };

export function checkOptionName(options: readonly PolicyOption[], index: number, name: string): RenameCheck {
  const trimmed = name.trim();
  if (trimmed === '') return { ok: false, message: 'Option name must not be empty.' };
  if (trimmed.length > 60) return { ok: false, message: 'Option name must be at most 60 characters.' };
  if (options.some((o, k) => k !== index && o.name === trimmed)) return { ok: false, message: `Another option is already called "${trimmed}".` };
  return { ok: true, name: trimmed };
}

/** Renames option `index` (the reference follows the rename). The name must pass `checkOptionName`. */
export function renameOption(doc: WorkingDocument, index: number, name: string): WorkingDocument {
  const old = doc.scenario.options[index].name;
  const options = doc.scenario.options.map((o, k) => (k === index ? { ...o, name } : o));
  const reference = doc.scenario.referenceOption === old ? name : doc.scenario.referenceOption;
  return withOptions(doc, options, doc.colourSlots, reference);
}

/**
 * Moves option `index` by `delta` places (clamped to the ends). The reference option stays the
 * same: when it is the first option by default (no `referenceOption`) and the first place
 * changes hands, it is kept by name.
 */
export function moveOption(doc: WorkingDocument, index: number, delta: number): WorkingDocument {
  const target = Math.max(0, Math.min(doc.scenario.options.length - 1, index + delta));
  if (target === index) return doc;
  const firstChanges = index === 0 || target === 0;
  const reference = doc.scenario.referenceOption ?? (firstChanges ? doc.scenario.options[0].name : undefined);
  const options = [...doc.scenario.options];
  const slots = [...doc.colourSlots];
  const [option] = options.splice(index, 1);
  const [slot] = slots.splice(index, 1);
  options.splice(target, 0, option);
  slots.splice(target, 0, slot);
  return withOptions(doc, options, slots, reference);
}

/** Where option `selected` sits after option `index` moved to `target` (the selection follows its option). */
export function indexAfterMove(selected: number, index: number, target: number): number {
  if (selected === index) return target;
  if (index < selected && selected <= target) return selected - 1;
  if (target <= selected && selected < index) return selected + 1;
  return selected;
}

/** Deletes option `index`; the last option cannot be deleted. Deleting the reference makes the first option the reference. */
export function deleteOption(doc: WorkingDocument, index: number): WorkingDocument {
  if (doc.scenario.options.length <= 1) return doc;
  const removed = doc.scenario.options[index].name;
  const options = doc.scenario.options.filter((_, k) => k !== index);
  const slots = doc.colourSlots.filter((_, k) => k !== index);
  const reference = doc.scenario.referenceOption === removed ? undefined : doc.scenario.referenceOption;
  return withOptions(doc, options, slots, reference);
}

export function setReferenceOption(doc: WorkingDocument, index: number): WorkingDocument {
  return withOptions(doc, doc.scenario.options, doc.colourSlots, doc.scenario.options[index].name);
}

/** Replaces phase `phaseIndex` of option `optionIndex` with `update(phase)`. */
export function updatePhase(doc: WorkingDocument, optionIndex: number, phaseIndex: number, update: (p: Phase) => Phase): WorkingDocument {
  const options = doc.scenario.options.map((o, k) =>
    k === optionIndex ? { ...o, phases: o.phases.map((p, j) => (j === phaseIndex ? update(structuredClone(p)) : p)) } : o,
  );
  return withOptions(doc, options, doc.colourSlots, doc.scenario.referenceOption);
}

/**
 * Adds a phase in the first gap of at least one day: it starts where the last phase
 * ends (day 0 if none) and runs 28 days or to the horizon. Null when no day is free.
 */
export function addPhase(doc: WorkingDocument, optionIndex: number): { doc: WorkingDocument; phaseIndex: number } | null {
  const option = doc.scenario.options[optionIndex];
  const horizon = doc.scenario.horizonDays;
  const from = option.phases.reduce((end, p) => Math.max(end, p.toDay), 0);
  if (from >= horizon) return null;
  const phase: Phase = { fromDay: from, toDay: Math.min(horizon, from + 28), settingMultipliers: {}, ageFactors: [], caseIsolation: 0 };
  const options = doc.scenario.options.map((o, k) => (k === optionIndex ? { ...o, phases: [...o.phases, phase] } : o));
  return { doc: withOptions(doc, options, doc.colourSlots, doc.scenario.referenceOption), phaseIndex: option.phases.length };
}

export function deletePhase(doc: WorkingDocument, optionIndex: number, phaseIndex: number): WorkingDocument {
  const options = doc.scenario.options.map((o, k) => (k === optionIndex ? { ...o, phases: o.phases.filter((_, j) => j !== phaseIndex) } : o));
  return withOptions(doc, options, doc.colourSlots, doc.scenario.referenceOption);
}

/** Sets one setting's multiplier in a phase; 1 (as usual) removes the entry. */
export function setSettingMultiplier(doc: WorkingDocument, optionIndex: number, phaseIndex: number, setting: string, multiplier: number): WorkingDocument {
  return updatePhase(doc, optionIndex, phaseIndex, (p) => {
    const settingMultipliers = { ...p.settingMultipliers };
    if (multiplier === 1) delete settingMultipliers[setting];
    else settingMultipliers[setting] = multiplier;
    return { ...p, settingMultipliers };
  });
}

/** Replaces the whole scenario part (e.g. an assumptions edit), keeping colour slots. */
export function replaceScenario(doc: WorkingDocument, scenario: Scenario): WorkingDocument {
  return { ...doc, scenario };
}

/** The document with `included` as the order comparison of the report (null: none). */
export function includeOrders(doc: WorkingDocument, included: IncludedOrders | null): WorkingDocument {
  const { includedOrders: _dropped, ...rest } = doc;
  return included === null ? rest : { ...rest, includedOrders: included };
}
