/**
 * Reading JSON text (RFC 8259) for the scenario file, with problems a person can act on:
 *
 * - a syntax error is one line with its line and column and the cause in plain words
 *   (a trailing comma, a missing comma, text cut short), never the raw text of the file;
 * - a number too large for double precision (e.g. 1e999999, which JSON.parse turns into
 *   Infinity) is reported at its JSON path as such, not as null;
 * - lists and objects nested deeper than MAX_JSON_DEPTH are refused at their path before
 *   anything recursive touches them (a scenario needs four levels).
 *
 * Every walk here is iterative (explicit stack), so no input exhausts the call stack.
 */
import { formatPath, type Problem } from './problems.ts';

/** Deepest nesting of lists and objects accepted (a scenario file needs 4; generous margin). */
export const MAX_JSON_DEPTH = 64;

export type JsonRead = { ok: true; value: unknown } | { ok: false; problems: Problem[] };

/** A character for a message: printable ASCII as itself, anything else as U+XXXX. */
function shown(ch: string): string {
  const code = ch.codePointAt(0) ?? 0;
  return code >= 0x20 && code < 0x7f ? `'${ch}'` : `U+${code.toString(16).toUpperCase().padStart(4, '0')}`;
}

function lineAndColumn(text: string, offset: number): string {
  let line = 1;
  let start = 0;
  for (let i = 0; i < offset && i < text.length; i++) {
    if (text.charCodeAt(i) === 10) {
      line++;
      start = i + 1;
    }
  }
  return `line ${line}, column ${offset - start + 1}`;
}

const NUMBER = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/y;
const LITERAL = /true|false|null/y;

/**
 * Finds the first syntax error of text that JSON.parse refused: its offset and cause.
 * A small JSON grammar scanner: a stack of open lists/objects and what may come next.
 */
export function locateJsonError(text: string): { offset: number; cause: string } {
  type Expect = 'value' | 'key' | 'colon' | 'commaOrClose' | 'end';
  const stack: string[] = [];
  let expect: Expect = 'value';
  let afterComma = false;
  let i = 0;
  const close = (): Expect => (stack.length === 0 ? 'end' : 'commaOrClose');
  while (true) {
    while (i < text.length && ' \t\n\r'.includes(text[i])) i++;
    if (i >= text.length) {
      if (expect === 'end') return { offset: i, cause: 'no error found' };
      return { offset: i, cause: stack.length > 0 ? `ends before the JSON is complete (missing '${stack[stack.length - 1]}'?)` : 'ends before the JSON is complete' };
    }
    const ch = text[i];
    if (expect === 'end') return { offset: i, cause: `has more text after the end of the JSON, starting with ${shown(ch)}` };
    if (expect === 'colon') {
      if (ch !== ':') return { offset: i, cause: `needs ':' after a field name, found ${shown(ch)}` };
      i++;
      expect = 'value';
      continue;
    }
    if (expect === 'commaOrClose') {
      if (ch === ',') {
        i++;
        afterComma = true;
        expect = stack[stack.length - 1] === '}' ? 'key' : 'value';
      } else if (ch === stack[stack.length - 1]) {
        stack.pop();
        i++;
        expect = close();
      } else return { offset: i, cause: `needs ',' or '${stack[stack.length - 1]}' here, found ${shown(ch)} (a missing comma?)` };
      continue;
    }
    if ((ch === '}' || ch === ']') && ch === stack[stack.length - 1]) {
      if (afterComma) return { offset: i, cause: `has a comma before '${ch}' (remove the trailing comma)` };
      // An empty list or object.
      stack.pop();
      i++;
      expect = close();
      continue;
    }
    afterComma = false;
    if (expect === 'key') {
      if (ch !== '"') return { offset: i, cause: `needs a field name in double quotes, found ${shown(ch)}` };
    }
    if (ch === '"') {
      let j = i + 1;
      while (j < text.length && text[j] !== '"') {
        const code = text.charCodeAt(j);
        if (code < 0x20) return { offset: j, cause: `has a control character (${shown(text[j])}) inside text in quotes (write it as an escape such as \\n)` };
        if (text[j] === '\\') {
          const next = text[j + 1];
          if (next === 'u' ? !/^[0-9a-fA-F]{4}$/.test(text.slice(j + 2, j + 6)) : !'"\\/bfnrt'.includes(next ?? 'x')) {
            return { offset: j, cause: 'has an invalid escape inside text in quotes' };
          }
          j += next === 'u' ? 6 : 2;
        } else j++;
      }
      if (j >= text.length) return { offset: i, cause: 'has text in quotes that is never closed' };
      i = j + 1;
      expect = expect === 'key' ? 'colon' : close();
      continue;
    }
    if (ch === '{' || ch === '[') {
      stack.push(ch === '{' ? '}' : ']');
      i++;
      expect = ch === '{' ? 'key' : 'value';
      // `{` may be followed by `}` at once: handled above as an empty object.
      continue;
    }
    NUMBER.lastIndex = i;
    LITERAL.lastIndex = i;
    const number = NUMBER.exec(text);
    const literal = number === null ? LITERAL.exec(text) : null;
    const token = number ?? literal;
    if (token === null) return { offset: i, cause: `has an unexpected ${shown(ch)} where a value should be` };
    const end = i + token[0].length;
    if (end < text.length && /[0-9A-Za-z.+\-_]/.test(text[end])) {
      return { offset: i, cause: 'has a value that is not a JSON number, true, false or null (numbers have no leading zeros, NaN or Infinity)' };
    }
    i = end;
    expect = close();
  }
}

