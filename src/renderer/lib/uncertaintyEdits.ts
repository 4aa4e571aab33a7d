/**
 * Pure helpers of the uncertain-inputs editor (Assumptions view): the inputs a scenario may
 * treat as uncertain and their labels, a starting distribution for a new one, and a distribution
 * turned into another kind with about the same centre and 95% range. Each returns new values; the
 * panel commits the edited scenario through the workspace (validated, one undo step).
 */
import {
  CONTACT_SCALE_PREFIX,
  distributionQuantile,
  FACTOR_PARAMETERS,
  normalQuantile,
  type Distribution,
  type Scenario,
  type UncertainParameter,
  type Uncertainty,
} from '../../engine/index.ts';

const FIXED_LABELS: Record<string, string> = {
  r0: 'R0',
  doublingTimeDays: 'Doubling time (days)',
  latentPeriodDays: 'Latent period (days)',
  infectiousPeriodDays: 'Infectious period (days)',
  ifrScale: 'IFR factor (every band)',
  hospitalisationScale: 'Hospitalisation ratio factor',
  icuShareScale: 'ICU share factor',
  wardStayScale: 'Ward stay factor',
  icuStayScale: 'ICU stay factor',
  measureAdherence: 'Adherence to measures (share achieved)',
  vaccineEfficacyScale: 'Vaccine efficacy factor',
  initialInfectedScale: 'Infected on day 0 factor',
};

/** The input as the analyst reads it: "R0", "Work contacts factor". */
export function parameterLabel(name: string): string {
  if (name.startsWith(CONTACT_SCALE_PREFIX)) {
    const setting = name.slice(CONTACT_SCALE_PREFIX.length);
    return `${setting.charAt(0).toUpperCase()}${setting.slice(1)} contacts factor`;
  }
  return Object.hasOwn(FIXED_LABELS, name) ? FIXED_LABELS[name] : name;
}

/** Inputs this scenario can treat as uncertain (the rules of uncertaintyProblems.ts), in a stable order. */
export function allowedParameters(s: Scenario): string[] {
  const names = [s.disease.transmission.kind === 'r0' ? 'r0' : 'doublingTimeDays', 'latentPeriodDays', 'infectiousPeriodDays'];
  for (const name of FACTOR_PARAMETERS) {
    if (['hospitalisationScale', 'icuShareScale', 'wardStayScale', 'icuStayScale'].includes(name) && s.healthcare === undefined) continue;
    if (name === 'vaccineEfficacyScale' && s.vaccinationCampaigns.length === 0) continue;
    names.push(name);
  }
  for (const setting of s.settings) names.push(CONTACT_SCALE_PREFIX + setting.name);
  return names;
}

/** Allowed inputs not yet in the section. */
export function addableParameters(s: Scenario): string[] {
  const used = new Set(s.uncertainty?.parameters.map((p) => p.name) ?? []);
  return allowedParameters(s).filter((name) => !used.has(name));
}

/** Four significant digits: starting values the analyst can read and type over. */
const tidy = (x: number): number => Number(x.toPrecision(4));

/** The scenario's own (central) value of an input; 1 for a factor. */
export function centralValue(s: Scenario, name: string): number {
  const t = s.disease.transmission;
  if (name === 'r0') return t.kind === 'r0' ? t.r0 : 1;
  if (name === 'doublingTimeDays') return t.kind === 'doublingTime' ? t.doublingTimeDays : 1;
  if (name === 'latentPeriodDays') return s.disease.latentPeriodDays;
  if (name === 'infectiousPeriodDays') return s.disease.infectiousPeriodDays;
  return 1;
}

/** Placeholder source: valid, and it says in the report that the range still needs its source. */
export const UNSOURCED = 'Starting range only: replace with where this range comes from.';

/**
 * A new input's starting distribution: uniform from 80 % to 120 % of the scenario's value
 * (common practice for a first look). Shares that cannot exceed what the scenario states start
 * below it: adherence uniform 0.7 to 1, vaccine efficacy factor 0.8 to 1.
 */
export function newParameter(s: Scenario, name: string): UncertainParameter {
  if (name === 'measureAdherence') return { name, distribution: { kind: 'uniform', low: 0.7, high: 1 }, source: UNSOURCED };
  if (name === 'vaccineEfficacyScale') return { name, distribution: { kind: 'uniform', low: 0.8, high: 1 }, source: UNSOURCED };
  const c = centralValue(s, name);
  return { name, distribution: { kind: 'uniform', low: tidy(0.8 * c), high: tidy(1.2 * c) }, source: UNSOURCED };
}

