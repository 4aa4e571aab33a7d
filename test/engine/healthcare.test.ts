/**
 * Hospital and ICU demand of whole scenario runs (src/engine/healthcare): published defaults,
 * totals against IHR x infections, zero IHR, non-negative occupancy, per-band delays, capacity
 * counts and validation of the `healthcare` section.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { dailyDelayWeights } from '../../src/engine/distributions.ts';
import { bedDemand } from '../../src/engine/healthcare/capacity.ts';
import { healthcareDemand } from '../../src/engine/healthcare/demand.ts';
import {
  commonDelays,
  defaultIcuShareOfAdmissions,
  defaultInfectionHospitalisationRatio,
  SYMPTOMATIC_SHARE,
} from '../../src/engine/healthcare/defaults.ts';
import { prepareHealthcare } from '../../src/engine/healthcare/prepareHealthcare.ts';
import { runScenario } from '../../src/engine/run.ts';
import type { ScenarioInput } from '../../src/engine/scenario.ts';
import { formatProblem } from '../../src/engine/problems.ts';
import { validateScenario } from '../../src/engine/validation.ts';

type HealthcareInput = NonNullable<ScenarioInput['healthcare']>;

const POPULATION = [30_000, 50_000, 20_000];
const TOTAL = POPULATION.reduce((a, b) => a + b, 0);

/** Three bands (0-29, 30-69, 70+), proportionate mixing C_ij = k N_j / N (reciprocal by construction). */
function threeBand(healthcare: HealthcareInput | undefined, horizon = 400): ScenarioInput {
  const mixing = (k: number): number[][] => POPULATION.map(() => POPULATION.map((nj) => (k * nj) / TOTAL));
  return {
    format: 'mixwise-scenario',
    version: 1,
    title: 'three bands',
    ageBands: [
      { label: '0-29', lowerAgeYears: 0 },
      { label: '30-69', lowerAgeYears: 30 },
      { label: '70+', lowerAgeYears: 70 },
    ],
    populationPersons: POPULATION,
    settings: [{ name: 'all', contactsPerDay: mixing(10) }],
    disease: { transmission: { kind: 'r0', r0: 2.2 }, latentPeriodDays: 3, infectiousPeriodDays: 5 },
    severity: { infectionFatalityRatio: [0.0001, 0.003, 0.05], source: 'test value' },
    initialState: { infectedPersons: [0, 10, 0] },
    horizonDays: horizon,
    options: [
      { name: 'none', phases: [] },
      { name: 'halved', phases: [{ fromDay: 20, toDay: 90, settingMultipliers: { all: 0.5 } }] },
    ],
    ...(healthcare === undefined ? {} : { healthcare }),
  };
}

function run(input: ScenarioInput) {
  const v = validateScenario(input);
  if (!v.ok) throw new Error(v.problems.map(formatProblem).join('\n'));
  return { scenario: v.scenario, results: runScenario(v.scenario) };
}

const IHR = [0.002, 0.02, 0.12];
const ICU_SHARE = [0.05, 0.15, 0.3];
const CAPACITY = { wardBeds: 150, icuBeds: 30, icuSurgeBeds: 45 };
const sum = (xs: ArrayLike<number>): number => Array.from(xs).reduce((a, b) => a + b, 0);

