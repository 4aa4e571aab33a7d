/** The bundled demo scenario, validated. */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { Scenario } from '../../src/engine/scenario.ts';
import { parseScenarioText } from '../../src/engine/validation.ts';

export const DEMO_PATH = fileURLToPath(new URL('../../resources/demo-scenario.json', import.meta.url));

export function demoScenario(): Scenario {
  const r = parseScenarioText(readFileSync(DEMO_PATH, 'utf8'));
  if (!r.ok) throw new Error(`demo scenario invalid: ${JSON.stringify(r.problems)}`);
  return r.scenario;
}
