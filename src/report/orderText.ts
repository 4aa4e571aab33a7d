/**
 * Vaccination orders as text: a group of consecutive bands by its age range ("20-49", "60+"),
 * other groups by their band labels joined with "+", and an order as its groups joined with " > ".
 * Shared by the command line, the app and the printed report.
 */
import { groupThousands } from './numberFormat.ts';

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

/**
 * The gap of an order's value to the best: "0" for the best value itself, one decimal below
 * one unit ("+0.3", "+<0.1" below 0.05), so a small but real gap never reads as none, and
 * whole units with thousands separators above ("+1,234").
 */
export function gapText(gap: number): string {
  if (!(gap > 0)) return '0';
  if (gap < 0.05) return '+<0.1';
  if (gap < 0.95) return `+${gap.toFixed(1)}`;
  return `+${groupThousands(gap)}`;
}
