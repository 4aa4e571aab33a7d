/**
 * Seeded mutations of a scenario file, as a careless or hostile user would make them: wrong types,
 * non-finite and extreme numbers, missing and extra keys, wrong lengths, deep nesting, reserved
 * and odd names, broken JSON and other text encodings. Each mutant is the bytes of a file.
 */

export interface Mutant {
  /** What was done, for a failing test's message. */
  label: string;
  bytes: Uint8Array;
}

const EXTREME_NUMBERS = [0, -0, -1, 1e-320, 5e-324, 1e-5, 0.5, 1.5, 2 ** 53 + 1, 1e20, 1e200, 1e308, -1e308, 3650.5, 1e6];
/** Written into the text as it stands: JSON.parse gives Infinity for the first two; the rest are not JSON. */
const NUMBER_TEXTS = ['1e999999', '-1e999', 'NaN', 'Infinity', '0x10', '01', '.5', '1e'];
const NAMES = ['constructor', '__proto__', 'toString', 'hasOwnProperty', 'valueOf', '', ' ', 'a\u0000b', 'line\nbreak', 'é', 'home'];
const ENCODINGS = ['utf16le-bom', 'utf16le', 'utf16be-bom', 'latin1', 'nul', 'truncate', 'trailing-comma', 'utf8-bom', 'control'];

const encoder = new TextEncoder();

function pick<T>(random: () => number, items: readonly T[]): T {
  return items[Math.floor(random() * items.length)];
}

type Path = (string | number)[];

interface Slot {
  parent: Record<string, unknown> | unknown[];
  key: string | number;
  path: string;
}

/** Where things are in the base file, found once: every slot, and the slots holding numbers, lists, objects, names, matrices. */
interface PlaceMap {
  all: Path[];
  numbers: Path[];
  /** Numbers outside the contact matrices (which hold most of a file's numbers). */
  scalars: Path[];
  lists: Path[];
  objects: Path[];
  names: Path[];
  matrices: Path[];
}

const maps = new WeakMap<object, PlaceMap>();

function mapOf(root: Record<string, unknown>): PlaceMap {
  const known = maps.get(root);
  if (known !== undefined) return known;
  const map: PlaceMap = { all: [], numbers: [], scalars: [], lists: [[]], objects: [[]], names: [], matrices: [] };
  const stack: { node: unknown; path: Path }[] = [{ node: root, path: [] }];
  while (stack.length > 0) {
    const { node, path } = stack.pop() as { node: unknown; path: Path };
    const entries: [string | number, unknown][] = Array.isArray(node) ? node.map((v, k) => [k, v]) : Object.entries(node as object);
    for (const [key, child] of entries) {
      const at = [...path, key];
      map.all.push(at);
      if (typeof child === 'number') map.numbers.push(at);
      if (typeof child === 'number' && !at.includes('contactsPerDay')) map.scalars.push(at);
      if (key === 'name' || key === 'setting' || key === 'vaccinationCampaign' || key === 'referenceOption' || key === 'quantity' || key === 'kind' || key === 'startDate') map.names.push(at);
      if (key === 'contactsPerDay') map.matrices.push(at);
      if (Array.isArray(child)) map.lists.push(at);
      else if (child !== null && typeof child === 'object') map.objects.push(at);
      if (child !== null && typeof child === 'object') stack.push({ node: child, path: at });
    }
  }
  maps.set(root, map);
  return map;
}

/** The slot at `path` in `root` (which earlier changes may have altered), or null when it is gone. */
function slotAt(root: Record<string, unknown>, path: Path): Slot | null {
  let parent: unknown = root;
  for (let k = 0; k < path.length - 1; k++) {
    if (parent === null || typeof parent !== 'object') return null;
    parent = (parent as Record<string | number, unknown>)[path[k]];
  }
  if (parent === null || typeof parent !== 'object') return null;
  return { parent: parent as Record<string, unknown>, key: path[path.length - 1], path: path.map((p) => (typeof p === 'number' ? `[${p}]` : `.${p}`)).join('').replace(/^\./, '') };
}

function valueOf(slot: Slot): unknown {
  return (slot.parent as Record<string | number, unknown>)[slot.key];
}

function setValue(slot: Slot, value: unknown): void {
  (slot.parent as Record<string | number, unknown>)[slot.key] = value;
}

/** A slot of the given kind in `tree`, picked from the base's map; the root's first field when gone. */
function slotOf(random: () => number, tree: Record<string, unknown>, paths: Path[]): Slot {
  return slotAt(tree, pick(random, paths)) ?? { parent: tree, key: 'title', path: 'title' };
}

function nearMiss(random: () => number, key: string): string {
  switch (Math.floor(random() * 4)) {
    case 0:
      return key.slice(0, -1);
    case 1:
      return `${key}s`;
    case 2:
      return key.toUpperCase();
    default:
      return `${key}_${Math.floor(random() * 100)}`;
  }
}

