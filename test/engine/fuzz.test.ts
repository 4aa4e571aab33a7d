/**
 * Seeded fuzzing of the scenario reader and the engine: 1,200 mutants (wrong types, non-finite and
 * extreme numbers, missing and extra keys, wrong lengths, deep nesting, odd names, broken JSON,
 * other encodings), half of the demo file and half of the demo with every newer section filled in
 * (start date, life table, by-band delays, triggered measures, a second vaccination order, an
 * uncertainty section with each kind of distribution). Accepted mutants with an uncertainty
 * section also run two draws. Each must end in a refusal whose every line names a JSON
 * path (or the file) without raw control characters, or in a result whose numbers are finite and
 * in range, within a budget of integrator steps. No wall-clock assertion: the step budget and the
 * time limit below (a guard against a hang, far above the test's cost on an idle machine) catch
 * a hang.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { integratorStepsSoFar } from '../../src/engine/integrator.ts';
import { evaluateDraw, formatProblem, parseScenarioText, prepareDraws, runScenario, withDrawSettings, type OptionResults, type Scenario } from '../../src/engine/index.ts';
import { catalogueReader } from '../../src/report/drawOutcomes.ts';
import { decodeUtf8Text } from '../../src/shared/textFile.ts';
import { DEMO_PATH } from '../helpers/demo.ts';
import { seededRandom } from '../helpers/random.ts';
import { enrichedDemo, mutateScenario } from '../helpers/scenarioMutations.ts';

const MUTANTS = 1200;
/** Draws run for an accepted mutant with an uncertainty section. */
const DRAWS = 2;
/** One accepted mutant in RUN_EVERY is run (the rest are only validated, to keep the suite quick). */
const RUN_EVERY = 2;
/** Days a run is cut to: the checks are about finiteness and ranges, not about long horizons. */
const RUN_DAYS = 20;
/** Integrator steps one run may take: the demo's options over 20 days need a few thousand. */
const STEP_BUDGET = 200_000;

const CONTROL = /[\u0000-\u001f\u007f]/;
const PATH = /^(\(file\)|[A-Za-z_$[])/;

/** Every number in the results (typed arrays included), with where it is. */
function numbersIn(value: unknown, where: string, out: [string, number][]): void {
  const stack: [unknown, string][] = [[value, where]];
  while (stack.length > 0) {
    const [node, at] = stack.pop() as [unknown, string];
    if (typeof node === 'number') out.push([at, node]);
    else if (ArrayBuffer.isView(node)) (node as Float64Array).forEach((x, k) => out.push([`${at}[${k}]`, x]));
    else if (node !== null && typeof node === 'object') for (const [k, v] of Object.entries(node)) stack.push([v, `${at}.${k}`]);
  }
}

function checkOption(o: OptionResults): string[] {
  const faults: string[] = [];
  const numbers: [string, number][] = [];
  numbersIn(o, o.name, numbers);
  for (const [at, x] of numbers) if (!Number.isFinite(x)) faults.push(`${at} is ${x}`);
  for (const x of [o.attackRate, ...o.attackRateByBand, o.peakPrevalence]) if (!(x >= 0 && x <= 1)) faults.push(`${o.name}: fraction ${x} out of [0, 1]`);
  for (const x of [o.infections, o.deaths, ...o.deathsByBand, ...o.infectionsByBand]) if (!(x >= 0)) faults.push(`${o.name}: count ${x} below 0`);
  return faults;
}

export interface FuzzTally {
  tried: number;
  accepted: number;
  refused: number;
  run: number;
  draws: number;
  faults: string[];
}

function tryMutant(label: string, bytes: Uint8Array, run: boolean, tally: FuzzTally): void {
  tally.tried++;
  const decoded = decodeUtf8Text(bytes);
  if (!decoded.ok) {
    tally.refused++;
    if (CONTROL.test(decoded.rule)) tally.faults.push(`${label}: encoding message has a control character`);
    return;
  }
  const checked = parseScenarioText(decoded.text);
  if (!checked.ok) {
    tally.refused++;
    if (checked.problems.length === 0) tally.faults.push(`${label}: refused without a problem`);
    for (const p of checked.problems) {
      const line = formatProblem(p);
      if (!PATH.test(p.path) || p.rule === '' || CONTROL.test(line)) tally.faults.push(`${label}: bad problem line ${JSON.stringify(line)}`);
    }
    return;
  }
  tally.accepted++;
  if (!run) return;
  tally.run++;
  const scenario: Scenario = { ...checked.scenario, horizonDays: Math.min(checked.scenario.horizonDays, RUN_DAYS) };
  const before = integratorStepsSoFar();
  const results = runScenario(scenario);
  const steps = integratorStepsSoFar() - before;
  if (steps > STEP_BUDGET) tally.faults.push(`${label}: ${steps} integrator steps`);
  if (!Number.isFinite(results.r0) || !Number.isFinite(results.beta)) tally.faults.push(`${label}: r0 ${results.r0}, beta ${results.beta}`);
  for (const o of results.options) tally.faults.push(...checkOption(o).map((f) => `${label}: ${f}`));
  if (scenario.uncertainty === undefined) return;
  // A draw may break a rule (refused with that rule); a crash ("the run failed") or an infinite outcome is a fault.
  const draws = prepareDraws(withDrawSettings(scenario, { draws: DRAWS }));
  for (let d = 0; d < DRAWS; d++) {
    const r = evaluateDraw(draws, d, catalogueReader);
    tally.draws++;
    if (!r.ok && /^the run failed/.test(r.reason)) tally.faults.push(`${label}: draw ${d}: ${r.reason}`);
    if (r.ok) for (const v of r.outcomes) for (const x of v) if (x === Infinity || x === -Infinity) tally.faults.push(`${label}: draw ${d}: an outcome is ${x}`);
  }
}

describe('fuzzing the demo scenario', () => {
  it(`ends each of ${MUTANTS} mutants in a clear refusal or a finite, in-range result`, () => {
    const demo = JSON.parse(readFileSync(DEMO_PATH, 'utf8')) as Record<string, unknown>;
    const bases = [demo, enrichedDemo(demo)];
    const random = seededRandom(20261202);
    const tally: FuzzTally = { tried: 0, accepted: 0, refused: 0, run: 0, draws: 0, faults: [] };
    for (let k = 0; k < MUTANTS; k++) {
      const mutant = mutateScenario(random, bases[k % 2]);
      try {
        tryMutant(mutant.label, mutant.bytes, tally.accepted % RUN_EVERY === 0, tally);
      } catch (err) {
        tally.faults.push(`${mutant.label}: threw ${(err as Error).message.split('\n')[0]}`);
      }
    }
    expect(tally.faults).toEqual([]);
    expect(tally.tried).toBe(MUTANTS);
    // The mutants reach both ends: many refusals, and enough accepted files to run some.
    expect(tally.refused).toBeGreaterThan(MUTANTS / 2);
    expect(tally.run).toBeGreaterThan(20);
    expect(tally.draws).toBeGreaterThan(20);
  }, 600_000);
});
