/** Markdown rendering of the printed report (GitHub-style pipe tables). */
import type { PrintedReport, TextTable } from './tableModel.ts';

/** Escapes the characters that would break a Markdown table cell. */
function cell(text: string): string {
  return text.replace(/\\/g, '\\\\').replace(/\|/g, '\\|').replace(/\r?\n/g, ' ');
}

function renderTable(table: TextTable): string[] {
  const row = (cells: string[]): string => `| ${cells.map(cell).join(' | ')} |`;
  const align = table.header.map((_, c) => (c < table.leftColumns ? ':---' : '---:'));
  return [`## ${cell(table.caption)}`, '', row(table.header), `| ${align.join(' | ')} |`, ...table.rows.map(row)];
}

export function formatMarkdown(report: PrintedReport): string {
  const lines = [`# ${cell(report.title)}`, '', report.facts.map((f) => `- ${cell(f)}`).join('\n'), ''];
  for (const table of report.tables) lines.push(...renderTable(table), '');
  for (const note of report.notes) lines.push(`> Note: ${cell(note)}.`, '');
  lines.push(`*${report.caution}*`);
  return `${lines.join('\n')}\n`;
}
