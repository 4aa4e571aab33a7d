/** The bundled demo scenario (resources/demo-scenario.json), validated like any opened file. */
import demoText from '../../../resources/demo-scenario.json?raw';
import { parseScenarioText, formatProblem, type Scenario } from '../../engine/index.ts';

export const DEMO_FILE_NAME = 'demo-scenario.json';

export function demoScenario(): Scenario {
  const result = parseScenarioText(demoText);
  if (!result.ok) throw new Error(`The bundled demo scenario is not valid: ${result.problems.map(formatProblem).join('; ')}`);
  return result.scenario;
}
