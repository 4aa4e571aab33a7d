/** Vaccination: dose plans, protection, R, final size with vaccinated fractions, and sanity properties. */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { IntegratorWorkspace, integrate } from '../../src/engine/integrator.ts';
import { initialStateOf } from '../../src/engine/initialState.ts';
import { prepareScenario } from '../../src/engine/prepare.ts';
import { runScenario } from '../../src/engine/run.ts';
import type { CampaignInput, ScenarioInput } from '../../src/engine/scenario.ts';
import { seirRightHandSide, stateLayout } from '../../src/engine/seir.ts';
import { segmentsOf } from '../../src/engine/segments.ts';
import { coverageNeededForRBelowOne } from '../../src/engine/vaccination/coverage.ts';
import { dosePlan, dosesByBandUntil } from '../../src/engine/vaccination/dosePlan.ts';
import { Unvaccinated } from '../../src/engine/vaccination/unvaccinated.ts';
import { priorityFromTemplate } from '../../src/engine/vaccination/orders.ts';
import { demoScenario } from '../helpers/demo.ts';
import { twoBand, valid } from '../helpers/scenarios.ts';

/**
 * The two-band example with a campaign that vaccinates fractions `coverage` before the epidemic
 * takes off: all doses within a day, protection after a mean 1 day, while 1e-7 seeded infections
 * need some 200 days to grow to a noticeable number.
 */
function twoBandVaccinated(coverage: [number, number], efficacy: number, protection: 'leaky' | 'allOrNothing', options?: Partial<CampaignInput>) {
  const base = twoBand({ seed: 1e-7, horizon: 3000 });
  const campaign: CampaignInput = {
    name: 'pre-season',
    schedule: [{ fromDay: 0, dosesPerDay: 1e5 }],
    uptakeCeiling: coverage,
    delayToProtectionDays: 1,
    efficacyAgainstInfection: efficacy,
    efficacyAgainstDeath: Math.max(efficacy, 0.5),
    protection,
    priority: [[0, 1]],
    ...options,
  };
  return valid({ ...base, vaccinationCampaigns: [campaign], options: [{ name: 'none' }, { name: 'vaccinated', vaccinationCampaign: 'pre-season' }] } as ScenarioInput);
}

/**
 * Multi-group final size with vaccinated fractions (extending Ma & Earn 2006, Bull Math Biol
 * 68:679). A person in band i escapes infection with probability exp(-r_i sum_j A_ij z_j), with
 * r_i their relative risk: 1 unvaccinated, (1 - e) leaky-protected; all-or-nothing protects a
 * fraction e completely and leaves the rest at risk 1. Integrating dS/S along the epidemic gives,
 * with c_i the vaccinated fraction,
 *   leaky:          z_i = (1 - c_i)(1 - exp(-Lambda_i)) + c_i (1 - exp(-(1 - e) Lambda_i))
 *   all-or-nothing: z_i = (1 - c_i e)(1 - exp(-Lambda_i)),       Lambda_i = sum_j A_ij z_j.
 * Solved here by fixed-point iteration from z = 1 (independently of the engine's solver).
 */
function vaccinatedFinalSize(A: number[][], c: number[], e: number, protection: 'leaky' | 'allOrNothing'): number[] {
  let z = c.map(() => 1);
  for (let iter = 0; iter < 20000; iter++) {
    const lambda = A.map((row) => row.reduce((acc, a, j) => acc + a * z[j], 0));
    z = lambda.map((L, i) =>
      protection === 'leaky' ? (1 - c[i]) * -Math.expm1(-L) + c[i] * -Math.expm1(-(1 - e) * L) : (1 - c[i] * e) * -Math.expm1(-L),
    );
  }
  return z;
}

