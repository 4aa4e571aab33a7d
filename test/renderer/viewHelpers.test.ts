import { describe, expect, it } from 'vitest';
import { relativeChange, screen } from '../../src/report/numberFormat.ts';
import { changeDirection, changeShade, freeColourSlot, optionColour, optionLine, OPTION_COLOURS } from '../../src/renderer/lib/optionLines.ts';
import { commandForKey, keepsNativeUndo } from '../../src/renderer/lib/shortcuts.ts';
import { totalOverBands } from '../../src/engine/bandTotals.ts';
import { key } from '../helpers/keys.ts';

describe('format', () => {
  it('formats with units and sensible precision', () => {
    expect(screen.r(2.49997)).toBe('2.50');
    expect(screen.percent(0.8336)).toBe('83.4 %');
    expect(screen.percent(0.00042)).toBe('0.042 %');
    expect(screen.percent(1e-16)).toBe('< 0.001 %');
    expect(screen.persons(8297.66)).toBe('8,298');
    expect(screen.persons(1_264_000)).toBe('1.26 M');
    expect(screen.growthRate(0.147)).toBe('+14.7 %/day');
    expect(screen.growthRate(-0.02)).toBe('−2.0 %/day');
    expect(screen.signedPersons(-53.2)).toBe('−53');
    expect(relativeChange(90, 100)).toBeCloseTo(-0.1);
    expect(relativeChange(1, 0)).toBeNull();
  });
});

describe('palette', () => {
  it('gives each slot a colour, and the report\'s dash and marker so lines differ without colour', () => {
    expect(new Set(OPTION_COLOURS).size).toBe(OPTION_COLOURS.length);
    expect(optionColour(0)).toBe(optionColour(OPTION_COLOURS.length));
    expect(optionLine(1).dash).toEqual([7, 4]);
    expect(optionLine(0).dash).toEqual([]);
    const firstFour = [0, 1, 2, 3].map((k) => `${optionLine(k).dash.join(' ')}/${optionLine(k).pointStyle}/${optionLine(k).rotation}`);
    expect(new Set(firstFour).size).toBe(4);
    expect(optionLine(5)).toMatchObject({ pointStyle: 'triangle', rotation: 180 });
    // Same colour (slot 7 wraps to slot 0's colour) but a different dash or marker.
    expect(optionLine(7).colour).toBe(optionLine(0).colour);
    expect(`${optionLine(7).dash}/${optionLine(7).pointStyle}`).not.toBe(`${optionLine(0).dash}/${optionLine(0).pointStyle}`);
    expect(freeColourSlot([0, 1, 3])).toBe(2);
  });

  it('shades better blue, worse orange, none for a tiny change', () => {
    expect(changeShade(-0.5, true)).toMatch(/^rgba\(0, 114, 178/);
    expect(changeShade(0.5, true)).toMatch(/^rgba\(230, 159, 0/);
    expect(changeShade(0.001, true)).toBe('transparent');
    expect(changeShade(null, true)).toBe('transparent');
    expect(changeDirection(-0.5, true)).toBe('better');
    expect(changeDirection(0.5, true)).toBe('worse');
    expect(changeDirection(0.5, false)).toBe('better');
    expect(changeDirection(0.001, true)).toBeNull();
  });
});

describe('shortcuts', () => {
  it('maps the common keys', () => {
    expect(commandForKey(key('s', { ctrlKey: true }))).toBe('save');
    expect(commandForKey(key('S', { ctrlKey: true, shiftKey: true }))).toBe('save-as');
    expect(commandForKey(key('z', { metaKey: true }))).toBe('undo');
    expect(commandForKey(key('z', { ctrlKey: true, shiftKey: true }))).toBe('redo');
    expect(commandForKey(key('y', { ctrlKey: true }))).toBe('redo');
    expect(commandForKey(key('2', { altKey: true }))).toBe('view-curves');
    expect(commandForKey(key('F1'))).toBe('show-model-notes');
    expect(commandForKey(key('s'))).toBeNull();
  });

  it('leaves undo to text fields while they have focus', () => {
    expect(keepsNativeUndo({ tagName: 'INPUT', type: 'text' })).toBe(true);
    expect(keepsNativeUndo({ tagName: 'TEXTAREA' })).toBe(true);
    expect(keepsNativeUndo({ tagName: 'INPUT', type: 'range' })).toBe(false);
    expect(keepsNativeUndo(null)).toBe(false);
  });
});

describe('totalOverBands', () => {
  it('adds bands per day (band-major layout)', () => {
    expect(Array.from(totalOverBands(new Float64Array([1, 2, 3, 4, 5, 6]), 3))).toEqual([6, 15]);
  });
});
