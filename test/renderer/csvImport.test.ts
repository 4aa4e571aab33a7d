import { describe, expect, it } from 'vitest';
import { parseMatrixCsv, parseNumberField, parsePopulationCsv } from '../../src/renderer/lib/csvImport.ts';

const bands = ['0-19', '20-59', '60+'];

describe('parseNumberField', () => {
  it('reads decimal points, decimal commas and grouped thousands', () => {
    expect(parseNumberField('1.5', ',')).toBe(1.5);
    expect(parseNumberField('1,5', ';')).toBe(1.5);
    expect(parseNumberField('12 345', ';')).toBe(12345);
    expect(parseNumberField('2e3', ',')).toBe(2000);
    expect(parseNumberField('abc', ',')).toBeNull();
    expect(parseNumberField('1.234,5', ';')).toBeNull();
    expect(parseNumberField('', ',')).toBeNull();
  });
});

describe('parsePopulationCsv', () => {
  it('reads a header row of band labels and a row of persons (comma, BOM)', () => {
    const r = parsePopulationCsv('\ufeff0-19,20-59,60+\n1000,2000,500\n', bands);
    expect(r).toEqual({ ok: true, value: [1000, 2000, 500], delimiter: ',' });
  });

  it('reads two columns (band, persons) with semicolons and decimal commas', () => {
    const r = parsePopulationCsv('band;persons\r\n0-19;1000,5\r\n20-59;2000\r\n60+;500\r\n', bands);
    expect(r).toEqual({ ok: true, value: [1000.5, 2000, 500], delimiter: ';' });
  });

  it('names the row, column and rule when a value is bad', () => {
    const r = parsePopulationCsv('0-19,20-59,60+\n1000,-3,500', bands);
    expect(r).toEqual({ ok: false, message: 'Row 2, column 2: persons must be >= 0, got -3.' });
    const t = parsePopulationCsv('0-19,20-59,60+\n1000,many,500', bands);
    expect(t.ok ? '' : t.message).toMatch(/Row 2, column 2: persons must be a number, got "many"/);
  });

  it('refuses band labels that do not match the scenario', () => {
    const r = parsePopulationCsv('0-14,15-59,60+\n1,2,3', bands);
    expect(r.ok ? '' : r.message).toMatch(/column 1: band label "0-14" does not match the scenario's "0-19"/);
    const n = parsePopulationCsv('0-19,20-59\n1,2', bands);
    expect(n.ok ? '' : n.message).toMatch(/2 band labels; the scenario has 3/);
  });

  it('refuses an empty file and an all-zero population', () => {
    expect(parsePopulationCsv('  \n', bands)).toEqual({ ok: false, message: 'The file is empty.' });
    expect(parsePopulationCsv('0-19,20-59,60+\n0,0,0', bands).ok).toBe(false);
  });
});

describe('parseMatrixCsv', () => {
  it('reads a labelled matrix with an empty corner cell', () => {
    const text = ',0-19,20-59,60+\n0-19,5,2,0.5\n20-59,1,6,1\n60+,0.3,1.2,2\n';
    expect(parseMatrixCsv(text, bands)).toEqual({
      ok: true,
      delimiter: ',',
      value: [
        [5, 2, 0.5],
        [1, 6, 1],
        [0.3, 1.2, 2],
      ],
    });
  });

  it('reads an unlabelled body with semicolons and decimal commas', () => {
    const text = '0-19;20-59;60+\n5;2;0,5\n1;6;1\n0,3;1,2;2\n';
    const r = parseMatrixCsv(text, bands);
    expect(r.ok && r.value[2]).toEqual([0.3, 1.2, 2]);
  });

  it('names what is wrong: row count, row length, label, value', () => {
    expect(parseMatrixCsv('0-19,20-59,60+\n1,2,3\n', bands)).toEqual({ ok: false, message: 'Expected 3 rows of contacts after the header (one per band), found 1.' });
    const short = parseMatrixCsv('0-19,20-59,60+\n1,2\n1,2,3\n1,2,3\n', bands);
    expect(short.ok ? '' : short.message).toBe('Row 2 has 2 fields; expected 3 (or 4 with a band label first).');
    const label = parseMatrixCsv(',0-19,20-59,60+\n0-19,1,2,3\nadults,1,2,3\n60+,1,2,3\n', bands);
    expect(label.ok ? '' : label.message).toMatch(/Row 3: band label "adults"/);
    const neg = parseMatrixCsv('0-19,20-59,60+\n1,2,3\n1,-2,3\n1,2,3\n', bands);
    expect(neg.ok ? '' : neg.message).toBe('Row 3, column 2: contacts per day must be >= 0, got -2.');
  });
});
