/**
 * The printable policy options report as one self-contained HTML document (styles and SVG charts
 * inline, no script, no external file). Pure: builds a string from the scenario, the engine's
 * results and the report settings; the CLI writes it to a file or prints it to PDF, the app can
 * show or print the same string.
 */
import type { ScenarioResults, Scenario } from '../engine/index.ts';
import { bandTable, parameterRows } from './assumptions.ts';
import { CAUTION, CAUTION_PARAGRAPHS, modelLimits } from './cautions.ts';
import { drawFacts, uncertainParameterRows } from './drawSummary.ts';
import { byAgeCharts, curveCharts, type ReportChart, type StyleOf } from './charts.ts';
import { escapeMarkup as esc } from './escape.ts';
import { FIT_SOURCE, R0_CHANGED_AFTER_FIT } from './fitRecord.ts';
import { shortFingerprint } from './fingerprint.ts';
import { optionSummaries, type OptionSummary, TRIGGER_RULE_WORDS } from './measures.ts';
import { columnGroups, optionsTable, type OptionsTable } from './optionsTable.ts';
import { orderComparisonHtml } from './orderComparisonHtml.ts';
import { optionStyleOf } from './palette.ts';
import { printCss } from './printCss.ts';
import { OPTION_COLUMNS_PER_TABLE, type ParameterRow, type ReportMeta } from './reportTypes.ts';
import { legendSwatchSvg } from './svgLineChart.ts';

const pad2 = (n: number): string => String(n).padStart(2, '0');

/** Local date and time with the UTC offset: "2025-03-04 14:05 (UTC+01:00)". */
export function formatReportTime(at: Date): string {
  const offset = -at.getTimezoneOffset();
  const sign = offset < 0 ? '-' : '+';
  const abs = Math.abs(offset);
  return (
    `${at.getFullYear()}-${pad2(at.getMonth() + 1)}-${pad2(at.getDate())} ${pad2(at.getHours())}:${pad2(at.getMinutes())} ` +
    `(UTC${sign}${pad2(Math.floor(abs / 60))}:${pad2(abs % 60)})`
  );
}

function summaryHtml(summary: OptionSummary, index: number, styleOf: StyleOf): string {
  const tag = summary.isReference ? '<span class="tag">reference</span>' : '';
  const description = summary.description.trim() === '' ? '' : `<p class="description">${esc(summary.description)}</p>`;
  const measures =
    summary.noMeasures !== null
      ? `<p>${esc(summary.noMeasures)}</p>`
      : `<ul>${summary.phases
          .map((p) => `<li><strong>${esc(p.when)}:</strong> ${esc(p.what)}${p.rule === null ? '' : ` — ${esc(p.rule)}`}.${p.fired === null ? '' : ` It ${esc(p.fired)}.`}${p.r === null ? '' : ` ${esc(p.r)}.`}</li>`)
          .join('')}</ul>${summary.burden === null ? '' : `<p>${esc(summary.burden)}</p>`}`;
  const vaccination = summary.vaccination === null ? '' : `<p><strong>Vaccination:</strong> ${esc(summary.vaccination)}.</p>`;
  return `<section class="option-summary"><h3>${legendSwatchSvg(styleOf(index))} ${esc(summary.name)}${tag}</h3>${description}${measures}${vaccination}</section>`;
}

function optionsTableHtml(table: OptionsTable, perTable: number, styleOf: StyleOf): string {
  const groups = columnGroups(table.optionNames.length, perTable);
  return groups
    .map((group) => {
      const caption =
        groups.length === 1 ? 'Policy options' : `Policy options ${group[0] + 1}-${group[group.length - 1] + 1} of ${table.optionNames.length}`;
      const head = group
        .map((k) => {
          const reference = k === table.referenceIndex ? ' reference' : '';
          const mark = k === table.referenceIndex ? ' (reference)' : '';
          return `<th class="num option${reference}" scope="col">${legendSwatchSvg(styleOf(k))}${esc(table.optionNames[k])}${mark}</th>`;
        })
        .join('');
      const body = table.rows
        .map((row) => `<tr data-row="${esc(row.key)}"><th scope="row">${esc(row.label)}</th>${group.map((k) => `<td class="num">${esc(row.cells[k])}</td>`).join('')}</tr>`)
        .join('');
      return `<table class="options-table"><caption>${esc(caption)}</caption><thead><tr><th class="outcome" scope="col">Outcome</th>${head}</tr></thead><tbody>${body}</tbody></table>`;
    })
    .join('');
}

function legendHtml(results: ScenarioResults, styleOf: StyleOf): string {
  return `<ul class="legend">${results.options.map((o, k) => `<li>${legendSwatchSvg(styleOf(k))}${esc(o.name)}</li>`).join('')}</ul>`;
}

function chartHtml(chart: ReportChart, legend: string): string {
  return `<figure class="chart-block" id="chart-${esc(chart.id)}"><h3>${esc(chart.heading)}</h3>${chart.svg}${legend}<figcaption class="notes">${esc(chart.caption)}</figcaption></figure>`;
}

/** Fit rows are indented under the R0 assumption; "R0 was changed after the fit" stands out. */
function rowClass(row: ParameterRow): string {
  if (row.parameter === R0_CHANGED_AFTER_FIT) return ' class="fit changed"';
  return row.source === FIT_SOURCE ? ' class="fit"' : '';
}

