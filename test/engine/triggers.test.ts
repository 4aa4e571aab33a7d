/**
 * Measures switched by triggers, against an independent implementation written here from the
 * model equations (DESIGN.md section 2) and the rule (src/engine/triggers.ts doc comment):
 * - the SEIR system with Erlang stages has its own right-hand side (test/helpers/seirByHand.ts,
 *   contacts under several phases in test/helpers/byHand.ts), solved day by day with the `odex`
 *   library (a Dormand-Prince 5(4) code independent of the engine's integrator; Hairer, Norsett &
 *   Wanner 1993, Solving ODEs I), restarted at every whole day;
 * - the daily infections, the hospital convolutions and the trigger rule are coded again below. Only beta and the hospital kernels (already tested in
 *   healthcare-kernels.test.ts) are taken from the engine.
 */
import { Solver } from 'odex';
import { describe, expect, it } from 'vitest';
import { prepareScenario, type PreparedScenario } from '../../src/engine/prepare.ts';
import type { OptionResults } from '../../src/engine/results.ts';
import { runScenario } from '../../src/engine/run.ts';
import type { PolicyOption, Scenario, ScenarioInput, TriggerQuantity } from '../../src/engine/scenario.ts';
import { validateScenario } from '../../src/engine/validation.ts';
import { demoScenario } from '../helpers/demo.ts';
import { seirByHand } from '../helpers/seirByHand.ts';
import { valid } from '../helpers/scenarios.ts';

/** One band, 1e6 people, R0 2.5, latent 3 d, infectious 5 d, with a hospital section. */
function oneBandWithHospital(horizonDays = 300): ScenarioInput {
  return {
    format: 'mixwise-scenario',
    version: 1,
    title: 'one band with beds',
    ageBands: [{ label: 'all', lowerAgeYears: 0 }],
    populationPersons: [1e6],
    settings: [{ name: 'all', contactsPerDay: [[10]] }],
    disease: { transmission: { kind: 'r0', r0: 2.5 }, latentPeriodDays: 3, infectiousPeriodDays: 5, latentStages: 2, infectiousStages: 2 },
    severity: { infectionFatalityRatio: [0.005], source: 'test value' },
    initialState: { infectedPersons: [20] },
    horizonDays,
    options: [{ name: 'none', phases: [] }],
    healthcare: { infectionHospitalisationRatio: [0.02], icuShareOfAdmissions: [0.2], capacity: { wardBeds: 1000, icuBeds: 100 } },
  };
}

// ---------------------------------------------------------------- independent reference model

interface ReferenceRun {
  attackRateByBand: number[];
  /** Per triggered phase (in phase order): the days the measures came into force and lifted. */
  onDays: number[][];
  offDays: number[][];
}

