/**
 * Strict reading of a scenario file: every field must be one the format knows. zod's objects drop
 * fields they do not know, so a misspelt `"latentStage": 20` would run with the default of one
 * stage and be called valid. This walks the file beside the zod schema and reports:
 *
 * - unknown fields, at their JSON path, with the closest known name when one is near
 *   (`disease.latentStage is not a known field (did you mean "latentStages"?)`);
 * - a field of another form of a choice (an `r0` transmission that also gives
 *   `doublingTimeDays`): contradictory, so refused rather than ignored;
 * - names JavaScript objects reserve (`constructor`, `toString`, `__proto__` ...) used as keys of a
 *   name-keyed map such as `settingMultipliers`, where they would be read as built-ins or dropped.
 *
 * Works on any zod schema (the walk follows the schema's own definition), iteratively.
 */
import type { z } from 'zod';
import { formatPath, type Problem } from './problems.ts';

/** Names every JavaScript object already has (Object.prototype's properties, __proto__ included). */
export const RESERVED_NAMES: ReadonlySet<string> = new Set(Object.getOwnPropertyNames(Object.prototype));

export function isReservedName(name: string): boolean {
  return RESERVED_NAMES.has(name);
}

/** The parts of zod 4's schema definitions the walk reads. */
interface SchemaDef {
  type: string;
  innerType?: Schema;
  in?: Schema;
  getter?: () => Schema;
  shape?: Record<string, Schema>;
  catchall?: Schema;
  element?: Schema;
  items?: Schema[];
  rest?: Schema | null;
  valueType?: Schema;
  options?: Schema[];
  discriminator?: string;
  values?: unknown[];
}
type Schema = z.core.$ZodType;

const defOf = (s: Schema): SchemaDef => s._zod.def as unknown as SchemaDef;

/** The schema under optional, nullable, default, pipe ... wrappers. */
function unwrap(schema: Schema): Schema {
  let s = schema;
  for (let k = 0; k < 64; k++) {
    const d = defOf(s);
    const next = d.type === 'pipe' ? d.in : d.type === 'lazy' ? d.getter?.() : d.innerType;
    if (next === undefined || !['optional', 'nullable', 'default', 'prefault', 'readonly', 'catch', 'nonoptional', 'pipe', 'lazy'].includes(d.type)) return s;
    s = next;
  }
  return s;
}

function isPlainObject(v: unknown): v is Record<string, unknown> {
  return v !== null && typeof v === 'object' && !Array.isArray(v);
}

/** Only lists and objects can hold unknown fields: the walk never visits anything else. */
function isComposite(v: unknown): boolean {
  return v !== null && typeof v === 'object';
}

/** Discriminator values an object schema accepts for `key` (a literal field), or []. */
function literalValues(objectSchema: Schema, key: string): unknown[] {
  const field = defOf(unwrap(objectSchema)).shape?.[key];
  return field === undefined ? [] : (defOf(unwrap(field)).values ?? []);
}

/** Levenshtein distance (Levenshtein 1966), case-insensitive: the edits between two names. */
function editDistance(a: string, b: string): number {
  const x = a.toLowerCase();
  const y = b.toLowerCase();
  let previous = Array.from({ length: y.length + 1 }, (_, j) => j);
  for (let i = 1; i <= x.length; i++) {
    const current = [i];
    for (let j = 1; j <= y.length; j++) current[j] = Math.min(previous[j] + 1, current[j - 1] + 1, previous[j - 1] + (x[i - 1] === y[j - 1] ? 0 : 1));
    previous = current;
  }
  return previous[y.length];
}

/** The known name closest to `key`, when it is within a third of its length (at least 1 edit). */
export function closestName(key: string, known: readonly string[]): string | null {
  let best: string | null = null;
  let bestDistance = Infinity;
  for (const name of known) {
    const d = editDistance(key, name);
    if (d < bestDistance) {
      best = name;
      bestDistance = d;
    }
  }
  return bestDistance <= Math.max(1, Math.floor(key.length / 3)) ? best : null;
}

const PLAIN_NAME = /^[A-Za-z_$][\w$]*$/;

/** `base.key`, or `base["odd key"]` when the key is not a plain name (escaped: never raw control characters). */
function keyPath(base: string, key: string): string {
  const root = base === '(file)';
  if (PLAIN_NAME.test(key)) return root ? key : `${base}.${key}`;
  return `${root ? '' : base}[${JSON.stringify(key)}]`;
}