function assumptionsHtml(scenario: Scenario, results: ScenarioResults): string {
  const params = parameterRows(scenario, results)
    .map((r) => `<tr${rowClass(r)}><td>${esc(r.parameter)}</td><td>${esc(r.value)}${r.smallPrint ? `<div class="small-print">${esc(r.smallPrint)}</div>` : ''}</td><td>${esc(r.unit)}</td><td>${esc(r.source)}</td></tr>`)
    .join('');
  const bands = bandTable(scenario);
  const bandHead = bands.header.map((h, k) => `<th scope="col"${k > 0 ? ' class="num"' : ''}>${esc(h)}</th>`).join('');
  const bandRows = bands.rows.map((row) => `<tr>${row.map((cell, k) => (k === 0 ? `<th scope="row">${esc(cell)}</th>` : `<td class="num">${esc(cell)}</td>`)).join('')}</tr>`).join('');
  const notes = scenario.notes.trim() === '' ? '' : `<h3>Notes from the scenario file</h3><p>${esc(scenario.notes)}</p>`;
  return (
    `<table class="params"><caption>Parameters</caption><thead><tr><th scope="col">Parameter</th><th scope="col">Value</th><th scope="col">Unit</th><th scope="col">Source</th></tr></thead><tbody>${params}</tbody></table>` +
    `<table class="bands"><caption>Inputs by age band</caption><thead><tr>${bandHead}</tr></thead><tbody>${bandRows}</tbody></table>` +
    notes
  );
}

/** The uncertain inputs (name, distribution with bounds, source) and the notes on failed draws. */
function uncertainInputsHtml(scenario: Scenario, notes: readonly string[]): string {
  const rows = uncertainParameterRows(scenario.uncertainty?.parameters ?? []);
  return `<h3>Uncertain inputs</h3>
<table class="uncertain-inputs"><thead><tr><th>Input</th><th>Distribution</th><th>Source</th></tr></thead>
<tbody>${rows.map((cells) => `<tr>${cells.map((c) => `<td>${esc(c)}</td>`).join('')}</tr>`).join('')}</tbody></table>
${notes.length === 0 ? '' : `<div class="notes">${notes.map((n) => `<p>${esc(n)}</p>`).join('')}</div>`}`;
}

/** The report as a complete HTML document (UTF-8). */
export function buildReportHtml(scenario: Scenario, results: ScenarioResults, meta: ReportMeta): string {
  const short = shortFingerprint(meta.fingerprint);
  const when = formatReportTime(meta.generatedAt);
  const footer = `Mixwise ${meta.appVersion} - scenario ${short} - ${when}`;
  const styleOf: StyleOf = (k) => optionStyleOf(k, meta.colourSlots);
  const table = optionsTable(results, meta.draws);
  const legend = legendHtml(results, styleOf);
  const charts = (list: ReportChart[]) => list.map((c) => chartHtml(c, legend)).join('');
  const summaries = optionSummaries(scenario, results.referenceIndex, results).map((summary, k) => summaryHtml(summary, k, styleOf)).join('');
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="generator" content="Mixwise ${esc(meta.appVersion)}">
<meta name="mixwise-fingerprint" content="${esc(meta.fingerprint)}">
<title>${esc(`Policy options report - ${scenario.title}`)}</title>
<style>${printCss(meta.paper, meta.orientation, footer)}</style>
</head>
<body>
<main>
<header>
<h1>Policy options report</h1>
<p class="subtitle">${esc(scenario.title)}</p>
<dl class="facts">
<dt>Made</dt><dd>${esc(when)} with Mixwise ${esc(meta.appVersion)}</dd>
<dt>Scenario fingerprint</dt><dd><strong>${esc(short)}</strong> <span class="notes">(SHA-256 of the scenario and program version: ${esc(meta.fingerprint)})</span></dd>
<dt>Options</dt><dd>${results.options.length}, compared with the reference option "${esc(results.options[results.referenceIndex].name)}"</dd>
<dt>Horizon</dt><dd>${scenario.horizonDays} days from day 0</dd>
${meta.draws === undefined ? '' : `<dt>Uncertainty</dt><dd>${drawFacts(meta.draws.uncertainty).map(esc).join('; ')}</dd>`}
</dl>
<p class="caution">${esc(CAUTION)}</p>
</header>
<section id="summary">
<h2>1. The options</h2>
<p class="notes">Day numbers count from day 0, the first day of the scenario; both ends of a period are included. Contacts not mentioned stay as usual (100%).</p>
${summaries}
${scenario.options.some((o) => o.phases.some((p) => p.trigger !== undefined)) ? `<p class="notes">${esc(TRIGGER_RULE_WORDS)}</p>` : ''}
</section>
<section id="table">
<h2>2. Policy options table</h2>
${optionsTableHtml(table, OPTION_COLUMNS_PER_TABLE[meta.orientation], styleOf)}
<div class="notes">${table.notes.map((n) => `<p>${esc(n)}</p>`).join('')}</div>
${meta.draws === undefined ? '' : uncertainInputsHtml(scenario, meta.draws.uncertainty.notes)}
${meta.orderComparison === undefined ? '' : orderComparisonHtml(meta.orderComparison, scenario)}
</section>
<section id="curves">
<h2>3. Curves over time</h2>
${charts(curveCharts(results, styleOf))}
</section>
<section id="by-age">
<h2>4. By age</h2>
${charts(byAgeCharts(results, styleOf))}
</section>
<section id="assumptions" class="page-break">
<h2>5. Assumptions</h2>
${assumptionsHtml(scenario, results)}
</section>
<section id="cautions">
<h2>6. Cautions and limits</h2>
${CAUTION_PARAGRAPHS.map((p) => `<p>${esc(p)}</p>`).join('')}
<h3>Limits of the model</h3>
<ul class="limits">${modelLimits(meta.draws !== undefined).map((p) => `<li>${esc(p)}</li>`).join('')}</ul>
</section>
</main>
</body>
</html>
`;
}
