/**
 * CSV import of a population vector or a contact matrix, checked against the scenario's
 * age bands. Accepted: UTF-8 with or without BOM; comma, semicolon or tab between fields;
 * decimal point, or decimal comma when fields are not comma-separated (or are quoted).
 *
 * Layouts:
 * - population: a header row of band labels and one row of persons, or two columns
 *   (band label, persons) with a header row;
 * - matrix: a header row of band labels (contactees j; an optional empty first cell),
 *   then one row per band i (contacts of one person in band i), optionally led by its label.
 *
 * Every problem names the row/column and the rule; nothing is applied by this module.
 */
import Papa from 'papaparse';

export type CsvResult<T> = { ok: true; value: T; delimiter: string } | { ok: false; message: string };

/** Parses one numeric field; null when it is not a number. "1 234", "1,5" and "1.5" are accepted. */
export function parseNumberField(field: string, delimiter: string): number | null {
  let text = field.trim().replace(/[\u00a0\u202f ]/g, '');
  if (text === '') return null;
  if (text.includes(',')) {
    if (text.includes('.') || delimiter === ',' && !/^-?\d+,\d+$/.test(text)) return null;
    text = text.replace(',', '.');
  }
  if (!/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(text)) return null;
  const value = Number(text);
  return Number.isFinite(value) ? value : null;
}

function readRows(text: string): { rows: string[][]; delimiter: string } | string {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  if (body.trim() === '') return 'The file is empty.';
  const parsed = Papa.parse<string[]>(body, { delimitersToGuess: [';', '\t', ','], skipEmptyLines: 'greedy' });
  const fatal = parsed.errors.find((e) => e.type === 'Quotes');
  if (fatal) return `Row ${(fatal.row ?? 0) + 1}: ${fatal.message}.`;
  const rows = parsed.data.map((row) => row.map((cell) => cell.trim()));
  return { rows, delimiter: parsed.meta.delimiter };
}

const sameLabel = (a: string, b: string) => a.trim().toLowerCase() === b.trim().toLowerCase();

function checkLabels(found: readonly string[], bandLabels: readonly string[], where: string): string | null {
  if (found.length !== bandLabels.length) {
    return `${where} has ${found.length} band labels; the scenario has ${bandLabels.length} (${bandLabels[0]} … ${bandLabels[bandLabels.length - 1]}).`;
  }
  const k = found.findIndex((label, i) => !sameLabel(label, bandLabels[i]));
  return k < 0 ? null : `${where}, column ${k + 1}: band label "${found[k]}" does not match the scenario's "${bandLabels[k]}".`;
}

function numberAt(cell: string, delimiter: string, row: number, column: number, what: string): number | string {
  const value = parseNumberField(cell, delimiter);
  if (value === null) return `Row ${row}, column ${column}: ${what} must be a number, got "${cell}".`;
  if (value < 0) return `Row ${row}, column ${column}: ${what} must be >= 0, got ${value}.`;
  return value;
}

/** Persons per band, in the scenario's band order. */
export function parsePopulationCsv(text: string, bandLabels: readonly string[]): CsvResult<number[]> {
  const read = readRows(text);
  if (typeof read === 'string') return { ok: false, message: read };
  const { rows, delimiter } = read;
  const n = bandLabels.length;
  // Two rows = header of labels + persons (wide), unless one band in two columns (long).
  const wide = rows.length === 2 && !(n === 1 && rows[0].length === 2);
  const values: number[] = [];
  if (wide) {
    const labelProblem = checkLabels(rows[0], bandLabels, 'Header row');
    if (labelProblem) return { ok: false, message: labelProblem };
    for (let j = 0; j < n; j++) {
      const v = numberAt(rows[1][j] ?? '', delimiter, 2, j + 1, 'persons');
      if (typeof v === 'string') return { ok: false, message: v };
      values.push(v);
    }
  } else {
    const body = rows.slice(1);
    if (rows.length < 2 || rows.some((r) => r.length !== 2)) {
      return { ok: false, message: `Expected either a header row of ${n} band labels and one row of persons, or two columns (band, persons) with a header row.` };
    }
    const labelProblem = checkLabels(body.map((r) => r[0]), bandLabels, 'First column');
    if (labelProblem) return { ok: false, message: labelProblem };
    for (let i = 0; i < n; i++) {
      const v = numberAt(body[i][1], delimiter, i + 2, 2, 'persons');
      if (typeof v === 'string') return { ok: false, message: v };
      values.push(v);
    }
  }
  if (values.every((v) => v === 0)) return { ok: false, message: 'Every band has 0 persons; at least one band must have people.' };
  return { ok: true, value: values, delimiter };
}

/** Contacts per day, C[i][j], in the scenario's band order. */
export function parseMatrixCsv(text: string, bandLabels: readonly string[]): CsvResult<number[][]> {
  const read = readRows(text);
  if (typeof read === 'string') return { ok: false, message: read };
  const { rows, delimiter } = read;
  const n = bandLabels.length;
  const header = rows[0].length === n + 1 ? rows[0].slice(1) : rows[0];
  const labelProblem = checkLabels(header, bandLabels, 'Header row');
  if (labelProblem) return { ok: false, message: labelProblem };
  const body = rows.slice(1);
  if (body.length !== n) return { ok: false, message: `Expected ${n} rows of contacts after the header (one per band), found ${body.length}.` };
  const matrix: number[][] = [];
  for (let i = 0; i < n; i++) {
    const row = body[i];
    const labelled = row.length === n + 1;
    if (!labelled && row.length !== n) return { ok: false, message: `Row ${i + 2} has ${row.length} fields; expected ${n} (or ${n + 1} with a band label first).` };
    if (labelled && !sameLabel(row[0], bandLabels[i])) {
      return { ok: false, message: `Row ${i + 2}: band label "${row[0]}" does not match the scenario's "${bandLabels[i]}".` };
    }
    const cells = labelled ? row.slice(1) : row;
    const values: number[] = [];
    for (let j = 0; j < n; j++) {
      const v = numberAt(cells[j], delimiter, i + 2, j + (labelled ? 2 : 1), 'contacts per day');
      if (typeof v === 'string') return { ok: false, message: v };
      values.push(v);
    }
    matrix.push(values);
  }
  return { ok: true, value: matrix, delimiter };
}
