/**
 * Edits of a campaign's priority order, as pure functions. An order is a list of groups of
 * band indices, first group first (see src/engine/vaccination/schema.ts); doses go to the
 * first group until its uptake ceiling is met, then to the next. Each function returns a new
 * order and leaves the old one untouched.
 */
export type PriorityOrder = readonly (readonly number[])[];

/** Moves group `from` to position `to` (clamped to the ends). */
export function moveGroup(order: PriorityOrder, from: number, to: number): number[][] {
  const groups = order.map((g) => [...g]);
  const target = Math.max(0, Math.min(groups.length - 1, to));
  if (from < 0 || from >= groups.length || target === from) return groups;
  const [group] = groups.splice(from, 1);
  groups.splice(target, 0, group);
  return groups;
}

/** Joins group `index` with the group after it (doses then go to both at once). */
export function mergeWithNext(order: PriorityOrder, index: number): number[][] {
  const groups = order.map((g) => [...g]);
  if (index < 0 || index >= groups.length - 1) return groups;
  groups.splice(index, 2, [...groups[index], ...groups[index + 1]]);
  return groups;
}

/** Splits group `index` into one group per band, in the group's own band order. */
export function splitGroup(order: PriorityOrder, index: number): number[][] {
  const groups = order.map((g) => [...g]);
  if (index < 0 || index >= groups.length || groups[index].length < 2) return groups;
  groups.splice(index, 1, ...groups[index].map((b) => [b]));
  return groups;
}

/** Takes group `index` out of the order: its bands get no doses. */
export function removeGroup(order: PriorityOrder, index: number): number[][] {
  return order.filter((_, k) => k !== index).map((g) => [...g]);
}

/** Adds `band` as a new last group (a band already in the order is left where it is). */
export function appendBand(order: PriorityOrder, band: number): number[][] {
  const groups = order.map((g) => [...g]);
  if (groups.some((g) => g.includes(band))) return groups;
  return [...groups, [band]];
}

/** Bands (0..bands-1) that are in no group, ascending. */
export function bandsOutsideOrder(order: PriorityOrder, bands: number): number[] {
  const inOrder = new Set(order.flat());
  return Array.from({ length: bands }, (_, b) => b).filter((b) => !inOrder.has(b));
}

/** True when two orders have the same groups in the same sequence (band order within a group ignored). */
export function sameOrder(a: PriorityOrder, b: PriorityOrder): boolean {
  if (a.length !== b.length) return false;
  const key = (g: readonly number[]) => [...g].sort((x, y) => x - y).join(',');
  return a.every((g, k) => key(g) === key(b[k]));
}

/** A group's bands by label: "60-64, 65-69". */
export function groupLabel(group: readonly number[], labels: readonly string[]): string {
  return group.map((b) => labels[b] ?? `band ${b + 1}`).join(', ');
}
