/**
 * The check every edit passes before it enters the document: the engine's validation of the
 * edited scenario, with each problem kept as its field's JSON path (so a panel can tell which
 * control it belongs to) and its message in the app's words (problemWords.ts).
 */
import { validateScenario, type Scenario } from '../../engine/index.ts';
import { problemInWords } from './problemWords.ts';

/** Why an edit was refused: the field's JSON path in the scenario and one line for the user. */
export interface EditProblem {
  path: string;
  message: string;
}

/** The outcome of committing an edit: accepted, or refused (the document unchanged) with its problems. */
export type EditResult = { ok: true } | { ok: false; problems: EditProblem[] };

/** Validates an edited scenario: the validated scenario to store, or the problems. */
export function checkEdit(scenario: Scenario): { ok: true; scenario: Scenario } | { ok: false; problems: EditProblem[] } {
  const check = validateScenario(scenario);
  if (check.ok) return { ok: true, scenario: check.scenario };
  return { ok: false, problems: check.problems.map((p) => ({ path: p.path, message: problemInWords(p, scenario) })) };
}

/** The messages of a refused edit, for a list under the control that made it; none when accepted. */
export function editMessages(result: EditResult): string[] {
  return result.ok ? [] : result.problems.map((p) => p.message);
}