const NON_FINITE_RULE = 'must be a finite number (the file writes a number beyond the double-precision range, about 1.8e308)';

/**
 * Non-finite numbers and excessive nesting in a parsed JSON value, each at its path
 * (iterative walk; at most `limit` problems).
 */
export function jsonValueProblems(value: unknown, limit = 20): Problem[] {
  const problems: Problem[] = [];
  const stack: { node: unknown; path: PropertyKey[] }[] = [{ node: value, path: [] }];
  while (stack.length > 0 && problems.length < limit) {
    const { node, path } = stack.pop() as { node: unknown; path: PropertyKey[] };
    if (typeof node === 'number' && !Number.isFinite(node)) {
      problems.push({ path: formatPath(path), rule: NON_FINITE_RULE, value: node > 0 ? 'Infinity' : '-Infinity' });
      continue;
    }
    if (node === null || typeof node !== 'object') continue;
    if (path.length >= MAX_JSON_DEPTH) {
      problems.push({ path: `${formatPath(path.slice(0, 3))}...`, rule: `must not nest lists and objects more than ${MAX_JSON_DEPTH} levels deep` });
      break;
    }
    const entries: [PropertyKey, unknown][] = Array.isArray(node) ? node.map((v, k) => [k, v]) : Object.entries(node);
    for (let k = entries.length - 1; k >= 0; k--) {
      const [key, child] = entries[k];
      // Numbers are checked here, lists and objects visited: no path is built for the rest.
      if (typeof child === 'number' && !Number.isFinite(child)) {
        problems.push({ path: formatPath([...path, key]), rule: NON_FINITE_RULE, value: child > 0 ? 'Infinity' : '-Infinity' });
      } else if (child !== null && typeof child === 'object') stack.push({ node: child, path: [...path, key] });
    }
  }
  return problems;
}

/**
 * Parses JSON text: the value, or the syntax problem as one line with line and column.
 * (`jsonValueProblems` then checks the value: validateScenario runs it on every input.)
 */
export function readJsonText(text: string): JsonRead {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  let value: unknown;
  try {
    value = JSON.parse(body);
  } catch {
    const { offset, cause } = locateJsonError(body);
    return { ok: false, problems: [{ path: '(file)', rule: `must be valid JSON; at ${lineAndColumn(body, offset)} it ${cause}` }] };
  }
  return { ok: true, value };
}
