/**
 * A problem found in a user's input: the JSON path, the rule broken and the offending value,
 * printed as one line (`populationPersons[3] must be >= 0, got -12`). Shared by every check in
 * the engine (scenario structure, cross-field rules, healthcare, vaccination, calibration).
 */
export interface Problem {
  /** JSON path in the file, e.g. `settings[1].contactsPerDay[2][0]`. */
  path: string;
  /** The rule broken, e.g. `must be >= 0`. */
  rule: string;
  /** The offending value, as JSON text (absent when the field is missing). */
  value?: string;
}

/** Renders a path like ['settings', 1, 'contactsPerDay', 2, 0] as `settings[1].contactsPerDay[2][0]`. */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const key of path) {
    if (typeof key === 'number') out += `[${key}]`;
    else out += out === '' ? String(key) : `.${String(key)}`;
  }
  return out === '' ? '(file)' : out;
}

/** Control characters from the file (in names quoted in a rule or value) as \uXXXX escapes. */
function escapeControls(text: string): string {
  return text.replace(/[\u0000-\u001f\u007f]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
}

/** One line per problem: `path rule, got value`; never a raw control character. */
export function formatProblem(p: Problem): string {
  return escapeControls(p.value === undefined ? `${p.path} ${p.rule}` : `${p.path} ${p.rule}, got ${p.value}`);
}
