/**
 * The printed layout shared by the plain-text and Markdown formats: a heading block, the policy
 * options table exactly as the report prints it (one row per outcome, one column per option, in
 * groups of at most `OPTIONS_PER_TABLE` options), the by-band tables of the catalogue and notes.
 */
import type { ScenarioSummary } from '../engine/index.ts';
import { drawFacts, uncertainParameterRows, type DrawSummary } from '../report/drawSummary.ts';
import { print } from '../report/numberFormat.ts';
import { columnGroups, optionsTable } from '../report/optionsTable.ts';
import { BAND_OUTCOMES, formatBandValue } from '../report/outcomes.ts';
import { CAUTION } from '../report/index.ts';
import { reciprocityNotes, reciprocityRows } from './reciprocityNotes.ts';

/** Option columns per table, so a table fits a terminal about 120 characters wide. */
export const OPTIONS_PER_TABLE = 4;

export interface TextTable {
  caption: string;
  header: string[];
  rows: string[][];
  /** Columns aligned left (text); the others are numbers, aligned right. */
  leftColumns: number;
}

export interface PrintedReport {
  title: string;
  facts: string[];
  tables: TextTable[];
  notes: string[];
  caution: string;
}

/** The summary of uncertainty draws and the inputs drawn. */
export type PrintedDraws = DrawSummary;

export function printedReport(results: ScenarioSummary, draws?: PrintedDraws): PrintedReport {
  const table = optionsTable(results, draws?.summary);
  const groups = columnGroups(table.optionNames.length, OPTIONS_PER_TABLE);
  const optionTables = groups.map(
    (group, g): TextTable => ({
      caption: groups.length === 1 ? 'Policy options' : `Policy options (${g + 1} of ${groups.length})`,
      header: ['Outcome', ...group.map((k) => table.optionNames[k])],
      leftColumns: 1,
      rows: table.rows.map((row) => [row.label, ...group.map((k) => row.cells[k])]),
    }),
  );
  const bandTables = BAND_OUTCOMES.filter((b) => b.printTable).map(
    (b): TextTable => ({
      caption: b.label,
      header: ['Age band', ...table.optionNames],
      leftColumns: 1,
      rows: results.ageBands.map((band, i) => [band, ...results.options.map((o) => formatBandValue(b, o, results, i, 'print'))]),
    }),
  );
  const parameterTables: TextTable[] =
    draws === undefined ? [] : [{ caption: 'Uncertain inputs', header: ['Input', 'Distribution', 'Source'], leftColumns: 3, rows: uncertainParameterRows(draws.parameters) }];
  return {
    title: results.title,
    facts: [
      `R0 (no measures): ${print.r(results.r0)}`,
      `Horizon: ${results.horizonDays} days`,
      `Reference option: ${table.optionNames[table.referenceIndex] ?? ''}`,
      ...(draws === undefined ? [] : drawFacts(draws.summary.uncertainty)),
    ],
    tables: [...optionTables, ...parameterTables, ...bandTables],
    notes: [...table.notes.slice(draws === undefined ? table.notes.length : -1).map((n) => n.replace(/\.$/, '')), ...(draws?.summary.uncertainty.notes ?? []), ...reciprocityNotes(reciprocityRows(results.reciprocity, results.ageBands))],
    caution: CAUTION,
  };
}