function nested(value: unknown, depth: number, asObject: boolean): unknown {
  let v = value;
  for (let k = 0; k < depth; k++) v = asObject ? { x: v } : [v];
  return v;
}

/** One structural change to the tree; returns its label and, for a number written as text, the marker to replace. */
function mutateTree(random: () => number, tree: Record<string, unknown>, map: PlaceMap): { label: string; marker?: [string, string] } {
  const kind = Math.floor(random() * 9);
  switch (kind) {
    case 0: {
      const slot = slotOf(random, tree, map.all);
      const other = pick(random, ['text', true, null, {}, [], [1, 2], { a: 1 }, 42]);
      setValue(slot, other);
      return { label: `${slot.path} = ${JSON.stringify(other)}` };
    }
    case 1: {
      const slot = slotOf(random, tree, random() < 0.7 ? map.scalars : map.numbers);
      if (random() < 0.3) {
        const text = pick(random, NUMBER_TEXTS);
        const marker = `@@number${Math.floor(random() * 1e9)}@@`;
        setValue(slot, marker);
        return { label: `${slot.path} = ${text}`, marker: [JSON.stringify(marker), text] };
      }
      const x = pick(random, EXTREME_NUMBERS);
      setValue(slot, x);
      return { label: `${slot.path} = ${x}` };
    }
    case 2: {
      const slot = slotOf(random, tree, map.all);
      if (Array.isArray(slot.parent)) slot.parent.splice(slot.key as number, 1);
      else delete slot.parent[slot.key as string];
      return { label: `delete ${slot.path}` };
    }
    case 3: {
      const slot = slotAt(tree, pick(random, map.objects));
      const target = slot === null ? tree : slot.path === '' ? tree : valueOf(slot);
      if (target === null || typeof target !== 'object' || Array.isArray(target)) return { label: 'no object to extend' };
      const object = target as Record<string, unknown>;
      const keys = Object.keys(object);
      const key = keys.length > 0 && random() < 0.6 ? nearMiss(random, pick(random, keys)) : pick(random, [...NAMES, 'extra', 'kind', 'doublingTimeDays', 'r0']);
      object[key] = pick(random, [1, 'x', true, [], { a: 1 }]);
      return { label: `add field ${JSON.stringify(key)}` };
    }
    case 4: {
      const slot = slotAt(tree, pick(random, map.lists));
      const list = slot === null ? null : valueOf(slot);
      if (!Array.isArray(list)) return { label: 'no list to change' };
      const how = Math.floor(random() * 3);
      if (how === 0 && list.length > 0) list.push(structuredClone(list[list.length - 1]));
      else if (how === 1) list.pop();
      else list.length = 0;
      return { label: `${slot?.path} length changed (${['grow', 'shrink', 'empty'][how]})` };
    }
    case 5: {
      const slot = slotOf(random, tree, map.all);
      const depth = pick(random, [2, 70, 2000]);
      setValue(slot, nested(valueOf(slot), depth, random() < 0.5));
      return { label: `${slot.path} nested ${depth} deep` };
    }
    case 6: {
      const slot = slotOf(random, tree, map.names);
      const name = pick(random, NAMES);
      setValue(slot, name);
      return { label: `${slot.path} = ${JSON.stringify(name)}` };
    }
    case 7: {
      const slot = slotOf(random, tree, random() < 0.7 ? map.scalars : map.numbers);
      const before = valueOf(slot);
      const x = (typeof before === 'number' ? before : 1) * pick(random, [1e3, 1e6, 1e-3, -1, 1e30]);
      setValue(slot, x);
      return { label: `${slot.path} scaled to ${x}` };
    }
    default: {
      const slot = slotOf(random, tree, map.matrices);
      const m = valueOf(slot);
      const v = pick(random, [1e200, 1e308, 0, 999, 1001]);
      if (Array.isArray(m)) for (const row of m) if (Array.isArray(row)) row[Math.floor(random() * row.length)] = v;
      return { label: `${slot.path} a column of ${v}` };
    }
  }
}

function encode(random: () => number, text: string, how: string): Uint8Array {
  switch (how) {
    case 'utf16le-bom':
      return Uint8Array.from([0xff, 0xfe, ...utf16(text, true)]);
    case 'utf16le':
      return Uint8Array.from(utf16(text, true));
    case 'utf16be-bom':
      return Uint8Array.from([0xfe, 0xff, ...utf16(text, false)]);
    case 'latin1': {
      const at = text.indexOf('"', Math.floor(random() * text.length));
      const bytes = encoder.encode(text);
      const spot = at < 0 ? 1 : encoder.encode(text.slice(0, at + 1)).length;
      return Uint8Array.from([...bytes.subarray(0, spot), 0xe9, ...bytes.subarray(spot)]);
    }
    case 'nul':
      return encoder.encode(`${text.slice(0, 10)}\u0000${text.slice(10)}`);
    case 'truncate':
      return encoder.encode(text.slice(0, Math.floor(random() * text.length)));
    case 'trailing-comma': {
      const closers = [...text.matchAll(/[}\]]/g)].map((m) => m.index ?? 0);
      const at = pick(random, closers);
      return encoder.encode(`${text.slice(0, at)},${text.slice(at)}`);
    }
    case 'utf8-bom':
      return Uint8Array.from([0xef, 0xbb, 0xbf, ...encoder.encode(text)]);
    default: {
      const at = text.indexOf('"title"');
      return encoder.encode(`${text.slice(0, at + 10)}\u0007\u001b[2J${text.slice(at + 10)}`);
    }
  }
}

