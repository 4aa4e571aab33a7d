/**
 * The hand-made mutants of src/engine for `scripts/mutation/run.ts`: each replaces one exact piece
 * of text (which must occur exactly once in its file) by a plausible slip: an operator flipped, a
 * factor dropped, a constant changed, indices swapped. A mutant whose text no longer exists
 * (the code moved on) is reported as "stale", not counted; update or drop it.
 */

export interface Mutant {
  id: string;
  /** Path from the repository root. */
  file: string;
  find: string;
  replace: string;
  /** What the slip means for the model. */
  what: string;
}

const T = 'src/engine/transmission.ts';
const C = 'src/engine/contacts.ts';
const S = 'src/engine/seir.ts';
const D = 'src/engine/integrator.ts';
const I = 'src/engine/integrateOption.ts';
const N = 'src/engine/ngm.ts';
const P = 'src/engine/initialState.ts';
const CAL = 'src/engine/calibration.ts';
const SIM = 'src/engine/simulate.ts';
const F = 'src/engine/finalSize.ts';
const G = 'src/engine/growth.ts';
const R = 'src/engine/reproduction.ts';

export const MUTANTS: Mutant[] = [
  // Transmission matrix M_ij = beta u_i C_ij h_j (1 - c) / N_j
  { id: 'tm-drop-h', file: T, find: '* bp.infectiousness[j] * keep', replace: '* keep', what: 'relative infectiousness h_j left out' },
  { id: 'tm-drop-u', file: T, find: 'beta * bp.susceptibility[i] * out', replace: 'beta * out', what: 'relative susceptibility u_i left out' },
  { id: 'tm-drop-c', file: T, find: 'for (const phase of phases) keep *= 1 - phase.caseIsolation;', replace: 'for (const phase of phases) keep *= 1;', what: 'case isolation ignored' },
  { id: 'tm-u-index', file: T, find: 'bp.susceptibility[i]', replace: 'bp.susceptibility[j]', what: 'u taken from the infector band' },
  { id: 'tm-h-index', file: T, find: 'bp.infectiousness[j]', replace: 'bp.infectiousness[i]', what: 'h taken from the infectee band' },
  { id: 'tm-divide-ni', file: T, find: ') / nj :', replace: ') / bp.population[i] :', what: 'divided by N_i instead of N_j' },
  { id: 'tm-h-from-u', file: T, find: 's.disease.relativeInfectiousness ??', replace: 's.disease.relativeSusceptibility ??', what: 'infectiousness read from the susceptibility field' },
  { id: 'tm-c-sign', file: T, find: 'keep *= 1 - phase.caseIsolation;', replace: 'keep *= 1 - 0.5 * phase.caseIsolation;', what: 'case isolation half as strong' },
  // Contacts under measures
  { id: 'ct-max-factor', file: C, find: 'pair *= Math.min(f[s][i], f[s][j]);', replace: 'pair *= Math.max(f[s][i], f[s][j]);', what: 'larger age factor of the pair instead of the smaller' },
  { id: 'ct-row-factor', file: C, find: 'pair *= Math.min(f[s][i], f[s][j]);', replace: 'pair *= f[s][i];', what: 'age factor of the row band only' },
  { id: 'ct-drop-multiplier', file: C, find: 'const m = multipliers[s];', replace: 'const m = 1;', what: 'setting multiplier ignored' },
  { id: 'ct-factors-replace', file: C, find: 'factors[s][b] *= af.factor', replace: 'factors[s][b] = af.factor', what: 'several factors for one band replace instead of multiply' },
  {
    id: 'ct-default-multiplier',
    file: C,
    find: '(phase !== null && Object.hasOwn(phase.settingMultipliers, s.name) ? phase.settingMultipliers[s.name] : 1)',
    replace: '(phase === null ? 1 : Object.hasOwn(phase.settingMultipliers, s.name) ? phase.settingMultipliers[s.name] : 0)',
    what: 'unnamed settings closed under a phase',
  },
  { id: 'ct-reciprocity-nj', file: C, find: '/ (2 * population[i])', replace: '/ (2 * population[j])', what: 'reciprocity correction divides by N_j' },
  { id: 'ct-imbalance-sum', file: C, find: 'Math.abs(a - b) / big', replace: 'Math.abs(a - b) / (a + b)', what: 'imbalance relative to the sum' },
  // SEIR right-hand side
  { id: 'rhs-latent-rate-e1', file: S, find: 'dydt[oE + i] = flow - aE * y[oE + i];', replace: 'dydt[oE + i] = flow - aI * y[oE + i];', what: 'first latent stage leaves at the infectious rate' },
  { id: 'rhs-ae-no-stages', file: S, find: 'const aE = L.latentStages / latentPeriodDays;', replace: 'const aE = 1 / latentPeriodDays;', what: 'latent stage rate ignores the stage count' },
  { id: 'rhs-ai-no-stages', file: S, find: 'const aI = L.infectiousStages / infectiousPeriodDays;', replace: 'const aI = 1 / infectiousPeriodDays;', what: 'infectious stage rate ignores the stage count' },
  { id: 'rhs-first-stage-only', file: S, find: 'sum += y[oI + k * n + j];', replace: 'sum += y[oI + j];', what: 'only the first infectious stage infects (counted k times)' },
  {
    id: 'rhs-transposed',
    file: S,
    find: 'const lambda = rowTimes(transmission, i * n, infectious, n);',
    replace: 'let lambda = 0;\n      for (let j = 0; j < n; j++) lambda += transmission[j * n + i] * infectious[j];',
    what: 'force of infection with M transposed',
  },
  { id: 'rhs-recovery-first', file: S, find: 'dydt[oR + i] = aI * y[lastI + i];', replace: 'dydt[oR + i] = aI * y[oI + i];', what: 'recovery from the first infectious stage' },
  { id: 'rhs-protected-risk', file: S, find: 'const protectedFlow = risk * lambda * p;', replace: 'const protectedFlow = lambda * p;', what: 'protected people at full risk' },
  { id: 'rhs-dose-share', file: S, find: 'Math.min(1, susceptible / u)', replace: '1', what: 'every dose lands on a susceptible' },
  { id: 'rhs-aon-immune', file: S, find: 'dydt[oV + i] = efficacy * protecting;', replace: 'dydt[oV + i] = 0;', what: 'all-or-nothing successes vanish' },
  { id: 'rhs-unvaccinated-frozen', file: S, find: 'const u = atStart[i] - rates[i] * sinceStart;', replace: 'const u = atStart[i];', what: 'the unvaccinated do not fall within a segment' },
  { id: 'rhs-leaky-risk', file: S, find: "v.protection === 'leaky' ? 1 - v.efficacyAgainstInfection : 1", replace: "v.protection === 'leaky' ? v.efficacyAgainstInfection : 1", what: 'leaky risk e instead of 1 - e' },
  { id: 'rhs-no-clip', file: S, find: 'infectious[j] = sum > 0 ? sum : 0;', replace: 'infectious[j] = sum;', what: 'negative infectious dips not clipped' },
  { id: 'rhs-latent-chain-rate', file: S, find: 'dydt[at] = aE * (y[at - n] - y[at]);', replace: 'dydt[at] = aI * (y[at - n] - y[at]);', what: 'later latent stages at the infectious rate' },
  { id: 'rhs-waiting-infected', file: S, find: 'dydt[oW + i] = toWaiting - lambda * w - protecting;', replace: 'dydt[oW + i] = toWaiting - protecting;', what: 'vaccinated-waiting people not infected' },
  // Integrator
  { id: 'rk-a43', file: D, find: 'A43 = 4.362295432869581', replace: 'A43 = 4.462295432869581', what: 'a Butcher coefficient off' },
  { id: 'rk-b5', file: D, find: 'B5 = -3.290069515436081', replace: 'B5 = -3.390069515436081', what: 'a 5th-order weight off slightly' },
  { id: 'rk-e7', file: D, find: 'E7 = -1 / 66', replace: 'E7 = 1 / 66', what: 'error estimate coefficient sign slip' },
  { id: 'rk-ignore-maxstep', file: D, find: 'h = Math.min(h * factor, maxStep);', replace: 'h = h * factor;', what: 'largest step ignored' },
  { id: 'rk-dense-sign', file: D, find: 'w[6] = 2.5 * (t - 1) * (t - 0.6) * t2;', replace: 'w[6] = -2.5 * (t - 1) * (t - 0.6) * t2;', what: 'dense output sign slip' },
  { id: 'rk-dense-weight', file: D, find: 'w[3] = -16.54810288924490272', replace: 'w[3] = -16.64810288924490272', what: 'dense output coefficient off' },
  { id: 'rk-accept-all', file: D, find: 'if (!(err <= 1)) {', replace: 'if (!(err <= 1000)) {', what: 'steps with large error accepted' },
  { id: 'rk-theta', file: D, find: 'denseWeights((outputTimes[out] - t) / h, w);', replace: 'denseWeights((outputTimes[out] - t) / (1.01 * h), w);', what: 'dense output at a slightly wrong time' },
  // Daily record
  { id: 'io-no-stable-cap', file: I, find: 'return Math.min(DEFAULT_TOLERANCES.maxStep, (0.75 * REAL_STABILITY_BOUNDARY) / Math.max(...rates));', replace: 'return DEFAULT_TOLERANCES.maxStep;', what: 'no stability cap on the step' },
  { id: 'io-prevalence-e-only', file: I, find: 'for (let k = 0; k < infectedBlocks; k++)', replace: 'for (let k = 0; k < L.latentStages; k++)', what: 'prevalence counts E only' },
  { id: 'io-infections-protected', file: I, find: 'x -= w + pr + (oV >= 0 ? y[oV + i] : 0);', replace: 'x -= w + (oV >= 0 ? y[oV + i] : 0);', what: 'infections derived as if the protected had been infected' },
  { id: 'io-infections-immune', file: I, find: 'x -= w + pr + (oV >= 0 ? y[oV + i] : 0);', replace: 'x -= w + pr;', what: 'infections derived as if the vaccine-immune had been infected' },
  { id: 'io-protected-units', file: I, find: 'const xp = y[oXp + i] * unit[i];', replace: 'const xp = y[oXp + i];', what: 'protected infections read in the state\'s units, not persons' },
  { id: 'rhs-quadratures-in-persons', file: S, find: '(persons > 0 ? persons / 100 : 1)', replace: '(persons > 0 ? 1 : 1)', what: 'Xp and Q in persons: the first step of each dose segment rejected' },
  { id: 'io-eff-susceptible', file: I, find: 'const eff = s + w + risk * pr;', replace: 'const eff = s + w + pr;', what: 'R(t) counts protected people at full risk' },
  // The integrator skips an output time that falls exactly on a step's end; each segment's last step ends on its last day.
  { id: 'io-last-day', file: D, find: 'if (out < outputs && outputTimes[out] <= tNew) {', replace: 'if (out < outputs && outputTimes[out] < tNew) {', what: 'last day of each segment not recorded' },
  // Next-generation matrix
  { id: 'ngm-drop-s', file: N, find: 'const f = infectiousPeriodDays * susceptible[i];', replace: 'const f = infectiousPeriodDays;', what: 'K without the susceptibles' },
  { id: 'ngm-drop-d', file: N, find: 'const f = infectiousPeriodDays * susceptible[i];', replace: 'const f = susceptible[i];', what: 'K without the infectious period' },
  // The Perron root is the largest of its strongly connected blocks' roots (perronRoot.ts).
  { id: 'ngm-first-eigenvalue', file: 'src/engine/perronRoot.ts', find: 'if (root > best) best = root;', replace: 'if (best === 0) best = root;', what: 'first root found returned, not the largest' },
  { id: 'ngm-power-rowscale', file: N, find: 'if (rowScale !== null) acc *= rowScale[i];', replace: 'if (rowScale !== null) acc *= rowScale[0];', what: 'R(t) scales every row by band 0 susceptibles' },
  { id: 'ngm-bracket-high', file: N, find: 'return 0.5 * (low + high);', replace: 'return high;', what: 'upper bracket instead of the midpoint' },
  // Calibration and initial state
  { id: 'prep-no-immunity', file: P, find: 'return s.populationPersons[i] * (s.initialState.priorImmunityFraction?.[i] ?? 0);', replace: 'return 0;', what: 'prior immunity ignored' },
  { id: 'prep-seeds-kept', file: P, find: 'Math.max(0, n - immune - seed)', replace: 'Math.max(0, n - immune)', what: 'seeds not taken from the susceptibles' },
  { id: 'prep-doubling-full', file: CAL, find: 'beta = rTarget / reproductionAtUnitTransmission(s, bands, null, initialSusceptibleOf(s));', replace: 'beta = rTarget / perBetaFull;', what: 'doubling time calibrated at full susceptibility' },
  { id: 'prep-seed-latent', file: P, find: "(init.infectedCompartment === 'latent' ? layout.latent : layout.infectious)", replace: 'layout.latent', what: 'seeds always latent' },
  // Outcomes
  { id: 'sim-no-seed-incidence', file: SIM, find: 'for (let i = 0; i < n; i++) incidence[i] += p.seeds[i];', replace: '', what: 'seeds missing from day-0 incidence' },
  { id: 'sim-deaths-no-protection', file: SIM, find: '(x - (1 - deathFactor) * protectedByBand[i]) * p.infectionFatalityRatio[i]', replace: 'x * p.infectionFatalityRatio[i]', what: 'vaccine protection against death ignored in deaths by band' },
  { id: 'sim-final-size-s0', file: SIM, find: "(N > 0 ? 1 - (s.initialState.priorImmunityFraction?.[i] ?? 0) : 0)", replace: '(N > 0 ? 1 : 0)', what: 'final-size check ignores prior immunity' },
  { id: 'sim-attack-total', file: SIM, find: '(population[i] > 0 ? fraction(x / population[i]) : 0)', replace: '(population[i] > 0 ? fraction(x / totalPopulation) : 0)', what: 'band attack rate over the whole population' },
  { id: 'sim-rstart-full', file: SIM, find: 'segments[0].transmission, p.initialSusceptible,', replace: 'segments[0].transmission, p.bands.population,', what: 'R at start ignores prior immunity' },
  // Final size
  { id: 'fs-transposed', file: F, find: 'infectiousPeriodDays * transmission[i * n + j] * population[j]', replace: 'infectiousPeriodDays * transmission[j * n + i] * population[j]', what: 'final size with M transposed' },
  {
    id: 'fs-no-s0',
    file: F,
    find: 'g[i] = s0[i] * -Math.expm1(-pressure);\n      slope[i] = s0[i] * Math.exp(-pressure);',
    replace: 'g[i] = -Math.expm1(-pressure);\n      slope[i] = Math.exp(-pressure);',
    what: 'final size ignores initial susceptibility',
  },
  // Growth rate
  { id: 'gr-latent-one-stage', file: G, find: 'Math.pow(1 + (r * te) / ke, -ke)', replace: 'Math.pow(1 + r * te, -1)', what: 'latent stages ignored in M(r)' },
  { id: 'gr-series', file: G, find: '1 - (x * (ki + 1)) / (2 * ki)', replace: '1 - x / 2', what: 'series near r = 0 for one stage only' },
  { id: 'gr-doubling-zero', file: G, find: 'r > 0 ? Math.LN2 / r : null', replace: 'r >= 0 ? Math.LN2 / r : null', what: 'doubling time at r = 0 is Infinity' },
  // R(t)
  { id: 'rt-drop-d', file: R, find: 'scale[i] = D * effectiveSusceptible[d * n + i];', replace: 'scale[i] = effectiveSusceptible[d * n + i];', what: 'R(t) without the infectious period' },
  { id: 'rt-warm-start', file: R, find: 'if (d - 3 >= measuresSince) for', replace: 'if (d - 3 >= 0) for', what: 'extrapolated start across a measures change' },
  { id: 'rt-segment-late', file: R, find: 'd >= segments[seg].toDay', replace: 'd > segments[seg].toDay', what: 'R(t) on a change day uses the old measures' },
  // Phases and segments
  { id: 'ph-end-inclusive', file: 'src/engine/phases.ts', find: 't >= p.fromDay && t < p.toDay', replace: 't >= p.fromDay && t <= p.toDay', what: 'phase end day inclusive' },
  { id: 'seg-no-change', file: 'src/engine/segments.ts', find: 'const changes = transmission === null || measureDays.includes(from);', replace: 'const changes = transmission === null;', what: 'measures never change after the first segment' },
  // Delays, hospital demand, vaccination, comparisons
  { id: 'dist-midday', file: 'src/engine/distributions.ts', find: 'gammaCdf(k + 0.5, meanDays, shape)', replace: 'gammaCdf(k + 1, meanDays, shape)', what: 'daily delay weights without the mid-day convention' },
  { id: 'dist-trim', file: 'src/engine/distributions.ts', find: 'weights[last - 1] < 1e-16', replace: 'weights[last - 1] < 1e-3', what: 'kernel tail trimmed too far' },
  { id: 'hc-icu-ward-stay', file: 'src/engine/healthcare/demand.ts', find: 'addInto(wardOccupancy, convolve(icu, g.icuPatientWardBedDays));', replace: '', what: 'ward stay of ICU patients not counted' },
  { id: 'hc-complete', file: 'src/engine/healthcare/demand.ts', find: 'lag < k.length ? k[lag] : complete', replace: 'lag < k.length ? k[lag] : 0', what: 'admissions of early infections dropped' },
  { id: 'vx-risk-ratio', file: 'src/engine/vaccination/prepareCampaign.ts', find: '(1 - efficacyAgainstOutcome) / (1 - efficacyAgainstInfection)', replace: '(1 - efficacyAgainstOutcome)', what: 'relative risk given infection not divided by 1 - e_I' },
  { id: 'vx-admission-default', file: 'src/engine/vaccination/prepareCampaign.ts', find: 'c.efficacyAgainstAdmission ?? c.efficacyAgainstDeath', replace: 'c.efficacyAgainstAdmission ?? 0', what: 'admission efficacy defaults to 0' },
  { id: 'run-per-1000', file: 'src/engine/reference.ts', find: '(1000 * averted) / doses', replace: 'averted / doses', what: 'averted per dose, not per 1,000 doses' },
];