describe('final size with vaccinated fractions (two-band example of shared/CHECKS.md item 5)', () => {
  const A = [[1.8, 0.9], [0.3, 1.2]]; // beta D C with beta = 0.02, D = 5
  it.each(['leaky', 'allOrNothing'] as const)('%s protection matches the relation', (protection) => {
    const coverage: [number, number] = [0.3, 0.4];
    const o = runScenario(twoBandVaccinated(coverage, 0.7, protection)).options[1];
    const z = vaccinatedFinalSize(A, coverage, 0.7, protection);
    expect(o.attackRateByBand[0]).toBeCloseTo(z[0], 4);
    expect(o.attackRateByBand[1]).toBeCloseTo(z[1], 4);
  });
});

describe('deaths and admissions with protection against infection and against severe outcomes', () => {
  // Efficacy against an outcome is the cut in a protected person's risk of that outcome, infection
  // included: (1 - e_D) = (1 - e_I) f_D, so an infected protected person dies with relative risk
  // f_D = (1 - e_D) / (1 - e_I) (the usual reading of efficacy as 1 - relative risk; Halloran,
  // Longini & Struchiner 2010, Design and Analysis of Vaccine Studies, Springer; from memory).
  // Split the final size of the relation above into unvaccinated and protected infections and
  // weight the latter by f.
  // Admission efficacy not given: it is taken equal to the efficacy against death (schema default).
  it('leaky, e_I = 0.7, e_D = 0.9: deaths and admissions by the split final size', () => {
    const A = [[1.8, 0.9], [0.3, 1.2]]; // beta D C with beta = 0.02, D = 5
    const coverage = [0.3, 0.4];
    const base = twoBandVaccinated([0.3, 0.4], 0.7, 'leaky', { efficacyAgainstDeath: 0.9 });
    const s = valid({ ...base, healthcare: { infectionHospitalisationRatio: [0.01, 0.05], capacity: { wardBeds: 10, icuBeds: 2 } } } as ScenarioInput);
    const o = runScenario(s).options[1];
    const z = vaccinatedFinalSize(A, coverage, 0.7, 'leaky');
    const lambda = A.map((row) => row[0] * z[0] + row[1] * z[1]);
    const f = (1 - 0.9) / (1 - 0.7);
    const weighted = lambda.map((L, i) => s.populationPersons[i] * ((1 - coverage[i]) * -Math.expm1(-L) + f * coverage[i] * -Math.expm1(-0.3 * L)));
    const ifr = s.severity.infectionFatalityRatio;
    expect(o.deaths / (ifr[0] * weighted[0] + ifr[1] * weighted[1])).toBeCloseTo(1, 4);
    expect(o.healthcare!.admissions / (0.01 * weighted[0] + 0.05 * weighted[1])).toBeCloseTo(1, 4);
  });
});

describe('herd-immunity threshold with vaccination (Anderson & May 1991, Infectious Diseases of Humans)', () => {
  it('uniform, perfect vaccination needs 1 - 1/R0 of the population for R = 1', () => {
    const s = twoBandVaccinated([1, 1], 1, 'leaky');
    const p = prepareScenario(s);
    const need = coverageNeededForRBelowOne(p, s.options[1], s.vaccinationCampaigns[0]);
    expect(need.populationFraction).toBeCloseTo(1 - 1 / 2.1, 6);
  });

  it('and R(t) once protection is in place (day 25, e^-25 still waiting) is 1', () => {
    const h = 1 - 1 / 2.1;
    const r = runScenario(twoBandVaccinated([h, h], 1, 'leaky'));
    expect(r.options[1].series.rt[25]).toBeCloseTo(1, 6);
  });
});

