import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readScenarioFile, saveScenarioText, scenarioTextProblems } from '../../src/main/scenarioFiles.ts';
import { loadRecent, MAX_RECENT, storeRecent, withRecent, withoutRecent } from '../../src/main/recentFiles.ts';
import { closeDecision } from '../../src/main/unsavedChanges.ts';

let dir: string;
beforeEach(async () => {
  dir = await mkdtemp(join(tmpdir(), 'mixwise-main-'));
});
afterEach(async () => {
  await rm(dir, { recursive: true, force: true });
});

const demoText = () => readFile('resources/demo-scenario.json', 'utf8');

describe('saveScenarioText', () => {
  it('writes a valid scenario and reads it back', async () => {
    const target = join(dir, 'demo.json');
    await saveScenarioText(target, await demoText());
    const back = await readScenarioFile(target);
    expect(back.name).toBe('demo.json');
    expect(back.text).toBe(await demoText());
  });

  it('never replaces a good file with an invalid scenario, and says why', async () => {
    const target = join(dir, 'demo.json');
    await writeFile(target, await demoText());
    const bad = JSON.parse(await demoText());
    bad.populationPersons[3] = -12;
    await expect(saveScenarioText(target, JSON.stringify(bad))).rejects.toThrow(/populationPersons\[3\] must be >= 0/);
    expect(await readFile(target, 'utf8')).toBe(await demoText());
    expect(scenarioTextProblems('{ not json')[0]).toMatch(/must be valid JSON/);
  });
});

describe('recent files', () => {
  it('keeps the most recent first, without duplicates, at most MAX_RECENT', () => {
    let list = withRecent([], '/a/x.json');
    list = withRecent(list, '/a/y.json');
    list = withRecent(list, '/a/x.json');
    expect(list.map((r) => r.path)).toEqual(['/a/x.json', '/a/y.json']);
    expect(list[0].name).toBe('x.json');
    for (let k = 0; k < 20; k++) list = withRecent(list, `/b/${k}.json`);
    expect(list).toHaveLength(MAX_RECENT);
    expect(withoutRecent(list, '/b/19.json')).toHaveLength(MAX_RECENT - 1);
  });

  it('stores and loads the list; a damaged store gives an empty list', async () => {
    const store = join(dir, 'recent.json');
    await storeRecent(store, [{ name: 'x.json', path: '/a/x.json' }]);
    expect(await loadRecent(store)).toEqual([{ name: 'x.json', path: '/a/x.json' }]);
    await writeFile(store, '{"broken"');
    expect(await loadRecent(store)).toEqual([]);
    await writeFile(store, '[{"name": 3}]');
    expect(await loadRecent(store)).toEqual([]);
  });
});

describe('closeDecision', () => {
  it('closes at once when nothing is unsaved, otherwise asks', () => {
    let asked = 0;
    expect(closeDecision(false, () => (asked++, 0))).toBe('close');
    expect(asked).toBe(0);
    expect(closeDecision(true, () => 0)).toBe('stay');
    expect(closeDecision(true, () => 1)).toBe('close');
  });
});
