import { describe, expect, it } from 'vitest';
import { runScenario } from '../../src/engine/run.ts';
import { buildReportHtml, formatReportTime } from '../../src/report/reportHtml.ts';
import { CAUTION } from '../../src/report/cautions.ts';
import { print } from '../../src/report/numberFormat.ts';
import { optionsTable } from '../../src/report/optionsTable.ts';
import type { ReportMeta } from '../../src/report/reportTypes.ts';
import { demo, manyOptionsScenario } from './helpers.ts';

const FINGERPRINT = 'ab12cd34ef56'.padEnd(64, '0');

function meta(overrides: Partial<ReportMeta> = {}): ReportMeta {
  return { appVersion: '9.8.7', generatedAt: new Date(2031, 4, 6, 7, 8), fingerprint: FINGERPRINT, paper: 'A4', orientation: 'portrait', ...overrides };
}

/** Text of the options-table cells, table by table: [table][row] -> cells after the row label. */
function tableCells(html: string): string[][][] {
  return [...html.matchAll(/<table class="options-table">([\s\S]*?)<\/table>/g)].map((t) =>
    [...t[1].matchAll(/<tr data-row="[^"]+">([\s\S]*?)<\/tr>/g)].map((r) => [...r[1].matchAll(/<td class="num">([^<]*)<\/td>/g)].map((c) => c[1])),
  );
}

describe('buildReportHtml', () => {
  const { scenario, results } = demo();
  const html = buildReportHtml(scenario, results, meta());

  it('is one self-contained document: no script, no external file or link', () => {
    expect(html.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(html).not.toMatch(/<script|<link|<img|src=|url\(|@import/i);
    expect(html).not.toMatch(/href="http/i);
    expect((html.match(/<svg class="chart"/g) ?? []).length).toBe(5); // prevalence, deaths, ICU, two by age
  });

  it('shows title, time, version, full and short fingerprint (running footer) and the caution', () => {
    expect(html).toContain(scenario.title);
    expect(html).toContain(formatReportTime(new Date(2031, 4, 6, 7, 8)));
    expect(formatReportTime(new Date(2031, 4, 6, 7, 8))).toMatch(/^2031-05-06 07:08 \(UTC[+-]\d\d:\d\d\)$/);
    expect(html).toContain(FINGERPRINT);
    expect(html).toMatch(/@bottom-left \{ content: "Mixwise 9\.8\.7 - scenario ab12cd34ef56 - /);
    expect(html).toContain('counter(page)');
    expect(html).toContain(CAUTION);
    expect(html).toContain('decisions rest with the responsible public-health authority and local rules');
    expect(html).toContain('not forecasts');
  });

  it('sets the paper size and orientation', () => {
    expect(html).toContain('size: A4 portrait;');
    expect(buildReportHtml(scenario, results, meta({ paper: 'Letter', orientation: 'landscape' }))).toContain('size: Letter landscape;');
  });

  it('prints the engine numbers formatted in the options table', () => {
    const [cells] = tableCells(html);
    const table = optionsTable(results);
    const row = (key: string) => cells[table.rows.findIndex((r) => r.key === key)];
    expect(row('rStart')).toEqual(results.options.map((o) => print.r(o.rStart)));
    expect(row('attackRate')).toEqual(results.options.map((o) => print.percent(o.attackRate)));
    expect(row('deaths')).toEqual(results.options.map((o) => print.persons(o.deaths)));
    const ref = results.options[results.referenceIndex];
    expect(row('deathsAverted')[results.referenceIndex]).toBe('reference');
    expect(row('deathsAverted')[3]).toBe(`+${print.persons(ref.deaths - results.options[3].deaths)}`);
    expect(row('peakIcuOccupancy')).toEqual(results.options.map((o) => print.persons(o.healthcare!.icu.peakOccupancy)));
  });

  it('has hospital rows and the ICU chart only when the scenario has healthcare', () => {
    const without = { ...scenario, healthcare: undefined };
    const plain = buildReportHtml(without, runScenario(without), meta());
    expect(html).toContain('data-row="peakIcuOccupancy"');
    expect(plain).not.toContain('data-row="peakIcuOccupancy"');
    expect(plain).not.toContain('id="chart-icu"');
    expect(plain).not.toContain('IHR, %');
  });

  it('lists every parameter with its source', () => {
    expect(html).toContain(scenario.severity.source);
    expect(html).toContain(scenario.disease.source);
    for (const band of scenario.ageBands) expect(html).toContain(`<th scope="row">${band.label}</th>`);
    for (const setting of scenario.settings) expect(html).toContain(`Contacts in setting &quot;${setting.name}&quot;`);
  });

  it('escapes text from the scenario file', () => {
    const odd = { ...scenario, title: 'A <b>bold</b> & "quoted" title' };
    const text = buildReportHtml(odd, results, meta());
    expect(text).toContain('A &lt;b&gt;bold&lt;/b&gt; &amp; &quot;quoted&quot; title');
    expect(text).not.toContain('<b>bold</b>');
  });

  it('splits twelve options into column groups: 5 per table in portrait, 8 in landscape', () => {
    const many = manyOptionsScenario(12);
    const manyResults = runScenario(many);
    const portrait = tableCells(buildReportHtml(many, manyResults, meta()));
    expect(portrait.map((t) => t[0].length)).toEqual([5, 5, 2]);
    const landscape = tableCells(buildReportHtml(many, manyResults, meta({ orientation: 'landscape' })));
    expect(landscape.map((t) => t[0].length)).toEqual([8, 4]);
    expect(landscape[1][0]).toEqual(manyResults.options.slice(8).map((o) => print.r(o.rStart)));
  });
});