describe('protection types', () => {
  it('leaky and all-or-nothing give the same R for the same coverage and efficacy', () => {
    const leaky = runScenario(twoBandVaccinated([0.5, 0.6], 0.6, 'leaky')).options[1];
    const aon = runScenario(twoBandVaccinated([0.5, 0.6], 0.6, 'allOrNothing')).options[1];
    for (const d of [1, 5, 25, 40]) expect(aon.series.rt[d]).toBeCloseTo(leaky.series.rt[d], 6);
    expect(aon.rStart).toBe(leaky.rStart);
  });

  it('zero efficacy gives the results of no vaccination', () => {
    const r = runScenario(twoBandVaccinated([0.5, 0.6], 0, 'leaky', { efficacyAgainstDeath: 0 }));
    const [none, vaccinated] = r.options;
    // Same model, but the integrator restarts where the dose plan changes: agreement to its tolerance.
    expect(Math.abs(vaccinated.infections - none.infections) / none.infections).toBeLessThan(1e-8);
    expect(Math.abs(vaccinated.deaths - none.deaths) / none.deaths).toBeLessThan(1e-8);
    // A flat peak may fall a day apart when the step sizes differ (the campaign caps the step).
    expect(Math.abs(vaccinated.peakDay - none.peakDay)).toBeLessThanOrEqual(1);
    expect(Math.abs(vaccinated.comparison!.deathsAverted)).toBeLessThan(1e-8 * none.deaths);
  });

  it('efficacy against death alone cuts deaths of the vaccinated, not infections', () => {
    const r = runScenario(twoBandVaccinated([1, 1], 0, 'leaky', { efficacyAgainstDeath: 0.5 }));
    const [none, vaccinated] = r.options;
    expect(Math.abs(vaccinated.infections - none.infections) / none.infections).toBeLessThan(1e-8);
    expect(vaccinated.deaths).toBeCloseTo(0.5 * none.deaths, 4);
    expect(vaccinated.comparison?.deathsAvertedPer1000Doses).toBeCloseTo((1000 * 0.5 * none.deaths) / vaccinated.vaccination!.doses, 3);
  });
});

describe('efficacy against admission', () => {
  it('cuts admissions of infected protected people by (1 - e_H) / (1 - e_I), not their infections', () => {
    const withBeds = (s: ReturnType<typeof twoBandVaccinated>) =>
      valid({ ...s, healthcare: { infectionHospitalisationRatio: [0.01, 0.05], capacity: { wardBeds: 10, icuBeds: 2 } } } as ScenarioInput);
    const r = runScenario(withBeds(twoBandVaccinated([1, 1], 0, 'leaky', { efficacyAgainstDeath: 0, efficacyAgainstAdmission: 0.6 })));
    const [none, vaccinated] = r.options;
    expect(Math.abs(vaccinated.infections - none.infections) / none.infections).toBeLessThan(1e-8);
    // Everyone is protected long before the epidemic: admissions fall to 40% (f_H = 0.4 / 1).
    expect(vaccinated.healthcare!.admissions).toBeCloseTo(0.4 * none.healthcare!.admissions, 3);
    expect(vaccinated.comparison!.admissionsAverted).toBeCloseTo(0.6 * none.healthcare!.admissions, 3);
  });
});