/** The reference: odex day by day, the rule as written in the engine's doc comment. */
function referenceRun(p: PreparedScenario, option: PolicyOption): ReferenceRun {
  const s = p.scenario;
  const n = s.ageBands.length;
  const H = s.horizonDays;
  const N = s.populationPersons;
  const totalN = N.reduce((a, b) => a + b, 0);
  const seir = seirByHand(s);
  let f = seir.rhs(seir.forceOfInfection(p.beta, []));
  const cumulativeOf = (y: readonly number[]) => Array.from({ length: n }, (_, i) => seir.band(y, i).cumulative);

  // Hospital demand, convolutions written out (demand.ts formulas), one delay group assumed.
  const hc = p.healthcare;
  const dailyInfections: number[][] = [];
  const admissionsByDay: number[] = [];
  const wardByDay: number[] = [];
  const icuByDay: number[] = [];
  const wardOnlyAdm: number[] = [];
  const icuAdm: number[] = [];
  const completeDay = (a: number): void => {
    if (hc === null) return;
    const g = hc.groups[0];
    expect(hc.groups.length).toBe(1);
    let wo = 0;
    let ic = 0;
    for (let b = 0; b <= a; b++) {
      const w = a - b < g.admission.length ? g.admission[a - b] : 0;
      for (let i = 0; i < n; i++) {
        wo += dailyInfections[b][i] * hc.wardOnlyRatio[i] * w;
        ic += dailyInfections[b][i] * hc.icuRatio[i] * w;
      }
    }
    wardOnlyAdm.push(wo);
    icuAdm.push(ic);
    admissionsByDay.push(wo + ic);
    let ward = 0;
    let icu = 0;
    for (let b = 0; b <= a; b++) {
      const k = a - b;
      ward += wardOnlyAdm[b] * (g.wardBedDays[k] ?? 0) + icuAdm[b] * (g.icuPatientWardBedDays[k] ?? 0);
      icu += icuAdm[b] * (g.icuBedDays[k] ?? 0);
    }
    wardByDay.push(ward);
    icuByDay.push(icu);
  };

  const triggered = option.phases.map((ph, k) => ({ ph, k })).filter(({ ph }) => ph.trigger !== undefined);
  const on = triggered.map(() => false);
  const since = triggered.map(() => 0);
  const due = triggered.map((): [number, boolean] | null => null);
  const onDays = triggered.map((): number[] => []);
  const offDays = triggered.map((): number[] => []);
  let y = seir.initialState();
  let cumulativeBefore = new Array<number>(n).fill(0);
  for (let d = 0; d < H; d++) {
    if (d > 0) {
      const x = Array.from({ length: n }, (_, i) => Math.max(0, seir.band(y, i).cumulative - cumulativeBefore[i]) + (d - 1 === 0 ? s.initialState.infectedPersons[i] : 0));
      dailyInfections.push(x);
      completeDay(d - 1);
      cumulativeBefore = cumulativeOf(y);
    }
    const quantity = (q: TriggerQuantity): number => {
      if (q === 'infectiousPer100k') {
        let inf = 0;
        for (let i = 0; i < n; i++) inf += seir.band(y, i).infectious;
        return (inf / totalN) * 1e5;
      }
      if (d === 0) return 0;
      if (q === 'dailyInfectionsPer100k') return (dailyInfections[d - 1].reduce((a, b) => a + b, 0) / totalN) * 1e5;
      if (q === 'dailyAdmissions') return admissionsByDay[d - 1];
      if (q === 'wardOccupancy') return wardByDay[d - 1];
      return icuByDay[d - 1];
    };
    triggered.forEach(({ ph }, t) => {
      const before = on[t];
      const pending = due[t];
      if (pending !== null && pending[0] === d) {
        on[t] = pending[1];
        if (on[t]) since[t] = d;
        due[t] = null;
      }
      const trig = ph.trigger!;
      if (d >= ph.fromDay && d < ph.toDay) {
        if (due[t] === null) {
          const v = quantity(trig.quantity);
          let to: boolean | null = null;
          if (!on[t] && v > trig.onAbove) to = true;
          if (on[t] && d - since[t] >= trig.minimumDaysOn && v < trig.offBelow) to = false;
          if (to !== null && trig.lagDays === 0) {
            on[t] = to;
            if (to) since[t] = d;
          } else if (to !== null) {
            due[t] = [d + trig.lagDays, to];
          }
        }
      } else {
        on[t] = false;
        due[t] = null;
      }
      if (on[t] && !before) onDays[t].push(d);
      if (!on[t] && before) offDays[t].push(d);
    });
    const fixed = option.phases.filter((ph) => ph.trigger === undefined && d >= ph.fromDay && d < ph.toDay);
    f = seir.rhs(seir.forceOfInfection(p.beta, [...fixed, ...triggered.filter((_, t) => on[t]).map(({ ph }) => ph)]));
    const solver = new Solver(seir.size);
    solver.absoluteTolerance = 1e-9;
    solver.relativeTolerance = 1e-11;
    y = solver.solve(f, d, y, d + 1).y;
  }
  triggered.forEach((_, t) => {
    if (on[t]) offDays[t].push(H);
  });
  const X = cumulativeOf(y);
  return { attackRateByBand: X.map((x, i) => (x + s.initialState.infectedPersons[i]) / N[i]), onDays, offDays };
}

function engineSwitchDays(o: OptionResults): { onDays: number[][]; offDays: number[][] } {
  return {
    onDays: o.triggers.map((t) => t.periods.map((p) => p.fromDay)),
    offDays: o.triggers.map((t) => t.periods.map((p) => p.toDay)),
  };
}

function withOption(s: Scenario, option: ScenarioInput['options'][number]): Scenario {
  return valid({ ...(s as unknown as ScenarioInput), options: [option], referenceOption: undefined, vaccinationCampaigns: [] });
}

function compareWithReference(s: Scenario): OptionResults {
  const o = runScenario(s).options[0];
  const ref = referenceRun(prepareScenario(s), s.options[0]);
  expect(engineSwitchDays(o)).toEqual({ onDays: ref.onDays, offDays: ref.offDays });
  o.attackRateByBand.forEach((a, i) => expect(Math.abs(a - ref.attackRateByBand[i])).toBeLessThan(1e-6));
  return o;
}