describe('defaults: Ferguson et al. 2020, Imperial College Report 9, Table 1', () => {
  // Ferguson NM et al. 2020, Impact of non-pharmaceutical interventions (NPIs) to reduce COVID-19
  // mortality and healthcare demand, Imperial College COVID-19 Response Team Report 9, Table 1:
  // % symptomatic cases requiring hospitalisation, and % hospitalised requiring critical care, 0-9 ... 80+.
  const hospitalisedPercentOfSymptomatic = [0.1, 0.3, 1.2, 3.2, 4.9, 10.2, 16.6, 24.3, 27.3];
  const criticalPercentOfHospitalised = [5.0, 5.0, 5.0, 5.0, 6.3, 12.2, 27.4, 43.2, 70.9];
  const tenYearBands = { ageBands: [0, 10, 20, 30, 40, 50, 60, 70, 80].map((a) => ({ label: `${a}`, lowerAgeYears: a })) };

  it('gives the table values per symptomatic case for each ten-year band', () => {
    const ihr = defaultInfectionHospitalisationRatio(tenYearBands);
    const icu = defaultIcuShareOfAdmissions(tenYearBands);
    hospitalisedPercentOfSymptomatic.forEach((pct, a) => expect((100 * ihr[a]) / SYMPTOMATIC_SHARE).toBeCloseTo(pct, 12));
    criticalPercentOfHospitalised.forEach((pct, a) => expect(100 * icu[a]).toBeCloseTo(pct, 12));
  });

  it('turns per symptomatic case into per infection with a symptomatic share of 0.8', () => {
    // Buitrago-Garcia D et al. 2020, PLoS Med 17:e1003346: 20% of infections stay asymptomatic.
    expect(SYMPTOMATIC_SHARE).toBe(1 - 0.2);
    const ihr = defaultInfectionHospitalisationRatio(tenYearBands);
    expect(ihr[8]).toBeCloseTo(0.8 * 0.273, 12);
    expect(ihr[0]).toBeCloseTo(0.8 * 0.001, 12);
  });

  it('maps five-year bands (and a wide top band) by their lower age', () => {
    const fiveYear = { ageBands: Array.from({ length: 16 }, (_, i) => ({ label: `${5 * i}`, lowerAgeYears: 5 * i })) };
    const ihr = defaultInfectionHospitalisationRatio(fiveYear);
    const icu = defaultIcuShareOfAdmissions(fiveYear);
    for (let i = 0; i < 16; i++) {
      const tenYear = Math.floor((5 * i) / 10);
      expect(ihr[i]).toBeCloseTo((0.8 * hospitalisedPercentOfSymptomatic[tenYear]) / 100, 12);
      expect(icu[i]).toBeCloseTo(criticalPercentOfHospitalised[tenYear] / 100, 12);
    }
    const old = defaultInfectionHospitalisationRatio({ ageBands: [{ label: '85+', lowerAgeYears: 85 }, { label: '100+', lowerAgeYears: 100 }] });
    expect(old).toEqual([0.8 * 0.273, 0.8 * 0.273].map((x) => expect.closeTo(x, 12)));
  });

  it('fill in when the section gives only capacities', () => {
    const { scenario } = run(threeBand({ capacity: CAPACITY }));
    const h = prepareHealthcare(scenario)!;
    expect(Array.from(h.infectionHospitalisationRatio)).toEqual([0.8 * 0.001, 0.8 * 0.032, 0.8 * 0.243].map((x) => expect.closeTo(x, 12)));
    expect(Array.from(h.icuShareOfAdmissions)).toEqual([0.05, 0.05, 0.432].map((x) => expect.closeTo(x, 12)));
    const defaults = { admissionDelay: { meanDays: 10, shape: 4 }, wardStay: { meanDays: 8, shape: 2 }, icuStay: { meanDays: 10, shape: 2 } };
    expect(commonDelays(scenario.healthcare!)).toEqual(defaults);
    expect(h).toEqual(prepareHealthcare(run(threeBand({ capacity: CAPACITY, ...defaults })).scenario));
  });
});

describe('admissions', () => {
  const { results } = run(threeBand({ infectionHospitalisationRatio: IHR, icuShareOfAdmissions: ICU_SHARE, capacity: CAPACITY }));

  it('total IHR x infections by band once the epidemic and its delays are over', () => {
    // Definition of the infection-hospitalisation ratio: admissions_i = IHR_i x infections_i.
    for (const o of results.options) {
      const h = o.healthcare!;
      o.infectionsByBand.forEach((x, i) => {
        expect(Math.abs(h.admissionsByBand[i] / (IHR[i] * x) - 1)).toBeLessThan(1e-8);
        expect(Math.abs(h.icuAdmissionsByBand[i] / (IHR[i] * ICU_SHARE[i] * x) - 1)).toBeLessThan(1e-8);
      });
      expect(h.admissions).toBeCloseTo(sum(h.admissionsByBand), 6);
      expect(h.wardOnlyAdmissions + h.icuAdmissions).toBeCloseTo(h.admissions, 6);
      expect(sum(h.series.admissions)).toBeCloseTo(h.admissions, 6);
      expect(sum(h.series.icuAdmissions)).toBeCloseTo(h.icuAdmissions, 6);
    }
  });

  it('count only what falls within a short horizon: sum_a IHR_i x_i(a) P(delay <= H - 1 - a)', () => {
    const { results: short } = run(threeBand({ infectionHospitalisationRatio: IHR, icuShareOfAdmissions: ICU_SHARE, capacity: CAPACITY }, 60));
    const o = short.options[0];
    const H = 60;
    const w = dailyDelayWeights(10, 4, H);
    for (let i = 0; i < 3; i++) {
      let expected = 0;
      for (let a = 0; a < H; a++) expected += IHR[i] * o.series.incidence[a * 3 + i] * sum(w.subarray(0, H - a));
      expect(Math.abs(o.healthcare!.admissionsByBand[i] / expected - 1)).toBeLessThan(1e-9);
      expect(o.healthcare!.admissionsByBand[i]).toBeLessThan(IHR[i] * o.infectionsByBand[i]);
    }
  });

  it('are zero, with zero demand, when the IHR is zero', () => {
    const { results: none } = run(threeBand({ infectionHospitalisationRatio: [0, 0, 0], capacity: CAPACITY }));
    for (const o of none.options) {
      const h = o.healthcare!;
      expect(o.infections).toBeGreaterThan(1000);
      expect([h.admissions, h.icuAdmissions, h.wardOnlyAdmissions, h.ward.peakOccupancy, h.icu.peakOccupancy]).toEqual([0, 0, 0, 0, 0]);
      for (const series of Object.values(h.series)) expect(series.every((x: number) => x === 0)).toBe(true);
      expect([h.ward.daysOverCapacity, h.icu.daysOverCapacity, h.icu.daysOverSurgeCapacity]).toEqual([0, 0, 0]);
      expect(h.icu.firstDayOverCapacity).toBeNull();
    }
  });
});