describe('dose plan', () => {
  const s = demoScenario();
  const population = s.populationPersons;
  const campaign = {
    name: 'c', schedule: [{ fromDay: 10, dosesPerDay: 5000 }, { fromDay: 40, dosesPerDay: 20000 }],
    uptakeCeiling: population.map((_, i) => (i >= 12 ? 0.9 : 0.7)), delayToProtectionDays: 14,
    efficacyAgainstInfection: 0.6, efficacyAgainstDeath: 0.9, protection: 'leaky' as const, priority: [[15, 14], [13, 12], [11, 10, 9]], source: '',
  };
  const plan = dosePlan(campaign, population, 365);

  it('never gives more than the supply, nor more than the ceilings, and completes groups together', () => {
    for (const piece of plan) {
      const supply = piece.fromDay < 40 ? 5000 : 20000;
      expect(piece.dosesPerDay.reduce((a, b) => a + b, 0)).toBeLessThanOrEqual(supply * (1 + 1e-12));
    }
    const given = dosesByBandUntil(plan, population.length, 365);
    given.forEach((d, i) => expect(d).toBeLessThanOrEqual(campaign.uptakeCeiling[i] * population[i] * (1 + 1e-12)));
    // Everyone eligible in the three groups is reached within the year at this supply.
    for (const b of [15, 14, 13, 12, 11, 10, 9]) expect(given[b]).toBeCloseTo(campaign.uptakeCeiling[b] * population[b], 6);
    for (const b of [0, 5, 8]) expect(given[b]).toBe(0);
    // Proportional sharing within a group: both bands of the first group finish at the same moment.
    const first = plan[0];
    expect(first.dosesPerDay[15] / first.dosesPerDay[14]).toBeCloseTo((0.9 * population[15]) / (0.9 * population[14]), 12);
  });

  it('the daily dose series of a run adds up to the doses by band', () => {
    const sc = valid({ ...s, vaccinationCampaigns: [...s.vaccinationCampaigns, campaign], options: [...s.options, { name: 'vaccinate', vaccinationCampaign: 'c' }] } as ScenarioInput);
    const o = runScenario(sc).options.at(-1)!;
    const n = population.length;
    for (let i = 0; i < n; i++) {
      let sum = 0;
      for (let d = 0; d < o.series.days; d++) sum += o.series.doses[d * n + i];
      expect(sum).toBeCloseTo(o.vaccination!.dosesByBand[i], 6);
    }
    expect(o.vaccination!.dosesToNonSusceptibleShare).toBeGreaterThan(0);
    expect(o.vaccination!.dosesToNonSusceptibleShare).toBeLessThan(1);
    expect(o.deaths).toBeLessThan(runScenario(sc).options[0].deaths);
  });
});

describe('priority templates', () => {
  const p = prepareScenario(demoScenario());
  it('oldest first starts with 75+, youngest adults first with 20-24, even spread puts all adults in one group', () => {
    expect(priorityFromTemplate('oldestFirst', p)[0]).toEqual([15]);
    expect(priorityFromTemplate('youngestAdultsFirst', p)[0]).toEqual([4]);
    expect(priorityFromTemplate('evenAcrossAdults', p)[0]).toEqual([4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15]);
  });
  it('every template lists each band exactly once', () => {
    for (const t of ['oldestFirst', 'youngestAdultsFirst', 'mostContactsFirst', 'evenAcrossAdults'] as const) {
      expect(priorityFromTemplate(t, p).flat().sort((a, b) => a - b)).toEqual(Array.from({ length: 16 }, (_, i) => i));
    }
  });
});

