/**
 * Names every JavaScript object already has (constructor, __proto__, toString, hasOwnProperty ...)
 * either work everywhere a name goes or are refused in one line naming the field. Where a name is
 * only a label (option, reference option, campaign, band, title) it must come through the engine,
 * the CSV files, the HTML report, the command line (with draws) and the app's board and problem
 * lines unchanged; where a name keys a map or picks a form (setting names, multiplier keys,
 * uncertain parameters, contactScale.<setting>, trigger quantities, distribution kinds, field
 * names) it must be refused, never read as a built-in.
 */
import { describe, expect, it } from 'vitest';
import { formatProblem, runScenario, validateScenario, type Problem, type Scenario } from '../../src/engine/index.ts';
import { RESERVED_NAMES } from '../../src/engine/strictInput.ts';
import { buildReportHtml, dailySeriesCsv, optionsTableCsv, type ReportMeta } from '../../src/report/index.ts';
import { boardCell, boardRowsFor } from '../../src/renderer/lib/boardRows.ts';
import { problemInWords } from '../../src/renderer/lib/problemWords.ts';
import { join } from 'node:path';
import { DEMO, ROOT, demoJson, runCli, writeTemp } from '../cli/helpers.ts';

const NAMES = [...RESERVED_NAMES];
const META: ReportMeta = { appVersion: '1.0.0', generatedAt: new Date(2030, 0, 2, 3, 4), fingerprint: '0'.repeat(64), paper: 'A4', orientation: 'portrait' };
/** What a built-in read as a value looks like once printed. */
const BUILT_IN = /native code|\[object |function /;

/** The demo, short, with `name` as every label a user can give. */
function labelledWith(name: string): Record<string, any> {
  const s = demoJson();
  s.horizonDays = 45;
  s.options = s.options.slice(0, 3);
  s.title = name;
  s.ageBands[2].label = name;
  s.options[1].name = name;
  s.options[1].description = name;
  s.referenceOption = name;
  s.vaccinationCampaigns[0].name = name;
  for (const o of s.options) if (o.vaccinationCampaign !== undefined) o.vaccinationCampaign = name;
  s.options[2].vaccinationCampaign = name;
  return s;
}

describe.each(NAMES)('the name %j', (name) => {
  it('works as an option, reference option, campaign, band and title name: engine, CSV, report, command line with draws, board', () => {
    const input = labelledWith(name);
    const check = validateScenario(input);
    if (!check.ok) throw new Error(check.problems.map(formatProblem).join('\n'));
    const results = runScenario(check.scenario);
    expect(results.options.map((o) => o.name)).toEqual(input.options.map((o: { name: string }) => o.name));
    expect(results.options[results.referenceIndex].name).toBe(name);
    // The campaign ran: doses were given in the options that name it.
    expect(results.options[2].vaccination?.doses ?? 0).toBeGreaterThan(0);
    const source = { fingerprint: META.fingerprint, appVersion: META.appVersion };
    const csv = optionsTableCsv(results, source);
    expect(csv).toContain(name);
    expect(dailySeriesCsv(results, source)).toContain(name);
    const html = buildReportHtml(check.scenario, results, META);
    expect(html).toContain(name);
    for (const text of [csv, html]) expect(text).not.toMatch(BUILT_IN);
    for (const row of boardRowsFor(results)) for (const o of results.options) expect(boardCell(row, o, results).text).not.toMatch(BUILT_IN);

    input.uncertainty = { draws: 3, parameters: [{ name: 'ifrScale', distribution: { kind: 'uniform', low: 0.8, high: 1.2 }, source: 'test' }] };
    const file = writeTemp('names.json', input);
    const json = runCli('run', file, '--format', 'json');
    expect(json.stderr).toBe('');
    expect(json.code).toBe(0);
    expect(JSON.parse(json.stdout).options.map((o: { name: string }) => o.name)).toContain(name);
    const table = runCli('run', file, '--format', 'table');
    expect(table.code).toBe(0);
    expect(table.stdout).toContain(name);
  });

  const refusals: [string, (s: Record<string, any>) => void, RegExp][] = [
    ['a setting name', (s) => (s.settings[3].name = name), /^settings\[3\]\.name /],
    ['a multiplier key', (s) => (s.options[1].phases[0].settingMultipliers = { [name]: 0.5 }), /^options\[1\]\.phases\[0\]\.settingMultipliers/],
    ['an age factor setting', (s) => (s.options[3].phases[0].ageFactors[0].setting = name), /^options\[3\]\.phases\[0\]\.ageFactors\[0\]\.setting /],
    ['an uncertain parameter', (s) => (s.uncertainty = { parameters: [{ name, distribution: { kind: 'uniform', low: 0.9, high: 1.1 }, source: 'x' }] }), /^uncertainty\.parameters\[0\]\.name /],
    ['contactScale.<setting>', (s) => (s.uncertainty = { parameters: [{ name: `contactScale.${name}`, distribution: { kind: 'uniform', low: 0.9, high: 1.1 }, source: 'x' }] }), /^uncertainty\.parameters\[0\]\.name /],
    ['a distribution kind', (s) => (s.uncertainty = { parameters: [{ name: 'ifrScale', distribution: { kind: name, low: 0.9, high: 1.1 }, source: 'x' }] }), /^uncertainty\.parameters\[0\]\.distribution/],
    ['a trigger quantity', (s) => (s.options[1].phases[0].trigger = { quantity: name, onAbove: 10, offBelow: 5 }), /^options\[1\]\.phases\[0\]\.trigger\.quantity /],
    ['a transmission kind', (s) => (s.disease.transmission = { kind: name, r0: 2 }), /^disease\.transmission/],
    ['a field of the disease', (s) => Object.defineProperty(s.disease, name, { value: 1, enumerable: true }), /^disease/],
    ['a field of the uncertainty section', (s) => (s.uncertainty = JSON.parse(`{"parameters":[{"name":"ifrScale","distribution":{"kind":"uniform","low":0.9,"high":1.1},"source":"x"}],${JSON.stringify(name)}:1}`)), /^uncertainty/],
  ];

  it.each(refusals)('is refused as %s, in one line naming the field, also in the app\'s words', (_, change, path) => {
    const s = demoJson();
    change(s);
    const check = validateScenario(s);
    if (check.ok) throw new Error('expected a refusal');
    const lines = check.problems.map(formatProblem);
    expect(lines.some((line) => path.test(line))).toBe(true);
    for (const line of lines) expect(line).not.toMatch(BUILT_IN);
    const words = check.problems.map((p: Problem) => problemInWords(p, s as unknown as Scenario));
    for (const line of words) expect(line).not.toMatch(BUILT_IN);
  });

  it('is refused as a count model on the command line (fit --family), not read as a built-in', () => {
    const fit = runCli('fit', join(ROOT, 'resources/example-cases.csv'), '--scenario', DEMO, '--family', name);
    expect(fit.code).toBe(1);
    expect(fit.stderr).toBe(`mixwise: --family must be poisson or negative-binomial, got ${JSON.stringify(name)} (see mixwise --help)\n`);
  });

  it('is put in words in the app without reading a built-in, as a field name and inside a rule', () => {
    const s = demoJson() as unknown as Scenario;
    for (const problem of [{ path: `disease.${name}`, rule: 'is not a known field' }, { path: `healthcare.capacity.${name}`, rule: `must be at least ${name} (3)` }, { path: 'settings[0].name', rule: `must not be ${name}` }]) {
      expect(problemInWords(problem, s)).not.toMatch(BUILT_IN);
    }
  });
});

