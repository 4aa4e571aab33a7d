/** `mixwise report`: HTML and CSV output, atomic --out, usage mistakes, and no Chromium -> exit 3. */
import Papa from 'papaparse';
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { mainAsync } from '../../src/cli/main.ts';
import { reportCommand } from '../../src/cli/report.ts';
import { shortFingerprint, scenarioFingerprint } from '../../src/report/fingerprint.ts';
import packageJson from '../../package.json' with { type: 'json' };
import { DEMO, tempDir, writeTemp } from '../cli/helpers.ts';
import { demo } from './helpers.ts';

async function cli(...argv: string[]) {
  let stdout = '';
  let stderr = '';
  const code = await mainAsync(argv, { out: (t) => void (stdout += t), err: (t) => void (stderr += t) });
  return { code, stdout, stderr };
}

describe('mixwise report --orders', () => {
  it('prints the order comparison with the options table, under the same fingerprint and caution', { timeout: 60_000 }, async () => {
    const r = await cli('report', DEMO, '--orders', 'Vaccinate oldest first', '--minimise', 'infections', '--groups', '0-3,4-11,12-15', '--top', '2');
    expect(r.code).toBe(0);
    const html = r.stdout;
    const section = html.slice(html.indexOf('<section id="orders"'), html.indexOf('</section>', html.indexOf('<section id="orders"')));
    expect(section).toContain('Vaccination orders compared');
    expect(section).toContain('campaign "Autumn campaign" of option "Vaccinate oldest first"');
    expect(section).toContain('lowest infections');
    expect(section).toContain('Groups: 0-19, 20-59, 60+.');
    expect(section).toContain('Exhaustive: all 6 orders of 3 groups');
    expect(section).toMatch(/Best 2 of 6 orders \(\d+ simulated\)/);
    expect(section).toMatch(/<tr data-row="order-0"><th scope="row">1\. 20-59 &gt; /);
    expect(section).toContain('Built-in orders');
    expect(section).toMatch(/Oldest first: 60\+ &gt; 20-59 &gt; 0-19<\/th><td class="num">[\d,]+<\/td><td class="num">\+[\d,]+<\/td>/);
    expect(section).not.toContain('Best in draws');
    const fingerprint = await scenarioFingerprint(demo().scenario, packageJson.version);
    expect(html).toContain(fingerprint);
    expect(html.indexOf('id="table"')).toBeLessThan(html.indexOf('id="orders"'));
  });

  it('refuses search options without --orders, --orders with CSV, and an unknown option naming --orders', async () => {
    expect((await cli('report', DEMO, '--minimise', 'deaths')).stderr).toMatch(/--minimise goes with --orders OPTION/);
    expect((await cli('report', DEMO, '--orders', 'Vaccinate oldest first', '--format', 'csv')).code).toBe(1);
    const r = await cli('report', DEMO, '--orders', 'Nope');
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^mixwise: [^\n]*--orders must name a policy option of the scenario[^\n]*\n$/);
  });
});

describe('mixwise report', () => {
  it('writes a self-contained HTML report with the fingerprint of the scenario and version', async () => {
    const out = join(tempDir(), 'report.html');
    const r = await cli('report', DEMO, '--out', out, '--paper', 'Letter', '--landscape');
    expect(r).toMatchObject({ code: 0, stdout: '', stderr: '' });
    const html = readFileSync(out, 'utf8');
    const fingerprint = await scenarioFingerprint(demo().scenario, packageJson.version);
    expect(html).toContain(fingerprint);
    expect(html).toContain(`scenario ${shortFingerprint(fingerprint)}`);
    expect(html).toContain('size: Letter landscape;');
    expect(readdirSync(join(out, '..'))).toEqual(['report.html']); // no temporary file left behind
  });

  it('prints the options table as CSV, and the daily series with --series', async () => {
    const table = await cli('report', DEMO, '--format', 'csv');
    expect(table.code).toBe(0);
    const rows = Papa.parse<Record<string, string>>(table.stdout, { header: true, skipEmptyLines: true, comments: '#' }).data;
    expect(rows.map((r) => Number(r.deaths))).toEqual(demo().results.options.map((o) => Number(o.deaths.toPrecision(6))));
    const out = join(tempDir(), 'series.csv');
    const series = await cli('report', DEMO, '--series', '--out', out);
    expect(series.code).toBe(0);
    expect(readFileSync(out, 'utf8').split('\r\n').find((line) => !line.startsWith('#'))).toBe('option,day,band,quantity,value');
  });

  it('rejects mistakes on the command line with exit code 1 and one line', async () => {
    for (const argv of [
      ['report'],
      ['report', DEMO, '--paper', 'A3'],
      ['report', DEMO, '--format', 'pdf'],
      ['report', DEMO, '--series'],
      ['report', DEMO, '--landscape=yes'],
      ['report', DEMO, '--colour', 'x'],
    ]) {
      const r = await cli(...argv);
      expect(r.code, argv.join(' ')).toBe(1);
      expect(r.stderr).toMatch(/^mixwise: [^\n]+\(see mixwise --help\)\n$/);
    }
  });

  it('reports an invalid scenario with exit code 2, and --help lists the command', async () => {
    const bad = writeTemp('bad.json', { format: 'mixwise-scenario', version: 1 });
    const r = await cli('report', bad);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('mixwise: ');
    const help = await cli('report', '--help');
    expect(help.stdout).toContain('mixwise report FILE');
  });

  it('says in one line that no Chromium was found and exits 3, writing nothing', async () => {
    const out = join(tempDir(), 'report.pdf');
    let stderr = '';
    const code = await reportCommand({ out: () => undefined, err: (t) => void (stderr += t) }, [DEMO, '--out', out], {
      env: { CHROMIUM_PATH: '/nonexistent/chromium' },
      now: () => new Date(),
    });
    expect(code).toBe(3);
    expect(stderr).toMatch(/^mixwise: cannot make a PDF: no Chromium found at CHROMIUM_PATH=\/nonexistent\/chromium[^\n]*\n$/);
    expect(existsSync(out)).toBe(false);
  });
});
