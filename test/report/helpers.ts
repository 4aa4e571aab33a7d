/** Shared helpers for the report tests: the demo scenario and its results, computed once. */
import type { ScenarioResults } from '../../src/engine/results.ts';
import { runScenario } from '../../src/engine/run.ts';
import type { Scenario } from '../../src/engine/scenario.ts';
import { demoScenario } from '../helpers/demo.ts';

let cached: { scenario: Scenario; results: ScenarioResults } | null = null;

export function demo(): { scenario: Scenario; results: ScenarioResults } {
  if (cached === null) {
    const scenario = demoScenario();
    cached = { scenario, results: runScenario(scenario) };
  }
  return cached;
}

/** The demo with `count` options: the demo's four, then school closures of different lengths. */
export function manyOptionsScenario(count: number): Scenario {
  const base = demoScenario();
  const options = [...base.options];
  for (let k = options.length; k < count; k++) {
    options.push({ name: `Schools closed ${k} weeks`, description: '', phases: [{ fromDay: 14, toDay: 14 + 7 * k, settingMultipliers: { school: 0 }, ageFactors: [], caseIsolation: 0 }] });
  }
  return { ...base, options: options.slice(0, count) };
}