describe('property: any valid order and supply keeps every compartment non-negative', () => {
  const share = fc.oneof(fc.constant(0), fc.constant(1), fc.double({ min: 0.05, max: 1, noNaN: true }));
  it('holds for random orders, schedules, efficacies and protection types (fast-check)', () => {
    const base = twoBand({ seed: 0.5, horizon: 120 });
    const three = valid({
      ...base,
      ageBands: [...base.ageBands, { label: 'older', lowerAgeYears: 65 }],
      populationPersons: [250, 750, 200],
      settings: [{ name: 'all', contactsPerDay: [[18, 9, 1.6], [3, 12, 2], [2, 7.5, 5]] }],
      disease: { ...base.disease, relativeSusceptibility: undefined },
      severity: { ...base.severity, infectionFatalityRatio: [0.001, 0.01, 0.05] },
      initialState: { infectedPersons: [0.5, 1, 0.2] },
    } as ScenarioInput);
    const order = fc.shuffledSubarray([0, 1, 2], { minLength: 1, maxLength: 3 }).chain((bands) =>
      fc.integer({ min: 1, max: bands.length }).map((cut) => [bands.slice(0, cut), ...(cut < bands.length ? [bands.slice(cut)] : [])]),
    );
    fc.assert(
      fc.property(
        order,
        // fc.double favours extremes (0, 1e-300, 1): without the explicit ranges almost no drawn
        // campaign gave doses enough to move people, and a model losing protected people passed.
        fc.array(fc.record({ fromDay: fc.integer({ min: 0, max: 100 }), dosesPerDay: fc.oneof(fc.constant(0), fc.double({ min: 1, max: 500, noNaN: true })) }), { minLength: 1, maxLength: 3 }),
        fc.tuple(share, share, share),
        share,
        fc.constantFrom('leaky' as const, 'allOrNothing' as const),
        fc.double({ min: 1, max: 30, noNaN: true }),
        (priority, steps, ceiling, efficacy, protection, delay) => {
          const schedule = [...new Map(steps.map((st) => [st.fromDay, st])).values()].sort((a, b) => a.fromDay - b.fromDay);
          const s = valid({
            ...three,
            vaccinationCampaigns: [{ name: 'c', schedule, uptakeCeiling: ceiling, delayToProtectionDays: delay, efficacyAgainstInfection: efficacy, efficacyAgainstDeath: efficacy, protection, priority }],
            options: [{ name: 'v', vaccinationCampaign: 'c' }],
          } as ScenarioInput);
          const p = prepareScenario(s);
          const campaign = p.campaigns.get('c')!;
          const L = stateLayout(3, 1, 1, protection);
          const y = initialStateOf(s, L);
          const transmission = new Float64Array(9);
          const doses = new Unvaccinated(s.populationPersons);
          const rhs = seirRightHandSide(L, 3, 5, transmission, campaign.vaccine, doses);
          const ws = new IntegratorWorkspace(L.size);
          let lowest = Infinity;
          for (const seg of segmentsOf(p, s.options[0], campaign.plan)) {
            transmission.set(seg.transmission);
            doses.enter(seg.fromDay, seg.doseRates);
            integrate(rhs, y, seg.fromDay, seg.toDay, [], () => {}, ws);
            for (const v of y) lowest = Math.min(lowest, v);
          }
          // R is not integrated but what is left of the band: it must not go negative either.
          for (let i = 0; i < 3; i++) lowest = Math.min(lowest, s.populationPersons[i] - L.peopleBlocks.reduce((acc, b) => acc + y[b + i], 0));
          // The integrator controls errors to an absolute 1e-6 persons, so a compartment that empties
          // may dip below zero by about that much (reported values are clipped at 0).
          expect(lowest).toBeGreaterThan(-1e-5);
          const o = runScenario(s).options[0];
          o.vaccination!.dosesByBand.forEach((d, i) => expect(d).toBeLessThanOrEqual(ceiling[i] * s.populationPersons[i] * (1 + 1e-9) + 1e-9));
        },
      ),
      { numRuns: 40, seed: 20261202 },
    );
  });
});

describe('a vaccine with no effect', () => {
  // Efficacy 0 against infection, death and admission: whatever the doses and the protection
  // type, the epidemic must be the one without vaccination, through every vaccination
  // compartment (waiting, protected, immune) of the model.
  it.each(['leaky', 'allOrNothing'] as const)('%s: the same infections, deaths and admissions by band as no vaccination', (protection) => {
    const s = demoScenario();
    const c = s.vaccinationCampaigns[0];
    const noEffect = valid({
      ...s,
      vaccinationCampaigns: [{ ...c, efficacyAgainstInfection: 0, efficacyAgainstDeath: 0, efficacyAgainstAdmission: 0, protection }],
      referenceOption: undefined,
      options: [{ name: 'none' }, { name: 'vaccinated', vaccinationCampaign: c.name }],
    } as ScenarioInput);
    const [none, vaccinated] = runScenario(noEffect).options;
    expect(vaccinated.vaccination!.doses).toBeGreaterThan(1e5);
    none.infectionsByBand.forEach((x, i) => expect(Math.abs(vaccinated.infectionsByBand[i] - x)).toBeLessThan(1e-5 * s.populationPersons[i]));
    expect(Math.abs(vaccinated.deaths - none.deaths)).toBeLessThan(1e-5 * none.deaths);
    expect(Math.abs(vaccinated.healthcare!.admissions - none.healthcare!.admissions)).toBeLessThan(1e-5 * none.healthcare!.admissions);
    expect(Math.abs(vaccinated.peakDay - none.peakDay)).toBeLessThanOrEqual(1);
  });
});
