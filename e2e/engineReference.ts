/**
 * What the engine itself says for a scenario, to compare with the board: the CLI's JSON
 * (`mixwise run --format json`) when the CLI is there, else `runScenario` in this process.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { parseScenarioText, runScenario, type Scenario } from '../src/engine/index.ts';

export const DEMO_PATH = 'resources/demo-scenario.json';

export interface ReferenceOption {
  name: string;
  rStart: number;
  attackRate: number;
}

export function demoScenario(): Scenario {
  const result = parseScenarioText(readFileSync(DEMO_PATH, 'utf8'));
  if (!result.ok) throw new Error('The demo scenario is not valid');
  return result.scenario;
}

/** Options of the demo as the CLI reports them (`source` says which path was used). */
export function cliDemoResults(): { source: string; options: ReferenceOption[] } {
  if (existsSync('bin/mixwise.mjs')) {
    const json = execFileSync(process.execPath, ['bin/mixwise.mjs', 'run', DEMO_PATH, '--format', 'json'], { encoding: 'utf8' });
    const parsed = JSON.parse(json) as { options: ReferenceOption[] };
    return { source: 'mixwise run --format json', options: parsed.options };
  }
  return { source: 'runScenario (CLI not built)', options: runScenario(demoScenario()).options };
}

/** R at start of option `index` after an edit, straight from the engine. */
export function engineRStart(scenario: Scenario, index: number): number {
  return runScenario(scenario).options[index].rStart;
}