/** A section with one input (the first the scenario allows), 1,000 draws, seed 1, 90 % intervals. */
export function newUncertainty(s: Scenario, name = allowedParameters(s)[0]): Uncertainty {
  return { draws: 1000, seed: 1, intervalLevel: 0.9, parameters: [newParameter(s, name)] };
}

/** Centre and central range of a distribution: the bounds or range it states, else its 2.5 % and 97.5 % points. */
function centreAndRange(d: Distribution): { centre: number; low: number; high: number } {
  switch (d.kind) {
    case 'uniform':
      return { centre: (d.low + d.high) / 2, low: d.low, high: d.high };
    case 'triangular':
      return { centre: d.mode, low: d.low, high: d.high };
    case 'lognormal':
      if (d.range95 !== undefined) return { centre: d.median, low: d.range95[0], high: d.range95[1] };
      return { centre: d.median, low: distributionQuantile(d, 0.025), high: distributionQuantile(d, 0.975) };
    default:
      return { centre: distributionQuantile(d, 0.5), low: distributionQuantile(d, 0.025), high: distributionQuantile(d, 0.975) };
  }
}

/** 97.5 % point of the standard normal (the 95% range of a normal is mean ± Z sd). */
const Z_975 = normalQuantile(0.975);

/** `d` as another kind with about the same centre and range (a lognormal keeps a positive range). */
export function convertDistribution(d: Distribution, kind: Distribution['kind']): Distribution {
  if (d.kind === kind) return d;
  const { centre, low, high } = centreAndRange(d);
  switch (kind) {
    case 'uniform':
      return { kind, low: tidy(low), high: tidy(high) };
    case 'triangular':
      return { kind, low: tidy(low), mode: tidy(centre), high: tidy(high) };
    case 'normal':
      return { kind, mean: tidy(centre), sd: tidy(Math.max((high - low) / (2 * Z_975), Math.abs(centre) * 1e-3 || 1e-3)) };
    case 'lognormal': {
      const median = centre > 0 ? centre : 1;
      const lo = low > 0 && low < median ? low : median / 2;
      const hi = high > median ? high : median * 2;
      return { kind, median: tidy(median), range95: [tidy(lo), tidy(hi)] };
    }
  }
}

/** A lognormal's spread given the other way: a 95% range from a geometric sd, or the reverse. */
export function switchLognormalSpread(d: Extract<Distribution, { kind: 'lognormal' }>, by: 'range95' | 'geometricSd'): Distribution {
  const low = distributionQuantile(d, 0.025);
  const high = distributionQuantile(d, 0.975);
  if (by === 'range95') return { kind: 'lognormal', median: d.median, range95: [tidy(low), tidy(high)] };
  return { kind: 'lognormal', median: d.median, geometricSd: tidy(Math.max(1.001, Math.exp(Math.log(high / low) / (2 * Z_975)))) };
}

/**
 * The fit's R0 with its 95% interval as R0's distribution: lognormal with the fit's R0 as median
 * and its interval as the central 95% range (the profile-likelihood interval of r maps to R0
 * monotonically, so it is skewed as a lognormal is). Added to the section, or replacing an R0
 * entry already there; a new section starts with `newUncertainty`'s settings. Null when the
 * interval is open or does not surround R0.
 */
export function withR0FromFit(s: Scenario, r0: number, interval: readonly [number | null, number | null], source: string): Scenario | null {
  const [lo, hi] = interval;
  if (lo === null || hi === null || !Number.isFinite(lo) || !Number.isFinite(hi) || !(lo > 0 && lo < r0 && r0 < hi)) return null;
  const entry: UncertainParameter = { name: 'r0', distribution: { kind: 'lognormal', median: r0, range95: [tidy(lo), tidy(hi)] }, source };
  const next = structuredClone(s);
  const u = next.uncertainty;
  if (u === undefined) next.uncertainty = { ...newUncertainty(next, 'r0'), parameters: [entry] };
  else {
    const k = u.parameters.findIndex((p) => p.name === 'r0' || p.name === 'doublingTimeDays');
    if (k >= 0) u.parameters[k] = entry;
    else u.parameters.unshift(entry);
  }
  return next;
}
