/**
 * Rules of the `uncertainty` section that need the rest of the scenario: each parameter named
 * once, names that refer to something real (a setting, the way transmission is given, a hospital
 * section, a vaccination campaign), and distributions whose bounds are in order.
 */
import type { Problem } from '../problems.ts';
import type { Scenario } from '../scenario.ts';
import { truncatedMass } from './quantiles.ts';
import { CONTACT_SCALE_PREFIX, type Distribution } from './schema.ts';

const HOSPITAL_PARAMETERS = ['hospitalisationScale', 'icuShareScale', 'wardStayScale', 'icuStayScale'];

/** Smallest probability a truncated normal may keep between its bounds. */
const SMALLEST_TRUNCATED_MASS = 1e-9;

function distributionProblems(d: Distribution, at: string): Problem[] {
  const problems: Problem[] = [];
  switch (d.kind) {
    case 'uniform':
      if (!(d.high > d.low)) problems.push({ path: `${at}.high`, rule: `must be above low (${d.low})`, value: String(d.high) });
      break;
    case 'triangular':
      if (!(d.high > d.low)) problems.push({ path: `${at}.high`, rule: `must be above low (${d.low})`, value: String(d.high) });
      else if (!(d.mode >= d.low && d.mode <= d.high)) problems.push({ path: `${at}.mode`, rule: `must lie between low and high (${d.low} to ${d.high})`, value: String(d.mode) });
      break;
    case 'normal':
      if (d.low !== undefined && d.high !== undefined && !(d.high > d.low)) {
        problems.push({ path: `${at}.high`, rule: `must be above low (${d.low})`, value: String(d.high) });
      } else if (!(truncatedMass(d).mass >= SMALLEST_TRUNCATED_MASS)) {
        problems.push({ path: at, rule: 'must keep some probability between low and high (the bounds lie too far in one tail)' });
      }
      break;
    case 'lognormal':
      if (d.range95 !== undefined && d.geometricSd !== undefined) {
        problems.push({ path: `${at}.geometricSd`, rule: `must not be given together with ${at}.range95: give exactly one of them` });
      } else if (d.range95 === undefined && d.geometricSd === undefined) {
        problems.push({ path: at, rule: 'must give exactly one of range95 [low, high] or geometricSd' });
      } else if (d.range95 !== undefined && !(d.range95[0] < d.median && d.median < d.range95[1])) {
        problems.push({ path: `${at}.range95`, rule: `must have low < median (${d.median}) < high`, value: JSON.stringify(d.range95) });
      }
      break;
  }
  return problems;
}

function nameProblem(s: Scenario, name: string): string | null {
  const kind = s.disease.transmission.kind;
  if (name === 'r0' && kind !== 'r0') return 'must be doublingTimeDays: disease.transmission is given as a doubling time';
  if (name === 'doublingTimeDays' && kind !== 'doublingTime') return 'must be r0: disease.transmission is given as R0';
  if (HOSPITAL_PARAMETERS.includes(name) && s.healthcare === undefined) return 'needs a healthcare section in the scenario';
  if (name === 'vaccineEfficacyScale' && s.vaccinationCampaigns.length === 0) return 'needs at least one vaccination campaign in the scenario';
  if (name.startsWith(CONTACT_SCALE_PREFIX)) {
    const setting = name.slice(CONTACT_SCALE_PREFIX.length);
    const names = s.settings.map((x) => x.name);
    if (!names.includes(setting)) return `must name a setting of the scenario (${names.map((x) => CONTACT_SCALE_PREFIX + x).join(', ')})`;
  }
  return null;
}

export function uncertaintyProblems(s: Scenario): Problem[] {
  const u = s.uncertainty;
  if (u === undefined) return [];
  const problems: Problem[] = [];
  const seen = new Set<string>();
  u.parameters.forEach((p, k) => {
    const at = `uncertainty.parameters[${k}]`;
    if (seen.has(p.name)) problems.push({ path: `${at}.name`, rule: 'must be unique (each parameter at most once)', value: JSON.stringify(p.name) });
    seen.add(p.name);
    const rule = nameProblem(s, p.name);
    if (rule !== null) problems.push({ path: `${at}.name`, rule, value: JSON.stringify(p.name) });
    problems.push(...distributionProblems(p.distribution, `${at}.distribution`));
  });
  return problems;
}