function utf16(text: string, littleEndian: boolean): number[] {
  const out: number[] = [];
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (littleEndian) out.push(c & 0xff, c >> 8);
    else out.push(c >> 8, c & 0xff);
  }
  return out;
}

/** A mutant of `base` (not changed): one to three tree changes, or a text-level change (about 1 in 6). */
export function mutateScenario(random: () => number, base: Record<string, unknown>): Mutant {
  const map = mapOf(base);
  const tree = structuredClone(base);
  const labels: string[] = [];
  const markers: [string, string][] = [];
  const textLevel = random() < 1 / 6;
  const changes = textLevel ? (random() < 0.5 ? 0 : 1) : 1 + Math.floor(random() * 3);
  for (let k = 0; k < changes; k++) {
    const { label, marker } = mutateTree(random, tree, map);
    labels.push(label);
    if (marker !== undefined) markers.push(marker);
  }
  let text = JSON.stringify(tree, null, random() < 0.5 ? 2 : undefined);
  for (const [marker, literal] of markers) text = text.replace(marker, literal);
  if (!textLevel) return { label: labels.join('; '), bytes: encoder.encode(text) };
  const how = pick(random, ENCODINGS);
  return { label: [...labels, `text: ${how}`].join('; '), bytes: encode(random, text, how) };
}

/**
 * The demo with every newer section filled in, so mutations reach them too: a start date, a life
 * table, admission delays band by band, triggered measures (on infections per 100,000 and on
 * admissions, with lags and minimum days), a second campaign with its own priority order
 * (all-or-nothing) and an uncertainty section with each kind of distribution (contactScale of a
 * setting included).
 */
export function enrichedDemo(demo: Record<string, unknown>): Record<string, unknown> {
  const s = structuredClone(demo) as Record<string, any>;
  const bands = (s.ageBands as unknown[]).length;
  s.startDate = '2031-03-01';
  s.lifeTable = { rows: [{ ageYears: 0, remainingYears: 85 }, { ageYears: 40, remainingYears: 46 }, { ageYears: 90, remainingYears: 6 }], source: 'invented for the fuzz test' };
  s.healthcare.admissionDelayByBand = Array.from({ length: bands }, (_, i) => ({ meanDays: 8 + i / 4, shape: 3 }));
  s.options.push(
    { name: 'Close schools on infections', phases: [{ fromDay: 10, toDay: 200, trigger: { quantity: 'infectiousPer100k', onAbove: 200, offBelow: 50, minimumDaysOn: 14, lagDays: 3 }, settingMultipliers: { school: 0 } }] },
    { name: 'Halve work on admissions', phases: [{ fromDay: 0, toDay: 365, trigger: { quantity: 'dailyAdmissions', onAbove: 40, offBelow: 10, lagDays: 7 }, settingMultipliers: { work: 0.5 }, caseIsolation: 0.3 }], vaccinationCampaign: 'Young first' },
  );
  s.vaccinationCampaigns.push({
    ...structuredClone(s.vaccinationCampaigns[0]),
    name: 'Young first',
    protection: 'allOrNothing',
    priority: [[3, 4, 5, 6], [7, 8, 9, 10], [11, 12, 13, 14, 15]],
  });
  s.uncertainty = {
    draws: 20,
    seed: 5,
    intervalLevel: 0.8,
    parameters: [
      { name: 'r0', distribution: { kind: 'triangular', low: 2, mode: 2.5, high: 3.2 }, source: 'invented' },
      { name: 'latentPeriodDays', distribution: { kind: 'normal', mean: 3, sd: 0.5, low: 1, high: 5 }, source: 'invented' },
      { name: 'contactScale.school', distribution: { kind: 'lognormal', median: 1, range95: [0.7, 1.4] }, source: 'invented' },
      { name: 'ifrScale', distribution: { kind: 'lognormal', median: 1, geometricSd: 1.3 }, source: 'invented' },
      { name: 'measureAdherence', distribution: { kind: 'uniform', low: 0.6, high: 1 }, source: 'invented' },
      { name: 'hospitalisationScale', distribution: { kind: 'uniform', low: 0.8, high: 1.2 }, source: 'invented' },
    ],
  };
  return s;
}