interface Visit {
  schema: Schema;
  value: unknown;
  path: PropertyKey[];
  /** For an option of a discriminated choice: the other forms' fields, by form. */
  otherForms?: { discriminator: string; chosen: unknown; fields: Map<string, unknown> };
}

function unknownFieldRule(key: string, known: string[], otherForms: Visit['otherForms']): string {
  const form = otherForms?.fields.get(key);
  if (otherForms !== undefined && form !== undefined) {
    return `does not go with ${otherForms.discriminator} ${JSON.stringify(otherForms.chosen)}: it belongs to ${otherForms.discriminator} ${JSON.stringify(form)} (give the fields of one form only)`;
  }
  const near = closestName(key, known);
  if (near !== null) return `is not a known field (did you mean "${near}"?)`;
  return known.length <= 12 ? `is not a known field (known here: ${known.join(', ')})` : 'is not a known field';
}

/** Unknown or contradictory fields and reserved map keys in `input`, at most `limit`. */
export function strictInputProblems(schema: Schema, input: unknown, limit = 20): Problem[] {
  const problems: Problem[] = [];
  const stack: Visit[] = [{ schema, value: input, path: [] }];
  while (stack.length > 0 && problems.length < limit) {
    const visit = stack.pop() as Visit;
    const s = unwrap(visit.schema);
    const d = defOf(s);
    const { value, path } = visit;
    if (d.type === 'object' && isPlainObject(value) && d.shape !== undefined) {
      const shape = d.shape;
      const closed = d.catchall === undefined || defOf(d.catchall).type === 'never';
      const known = Object.keys(shape);
      const keys = Object.keys(value);
      for (let k = keys.length - 1; k >= 0; k--) {
        const key = keys[k];
        if (Object.hasOwn(shape, key)) {
          if (isComposite(value[key])) stack.push({ schema: shape[key], value: value[key], path: [...path, key] });
        }
        else if (closed) problems.push({ path: keyPath(formatPath(path), key), rule: unknownFieldRule(key, known, visit.otherForms) });
      }
    } else if (d.type === 'array' && Array.isArray(value) && d.element !== undefined) {
      for (let k = value.length - 1; k >= 0; k--) if (isComposite(value[k])) stack.push({ schema: d.element, value: value[k], path: [...path, k] });
    } else if (d.type === 'tuple' && Array.isArray(value) && d.items !== undefined) {
      for (let k = value.length - 1; k >= 0; k--) {
        const item = d.items[k] ?? d.rest ?? undefined;
        if (item !== undefined && item !== null && isComposite(value[k])) stack.push({ schema: item, value: value[k], path: [...path, k] });
      }
    } else if (d.type === 'record' && isPlainObject(value) && d.valueType !== undefined) {
      for (const key of Object.keys(value)) {
        if (isReservedName(key)) {
          problems.push({ path: keyPath(formatPath(path), key), rule: 'must not be a name JavaScript objects reserve (constructor, toString, __proto__ ...)', value: JSON.stringify(key) });
        } else if (isComposite(value[key])) stack.push({ schema: d.valueType, value: value[key], path: [...path, key] });
      }
    } else if (d.type === 'union' && d.options !== undefined) {
      const options = d.options;
      const disc = d.discriminator;
      if (disc !== undefined && isPlainObject(value)) {
        const chosen = options.find((o) => literalValues(o, disc).includes(value[disc]));
        if (chosen === undefined) continue; // zod reports the discriminator itself
        const fields = new Map<string, unknown>();
        const own = new Set(Object.keys(defOf(unwrap(chosen)).shape ?? {}));
        for (const o of options) {
          if (o === chosen) continue;
          for (const key of Object.keys(defOf(unwrap(o)).shape ?? {})) if (!own.has(key) && !fields.has(key)) fields.set(key, literalValues(o, disc)[0]);
        }
        stack.push({ schema: chosen, value, path, otherForms: { discriminator: disc, chosen: value[disc], fields } });
      } else {
        const fitting = options.find((o) => (o as z.ZodType).safeParse(value).success);
        if (fitting !== undefined) stack.push({ schema: fitting, value, path });
      }
    }
  }
  return problems;
}
