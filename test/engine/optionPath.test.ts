/**
 * The path a refusal names for an option (runRefusal.ts `optionPath`): looked up by an index kept
 * per options list, which must give the same answer as a search of the list, also after the list
 * changed in place.
 */
import { describe, expect, it } from 'vitest';
import { optionPath } from '../../src/engine/runRefusal.ts';

const search = (options: { name: string }[], name: string): string => {
  const k = options.findIndex((o) => o.name === name);
  return k < 0 ? `option ${JSON.stringify(name)}` : `options[${k}]`;
};

describe('optionPath', () => {
  it('names options[k] for every option of a long list, the first of a repeated name, and the name when absent', () => {
    const options = Array.from({ length: 500 }, (_, k) => ({ name: `option ${k % 450}` }));
    for (const o of options) expect(optionPath(options, o.name)).toBe(search(options, o.name));
    expect(optionPath(options, 'option 3')).toBe('options[3]');
    expect(optionPath(options, 'not there')).toBe('option "not there"');
  });

  it('follows a list changed in place after it was indexed', () => {
    const options = [{ name: 'a' }, { name: 'b' }, { name: 'c' }];
    expect(optionPath(options, 'c')).toBe('options[2]');
    options.splice(0, 1);
    expect(optionPath(options, 'c')).toBe('options[1]');
    options.push({ name: 'd' });
    expect(optionPath(options, 'd')).toBe('options[2]');
    options[0].name = 'renamed';
    expect(optionPath(options, 'b')).toBe('option "b"');
    expect(optionPath(options, 'renamed')).toBe('options[0]');
  });
});
