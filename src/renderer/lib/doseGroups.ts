/**
 * Age groups for the doses-per-day chart: the scenario's bands joined into a few wider groups
 * so a stacked chart stays readable. Cut points (lower ages 20, 40, 60, 70 years) are a display
 * choice (common practice for age-grouped charts), not part of the model. The doses themselves
 * are the engine's `series.doses`; this only adds bands up.
 */
export const DOSE_GROUP_CUTS_YEARS = [20, 40, 60, 70] as const;

export interface DoseGroup {
  label: string;
  bands: number[];
}

/** Bands grouped by the cut points (empty groups dropped), labelled by age: "0–19", ..., "70+". */
export function doseGroups(lowerAges: readonly number[], cuts: readonly number[] = DOSE_GROUP_CUTS_YEARS): DoseGroup[] {
  const edges = [0, ...cuts, Infinity];
  const groups: DoseGroup[] = [];
  for (let k = 0; k < edges.length - 1; k++) {
    const bands = lowerAges.map((_, i) => i).filter((i) => lowerAges[i] >= edges[k] && lowerAges[i] < edges[k + 1]);
    if (bands.length > 0) groups.push({ label: '', bands });
  }
  groups.forEach((g, k) => {
    const from = lowerAges[g.bands[0]];
    const next = groups[k + 1];
    g.label = next === undefined ? `${from}+` : `${from}–${lowerAges[next.bands[0]] - 1}`;
  });
  return groups;
}

/** Doses per day of one group: sum over its bands of the band-major series (`[d * bands + i]`). */
export function dosesPerDayOfGroup(doses: Float64Array, bands: number, group: readonly number[]): number[] {
  const days = doses.length / bands;
  const out = new Array<number>(days);
  for (let d = 0; d < days; d++) {
    let sum = 0;
    for (const i of group) sum += doses[d * bands + i];
    out[d] = sum;
  }
  return out;
}