describe('triggered measures against an independent implementation (odex, rule coded again)', () => {
  const oneBandCases: [TriggerQuantity, number, number][] = [
    ['infectiousPer100k', 800, 300],
    ['dailyInfectionsPer100k', 300, 100],
    ['dailyAdmissions', 50, 20],
    ['wardOccupancy', 400, 150],
    ['icuOccupancy', 40, 15],
  ];
  for (const [quantity, onAbove, offBelow] of oneBandCases) {
    it(`one band, ${quantity}: same switch days, attack rate within 1e-6`, () => {
      const s = valid(oneBandWithHospital());
      const t = withOption(s, {
        name: 'when',
        phases: [{ fromDay: 0, toDay: 300, trigger: { quantity, onAbove, offBelow, minimumDaysOn: 14, lagDays: 3 }, settingMultipliers: { all: 0.35 } }],
      });
      const o = compareWithReference(t);
      expect(o.triggers[0].switchesOn).toBeGreaterThanOrEqual(1);
    });
  }

  for (const quantity of ['infectiousPer100k', 'dailyInfectionsPer100k', 'dailyAdmissions', 'wardOccupancy', 'icuOccupancy'] as const) {
    it(`sixteen bands (demo), ${quantity}, over a fixed phase: same switch days, attack rates within 1e-6`, () => {
      const demo = demoScenario();
      const unmitigated = runScenario(withOption(demo, { name: 'none', phases: [] })).options[0];
      const peak = {
        infectiousPer100k: (unmitigated.peakPrevalence * 1e5) / 2,
        dailyInfectionsPer100k: (Math.max(...sumByDay(unmitigated.series.incidence, 16)) / total(demo.populationPersons)) * 1e5,
        dailyAdmissions: Math.max(...unmitigated.healthcare!.series.admissions),
        wardOccupancy: unmitigated.healthcare!.ward.peakOccupancy,
        icuOccupancy: unmitigated.healthcare!.icu.peakOccupancy,
      }[quantity];
      const t = withOption(demo, {
        name: 'when',
        phases: [
          { fromDay: 10, toDay: 40, settingMultipliers: { other: 0.8 }, ageFactors: [{ setting: 'other', bands: [12, 13], factor: 0.5 }] },
          {
            fromDay: 0,
            toDay: 365,
            trigger: { quantity, onAbove: 0.3 * peak, offBelow: 0.1 * peak, minimumDaysOn: 21, lagDays: 2 },
            settingMultipliers: { school: 0, work: 0.5 },
            ageFactors: [{ setting: 'other', bands: [13, 14, 15], factor: 0.2 }],
            caseIsolation: 0.2,
          },
        ],
      });
      const o = compareWithReference(t);
      expect(o.triggers[0].switchesOn).toBeGreaterThanOrEqual(1);
    });
  }
});

function sumByDay(series: Float64Array, n: number): number[] {
  return Array.from({ length: series.length / n }, (_, d) => total(Array.from(series.subarray(d * n, (d + 1) * n))));
}

function total(xs: readonly number[]): number {
  return xs.reduce((a, b) => a + b, 0);
}

describe('properties of the trigger rule', () => {
  const base = valid(oneBandWithHospital(400));
  const trig = (extra: Partial<{ onAbove: number; offBelow: number; minimumDaysOn: number; lagDays: number }>, quantity: TriggerQuantity = 'icuOccupancy') =>
    withOption(base, {
      name: 'when',
      phases: [{ fromDay: 0, toDay: 400, trigger: { quantity, onAbove: 30, offBelow: 10, minimumDaysOn: 7, lagDays: 0, ...extra }, settingMultipliers: { all: 0.3 } }],
    });

  it('with lag 0, the quantity read on a decision day never exceeds onAbove while measures are off', () => {
    for (const quantity of ['icuOccupancy', 'dailyInfectionsPer100k', 'dailyAdmissions'] as const) {
      const onAbove = quantity === 'dailyInfectionsPer100k' ? 150 : quantity === 'dailyAdmissions' ? 40 : 30;
      const o = runScenario(trig({ onAbove, offBelow: onAbove / 3 }, quantity)).options[0];
      const periods = o.triggers[0].periods;
      const inForce = (d: number) => periods.some((p) => d >= p.fromDay && d < p.toDay);
      const read = readerOf(o, base, quantity);
      for (let d = 1; d < 399; d++) {
        if (!inForce(d)) expect(read(d)).toBeLessThanOrEqual(onAbove);
      }
      expect(o.triggers[0].switchesOn).toBeGreaterThanOrEqual(1);
    }
  });

  it('a threshold above the unmitigated peak never fires and gives exactly the unmitigated result', () => {
    const none = runScenario(withOption(base, { name: 'none', phases: [] })).options[0];
    const o = runScenario(trig({ onAbove: 2 * none.healthcare!.icu.peakOccupancy, offBelow: 1 })).options[0];
    expect(o.triggers[0].switchesOn).toBe(0);
    expect(o.triggers[0].firstOnDay).toBeNull();
    expect(o.daysUnderMeasures).toBe(0);
    expect(o.infections).toBe(none.infections);
    expect(o.deaths).toBe(none.deaths);
    expect(Array.from(o.series.incidence)).toEqual(Array.from(none.series.incidence));
  });

  it('minimumDaysOn is always respected', () => {
    for (const minimumDaysOn of [0, 5, 30]) {
      const o = runScenario(trig({ minimumDaysOn, lagDays: 2, onAbove: 20, offBelow: 15 })).options[0];
      const periods = o.triggers[0].periods;
      expect(periods.length).toBeGreaterThanOrEqual(1);
      for (const p of periods) if (p.toDay < 400) expect(p.toDay - p.fromDay).toBeGreaterThanOrEqual(minimumDaysOn + 2);
    }
  });

  it('outside [fromDay, toDay) the measures are not in force', () => {
    const s = withOption(base, {
      name: 'when',
      phases: [{ fromDay: 50, toDay: 120, trigger: { quantity: 'infectiousPer100k', onAbove: 1, offBelow: 0 }, settingMultipliers: { all: 0.3 } }],
    });
    const o = runScenario(s).options[0];
    expect(o.triggers[0].periods).toEqual([{ fromDay: 50, toDay: 120 }]);
    expect(o.triggers[0].daysInForce).toBe(70);
    expect(o.daysUnderMeasures).toBe(70);
    expect(o.finalSize).toBeNull();
  });

  it('triggers and the reported hospital series agree: an ICU trigger fires the day after occupancy passes onAbove', () => {
    const o = runScenario(trig({ onAbove: 30, offBelow: 10 })).options[0];
    const first = o.triggers[0].firstOnDay!;
    const icu = o.healthcare!.series.icuOccupancy;
    expect(icu[first - 1]).toBeGreaterThan(30);
    expect(icu[first - 2]).toBeLessThanOrEqual(30);
  });
});

