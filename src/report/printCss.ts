/**
 * Print and screen styles of the report. Paper size and orientation come from the caller;
 * page numbers and the short fingerprint run in the page-margin boxes (CSS Paged Media Level 3,
 * supported by Chromium's print since version 131), and are repeated in the document header for
 * screens. Table rows never break across pages; table headers repeat on each page.
 */
import type { Paper, Orientation } from './reportTypes.ts';

/** Quoted CSS string (for `content:`). */
function cssString(text: string): string {
  return `"${text.replace(/\\/g, '\\\\').replace(/"/g, '\\"')}"`;
}

/** The report's style sheet for `paper` and `orientation`, with `footerText` running at the foot of every page. */
export function printCss(paper: Paper, orientation: Orientation, footerText: string): string {
  return `
@page {
  size: ${paper} ${orientation};
  margin: 16mm 14mm 18mm 14mm;
  @bottom-left { content: ${cssString(footerText)}; font: 8pt/1.2 sans-serif; color: #333; }
  @bottom-right { content: "Page " counter(page) " of " counter(pages); font: 8pt/1.2 sans-serif; color: #333; }
}
:root { color-scheme: light; }
* { box-sizing: border-box; }
body { margin: 0; font: 10pt/1.4 "DejaVu Sans", "Liberation Sans", Arial, sans-serif; color: #111; background: #fff; }
main { max-width: 1100px; margin: 0 auto; padding: 16px; }
@media print { main { max-width: none; padding: 0; } }
h1 { font-size: 17pt; margin: 0 0 2pt; }
h2 { font-size: 13pt; margin: 14pt 0 6pt; padding-bottom: 2pt; border-bottom: 1.5pt solid #111; break-after: avoid; }
h3 { font-size: 11pt; margin: 10pt 0 4pt; break-after: avoid; }
p { margin: 0 0 5pt; }
.subtitle { font-size: 12pt; margin: 0 0 6pt; }
.facts { display: grid; grid-template-columns: max-content 1fr; gap: 1pt 10pt; margin: 6pt 0; font-size: 9pt; }
.facts dt { font-weight: bold; }
.facts dd { margin: 0; overflow-wrap: anywhere; }
.caution { border: 1.5pt solid #111; padding: 5pt 8pt; margin: 8pt 0; font-weight: bold; break-inside: avoid; }
.option-summary { break-inside: avoid; margin: 0 0 7pt; }
.option-summary h3 { margin-bottom: 1pt; }
.option-summary ul { margin: 2pt 0 0 14pt; padding: 0; }
.description { font-style: italic; }
.tag { font-size: 8pt; font-weight: normal; border: 0.8pt solid #111; padding: 0 3pt; margin-left: 4pt; vertical-align: middle; }
table { border-collapse: collapse; width: 100%; margin: 4pt 0 8pt; font-size: 9pt; }
thead { display: table-header-group; }
tr { break-inside: avoid; page-break-inside: avoid; }
th, td { border-bottom: 0.6pt solid #999; padding: 2.5pt 4pt; vertical-align: top; }
th { text-align: left; border-bottom: 1.2pt solid #111; }
tbody th { border-bottom: 0.6pt solid #999; }
td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; }
th.reference { text-decoration: underline; }
caption { caption-side: top; text-align: left; font-weight: bold; padding: 2pt 0; }
.options-table th.outcome { width: 30%; }
/* Outcome labels stay on one line, so a row never prints its label apart from its values. */
.options-table tbody th { white-space: nowrap; }
.options-table th.option { overflow-wrap: anywhere; }
.options-table .swatch { display: block; margin: 0 0 1pt auto; }
.orders-table { font-size: 8pt; }
.order-comparison { break-inside: avoid; }
.notes { font-size: 8.5pt; color: #222; }
.chart-block { break-inside: avoid; margin: 0 0 10pt; }
.chart { width: 100%; height: auto; display: block; }
.legend { display: flex; flex-wrap: wrap; gap: 2pt 12pt; font-size: 8.5pt; margin: 2pt 0 0; padding: 0; list-style: none; }
.legend li { display: flex; align-items: center; gap: 4pt; }
.params { table-layout: fixed; }
.params th:nth-child(1) { width: 27%; }
.params th:nth-child(2) { width: 21%; }
.params th:nth-child(3) { width: 14%; }
.params td:nth-child(3), .params td:nth-child(4) { font-size: 8pt; }
.params .small-print { font-size: 7.5pt; color: #333; margin-top: 1pt; }
.params tr.fit td:first-child { padding-left: 10pt; }
.params tr.changed td:nth-child(-n+2) { font-weight: bold; }
.bands tbody th, .bands td { white-space: nowrap; }
.bands { font-size: 8pt; }
.bands th, .bands td { padding: 2pt 3pt; }
.limits li { margin-bottom: 3pt; }
.page-break { break-before: page; }
`;
}