describe('occupancy', () => {
  it('obeys Little\'s law over the whole run: bed-days = admissions x mean stay', () => {
    // Little 1961, Operations Research 9:383, in its time-average form: over a period that starts and
    // ends empty, total time in the system = number of arrivals x mean time in the system.
    const { results } = run(threeBand({ infectionHospitalisationRatio: IHR, icuShareOfAdmissions: ICU_SHARE, capacity: CAPACITY }, 500));
    const h = results.options[0].healthcare!;
    expect(sum(h.series.icuOccupancy) / (h.icuAdmissions * 10)).toBeCloseTo(1, 8);
    expect(sum(h.series.wardOccupancy) / (h.wardOnlyAdmissions * 8 + h.icuAdmissions * 6)).toBeCloseTo(1, 8);
  });

  it('is never negative, for any daily infections and delays (property test)', () => {
    const shape = fc.double({ min: 0.2, max: 12, noNaN: true });
    const delay = fc.record({ meanDays: fc.double({ min: 0, max: 40, noNaN: true }), shape });
    // Admission delays: 0 or at least 1e-6 days (gammaCdf overflows for subnormal means).
    const admission = fc.record({ meanDays: fc.oneof(fc.constant(0), fc.double({ min: 1e-6, max: 40, noNaN: true })), shape });
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 0, max: 1e5, noNaN: true }), { minLength: 30, maxLength: 30 }),
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 3, maxLength: 3 }),
        admission,
        delay,
        delay,
        (infections, icuShare, admissionDelay, wardStay, icuStay) => {
          const input = threeBand({ infectionHospitalisationRatio: [0.01, 0.05, 0.2], icuShareOfAdmissions: icuShare, admissionDelay, wardStay, icuStay, capacity: CAPACITY }, 10);
          const v = validateScenario(input);
          if (!v.ok) throw new Error(v.problems.map(formatProblem).join('\n'));
          const h = healthcareDemand(prepareHealthcare(v.scenario)!, Float64Array.from(infections));
          for (const series of Object.values(h.series)) expect(series.every((x: number) => x >= 0 && Number.isFinite(x))).toBe(true);
        },
      ),
      { numRuns: 200, seed: 20240604 },
    );
  });

  it('with delays given band by band equals the sum of one-band runs with those delays', () => {
    // Linearity: demand is a sum over bands, so grouping bands by delay must not change it.
    const admissionDelayByBand = [{ meanDays: 7, shape: 3 }, { meanDays: 10, shape: 4 }, { meanDays: 12, shape: 2 }];
    const wardStayByBand = [{ meanDays: 4, shape: 2 }, { meanDays: 8, shape: 2 }, { meanDays: 12, shape: 1.5 }];
    const icuStayByBand = [{ meanDays: 6, shape: 2 }, { meanDays: 10, shape: 2 }, { meanDays: 10, shape: 2 }];
    const base = { icuShareOfAdmissions: ICU_SHARE, capacity: CAPACITY };
    const { scenario, results } = run(threeBand({ ...base, infectionHospitalisationRatio: IHR, admissionDelayByBand, wardStayByBand, icuStayByBand }));
    expect(prepareHealthcare(scenario)!.groups).toHaveLength(3);
    const incidence = results.options[0].series.incidence;
    const combined = results.options[0].healthcare!;
    const parts = [0, 1, 2].map((i) => {
      const only = IHR.map((x, j) => (j === i ? x : 0));
      const v = validateScenario(threeBand({ ...base, infectionHospitalisationRatio: only, admissionDelay: admissionDelayByBand[i], wardStay: wardStayByBand[i], icuStay: icuStayByBand[i] }));
      if (!v.ok) throw new Error('invalid');
      return healthcareDemand(prepareHealthcare(v.scenario)!, incidence);
    });
    for (const key of ['admissions', 'icuAdmissions', 'wardOccupancy', 'icuOccupancy'] as const) {
      combined.series[key].forEach((x, d) => expect(x).toBeCloseTo(parts[0].series[key][d] + parts[1].series[key][d] + parts[2].series[key][d], 8));
    }
    // And the same delays for every band, given band by band, change nothing against the common form.
    const same = run(threeBand({ ...base, infectionHospitalisationRatio: IHR, wardStayByBand: [0, 1, 2].map(() => ({ meanDays: 8, shape: 2 })) }));
    const common = run(threeBand({ ...base, infectionHospitalisationRatio: IHR }));
    expect(same.results.options[1].healthcare).toEqual(common.results.options[1].healthcare);
  });

  it('peaks later than infections and responds to measures', () => {
    const { results } = run(threeBand({ infectionHospitalisationRatio: IHR, icuShareOfAdmissions: ICU_SHARE, capacity: CAPACITY }));
    const [none, halved] = results.options.map((o) => o.healthcare!);
    expect(none.icu.peakDay).toBeGreaterThan(results.options[0].peakDay);
    expect(halved.icu.peakOccupancy).toBeLessThan(none.icu.peakOccupancy);
    expect(none.icu.daysOverCapacity).toBeGreaterThan(0);
  });
});

