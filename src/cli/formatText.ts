/** Plain-text rendering of the printed report: columns padded with spaces, for a terminal. */
import type { PrintedReport, TextTable } from './tableModel.ts';

function renderTable(table: TextTable): string[] {
  const widths = table.header.map((h, c) => Math.max(h.length, ...table.rows.map((row) => row[c].length)));
  const line = (cells: string[]): string =>
    cells
      .map((cell, c) => (c < table.leftColumns ? cell.padEnd(widths[c]) : cell.padStart(widths[c])))
      .join('  ')
      .trimEnd();
  const rule = widths.map((w) => '-'.repeat(w)).join('  ');
  return [table.caption, line(table.header), rule, ...table.rows.map(line)];
}

export function formatText(report: PrintedReport): string {
  const lines = [report.title, report.facts.join('   '), ''];
  for (const table of report.tables) lines.push(...renderTable(table), '');
  for (const note of report.notes) lines.push(`Note: ${note}.`);
  if (report.notes.length > 0) lines.push('');
  lines.push(report.caution);
  return `${lines.join('\n')}\n`;
}
