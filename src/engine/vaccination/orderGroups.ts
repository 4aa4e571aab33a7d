/**
 * Priority groups for an order search: which bands move together, written by band index
 * ("0-3,4-9,10-12,13-15": groups separated by commas, a group is a band or a range of bands,
 * ranges may be joined with "+", e.g. "3+5-6"). The search orders these groups; a group's bands
 * share its doses in proportion to the people eligible, as in any campaign (dosePlan.ts).
 */
import type { Problem } from '../problems.ts';
import type { Campaign } from './schema.ts';

/** Band groups from a spec like "0-3,4-9,10-12,13-15"; null when the text is not of that form. */
export function parseGroupSpec(text: string): number[][] | null {
  const groups: number[][] = [];
  for (const part of text.split(',')) {
    const group: number[] = [];
    for (const piece of part.split('+')) {
      const m = /^\s*(\d+)\s*(?:-\s*(\d+)\s*)?$/.exec(piece);
      if (m === null) return null;
      const from = Number(m[1]);
      const to = m[2] === undefined ? from : Number(m[2]);
      if (to < from) return null;
      for (let b = from; b <= to; b++) group.push(b);
    }
    groups.push(group);
  }
  return groups;
}

/** The spec text of band groups (inverse of parseGroupSpec for groups of consecutive bands). */
export function groupSpecOf(groups: readonly (readonly number[])[]): string {
  return groups
    .map((g) => {
      const runs: string[] = [];
      let k = 0;
      while (k < g.length) {
        let end = k;
        while (end + 1 < g.length && g[end + 1] === g[end] + 1) end++;
        runs.push(end > k ? `${g[k]}-${g[end]}` : String(g[k]));
        k = end + 1;
      }
      return runs.join('+');
    })
    .join(',');
}

/**
 * Groups must name real bands, each at most once, and include every band the campaign can reach
 * (uptake ceiling > 0): leaving one out would change the supply the orders share. Bands with a
 * zero ceiling may be left out. `field` is the name the problems are reported under.
 */
export function groupProblems(groups: readonly (readonly number[])[], campaign: Campaign, bandLabels: readonly string[], field = 'groups'): Problem[] {
  const n = bandLabels.length;
  const problems: Problem[] = [];
  const seen = new Set<number>();
  if (groups.length === 0) problems.push({ path: field, rule: 'must have at least one group' });
  for (const group of groups) {
    for (const b of group) {
      if (!Number.isInteger(b) || b < 0 || b >= n) problems.push({ path: field, rule: `must name bands 0 to ${n - 1}`, value: String(b) });
      else if (seen.has(b)) problems.push({ path: field, rule: `must not repeat a band: band ${b} (${bandLabels[b]}) appears twice`, value: String(b) });
      seen.add(b);
    }
  }
  for (let b = 0; b < n; b++) {
    const ceiling = campaign.uptakeCeiling[b] ?? 0;
    if (ceiling > 0 && !seen.has(b)) {
      problems.push({ path: field, rule: `must include band ${b} (${bandLabels[b]}), which the campaign can vaccinate (uptake ceiling ${ceiling})`, value: groupSpecOf(groups) });
    }
  }
  return problems;
}

/**
 * A band order (e.g. a built-in template's) as an order of groups: groups ranked by the earliest
 * position any of their bands takes in `bandPriority`, ties and unplaced groups in their given order.
 */
export function groupPermutationFor(groups: readonly (readonly number[])[], bandPriority: readonly (readonly number[])[]): number[] {
  const rank = new Map<number, number>();
  bandPriority.forEach((group, k) => group.forEach((b) => rank.set(b, k)));
  const first = groups.map((g) => Math.min(...g.map((b) => rank.get(b) ?? Infinity)));
  return groups.map((_, k) => k).sort((a, b) => (first[a] === first[b] ? a - b : first[a] - first[b]));
}

/** Bands joined by decade of their lower age (0-9, 10-19, ...): ten-year groups. */
export function tenYearGroups(lowerAgesYears: readonly number[]): number[][] {
  const byDecade = new Map<number, number[]>();
  lowerAgesYears.forEach((age, b) => {
    const decade = Math.floor(age / 10);
    byDecade.set(decade, [...(byDecade.get(decade) ?? []), b]);
  });
  return [...byDecade.keys()].sort((a, b) => a - b).map((d) => byDecade.get(d) as number[]);
}

/** Named group sets: "ten-year" and "bands" (every band its own group); null for other names. */
export function namedGroups(name: string, lowerAgesYears: readonly number[]): number[][] | null {
  if (name === 'ten-year') return tenYearGroups(lowerAgesYears);
  if (name === 'bands') return lowerAgesYears.map((_, b) => [b]);
  return null;
}