describe('capacity counts', () => {
  it('count days and patient-days above usual and surge capacity', () => {
    const occupancy = Float64Array.from([0, 5, 12, 15, 9, 11, 3]);
    expect(bedDemand(occupancy, 10, 14)).toEqual({
      capacityBeds: 10,
      surgeCapacityBeds: 14,
      peakOccupancy: 15,
      peakDay: 3,
      daysOverCapacity: 3,
      patientDaysOverCapacity: 2 + 5 + 1,
      firstDayOverCapacity: 2,
      daysOverSurgeCapacity: 1,
      patientDaysOverSurgeCapacity: 1,
    });
    const noSurge = bedDemand(occupancy, 20, null);
    expect([noSurge.daysOverCapacity, noSurge.firstDayOverCapacity, noSurge.daysOverSurgeCapacity]).toEqual([0, null, null]);
  });

  it('date a peak held over several days by its first day, and give an empty series a peak of 0 on day 0', () => {
    const plateau = bedDemand(Float64Array.from([1, 4, 7, 7, 7, 2]), 10, null);
    expect([plateau.peakOccupancy, plateau.peakDay]).toEqual([7, 2]);
    const empty = bedDemand(new Float64Array(0), 10, 12);
    expect([empty.peakOccupancy, empty.peakDay, empty.daysOverCapacity, empty.daysOverSurgeCapacity]).toEqual([0, 0, 0, 0]);
  });

  it('agree with the daily series of a run', () => {
    const { results } = run(threeBand({ infectionHospitalisationRatio: IHR, icuShareOfAdmissions: ICU_SHARE, capacity: CAPACITY }));
    const h = results.options[0].healthcare!;
    const icu = Array.from(h.series.icuOccupancy);
    expect(h.icu.peakOccupancy).toBe(Math.max(...icu));
    expect(icu[h.icu.peakDay]).toBe(h.icu.peakOccupancy);
    expect(h.icu.daysOverCapacity).toBe(icu.filter((x) => x > 30).length);
    expect(h.icu.patientDaysOverCapacity).toBeCloseTo(sum(icu.map((x) => Math.max(0, x - 30))), 8);
    expect(h.icu.daysOverSurgeCapacity).toBe(icu.filter((x) => x > 45).length);
    expect(h.ward.surgeCapacityBeds).toBeNull();
  });
});

describe('the healthcare section', () => {
  it('is optional: without it there are no hospital results', () => {
    const { results } = run(threeBand(undefined));
    expect(results.options.every((o) => o.healthcare === null)).toBe(true);
  });

  it('names the field and the rule when a list has the wrong length or surge is below capacity', () => {
    const v = validateScenario(
      threeBand({ infectionHospitalisationRatio: [0.01, 0.02], wardStayByBand: [{ meanDays: 5 }], capacity: { wardBeds: 100, icuBeds: 20, icuSurgeBeds: 10 } }),
    );
    expect(v.ok).toBe(false);
    const lines = v.ok ? [] : v.problems.map(formatProblem);
    expect(lines).toContain('healthcare.infectionHospitalisationRatio must have one entry per age band (3), got 2 entries');
    expect(lines).toContain('healthcare.wardStayByBand must have one entry per age band (3), got 1 entries');
    expect(lines.some((l) => l.startsWith('healthcare.capacity.icuSurgeBeds must be at least icuBeds (20)'))).toBe(true);
  });

  it('rejects ratios outside 0-1 and missing capacities', () => {
    const v = validateScenario(threeBand({ infectionHospitalisationRatio: [0.01, 1.5, 0.1] } as HealthcareInput));
    const lines = v.ok ? [] : v.problems.map(formatProblem);
    expect(lines.some((l) => l.startsWith('healthcare.infectionHospitalisationRatio[1] must be a fraction between 0 and 1'))).toBe(true);
    expect(lines.some((l) => l.startsWith('healthcare.capacity is required'))).toBe(true);
  });
});