/** What a trigger reads on day d, from the reported series (rule in src/engine/triggers.ts). */
function readerOf(o: OptionResults, s: Scenario, quantity: TriggerQuantity): (d: number) => number {
  const pop = total(s.populationPersons);
  return (d) => {
    if (quantity === 'icuOccupancy') return o.healthcare!.series.icuOccupancy[d - 1];
    if (quantity === 'dailyAdmissions') return o.healthcare!.series.admissions[d - 1];
    return (total(Array.from(o.series.incidence.subarray((d - 1) * s.ageBands.length, d * s.ageBands.length))) / pop) * 1e5;
  };
}

describe('trigger validation', () => {
  const bad = (trigger: Record<string, unknown>, healthcare = true): string[] => {
    const input = oneBandWithHospital();
    if (!healthcare) delete input.healthcare;
    input.options = [{ name: 'when', phases: [{ fromDay: 0, toDay: 100, trigger: trigger as never, settingMultipliers: { all: 0.5 } }] }];
    const r = validateScenario(input);
    return r.ok ? [] : r.problems.map((p) => `${p.path} ${p.rule}`);
  };
  it('refuses offBelow above onAbove, negative lags, unknown quantities, hospital quantities without a hospital section', () => {
    expect(bad({ quantity: 'icuOccupancy', onAbove: 10, offBelow: 20 })).toEqual(['options[0].phases[0].trigger.offBelow must be at most onAbove (10)']);
    expect(bad({ quantity: 'icuOccupancy', onAbove: 10, offBelow: 5, lagDays: -1 })[0]).toMatch(/^options\[0\]\.phases\[0\]\.trigger\.lagDays must be >= 0/);
    expect(bad({ quantity: 'bedsInUse', onAbove: 10, offBelow: 5 })[0]).toMatch(/^options\[0\]\.phases\[0\]\.trigger\.quantity must be "infectiousPer100k" or "dailyInfectionsPer100k" or/);
    expect(bad({ quantity: 'wardOccupancy', onAbove: 10, offBelow: 5 }, false)).toEqual([
      'options[0].phases[0].trigger.quantity needs a healthcare section (hospital quantities come from the hospital model)',
    ]);
    expect(bad({ quantity: 'infectiousPer100k', onAbove: 10, offBelow: 5 }, false)).toEqual([]);
  });
  it('lets a triggered phase overlap a fixed one, but not two fixed phases', () => {
    const input = oneBandWithHospital();
    input.options = [
      {
        name: 'both',
        phases: [
          { fromDay: 0, toDay: 100, settingMultipliers: { all: 0.8 } },
          { fromDay: 0, toDay: 200, trigger: { quantity: 'icuOccupancy', onAbove: 10, offBelow: 5 }, settingMultipliers: { all: 0.5 } },
          { fromDay: 50, toDay: 150, settingMultipliers: { all: 0.9 } },
        ],
      },
    ];
    const r = validateScenario(input);
    expect(r.ok ? [] : r.problems.map((p) => p.path)).toEqual(['options[0].phases[2].fromDay']);
  });
});
