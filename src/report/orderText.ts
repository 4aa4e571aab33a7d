/**
 * Vaccination orders as text: a group of consecutive bands by its age range ("20-49", "60+"),
 * other groups by their band labels joined with "+", and an order as its groups joined with " > ".
 * Shared by the command line, the app and the printed report.
 */

export interface BandAges {
  label: string;
  lowerAgeYears: number;
}

/** "20-49" for bands 20-24 ... 45-49, "60+" when the run reaches the open last band, the label for one band. */
export function groupLabel(group: readonly number[], bands: readonly BandAges[]): string {
  if (group.length === 1) return bands[group[0]]?.label ?? String(group[0]);
  const sorted = [...group].sort((a, b) => a - b);
  const consecutive = sorted.every((b, k) => k === 0 || b === sorted[k - 1] + 1);
  if (!consecutive) return sorted.map((b) => bands[b]?.label ?? String(b)).join('+');
  const first = sorted[0];
  const last = sorted[sorted.length - 1];
  const lower = bands[first].lowerAgeYears;
  const next = bands[last + 1];
  return next === undefined ? `${lower}+` : `${lower}-${next.lowerAgeYears - 1}`;
}

/** "75+ > 70-74 > 20-69". */
export function orderText(groups: readonly (readonly number[])[], bands: readonly BandAges[]): string {
  return groups.map((g) => groupLabel(g, bands)).join(' > ');
}
