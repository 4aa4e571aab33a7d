/**
 * Option colours: the eight-colour palette of Okabe M, Ito K (2008), "Color Universal
 * Design (CUD): how to make figures and presentations that are friendly to colorblind
 * people" (jfly.uni-koeln.de/color), minus its yellow (too faint on white), plus dark grey.
 * One list for the app and the printed report (src/report/palette.ts).
 * Each option holds a colour slot for life, so it keeps its colour across every view.
 */
import { OPTION_COLOURS, optionStyle, type Marker } from '../../report/palette.ts';

export { OPTION_COLOURS };

export function optionColour(slot: number): string {
  return OPTION_COLOURS[slot % OPTION_COLOURS.length];
}

/** chart.js point style (and rotation in degrees) for each of the report's marker shapes. */
const POINT_STYLES: Record<Marker, { pointStyle: 'circle' | 'rect' | 'triangle' | 'rectRot' | 'crossRot'; rotation: number }> = {
  circle: { pointStyle: 'circle', rotation: 0 },
  square: { pointStyle: 'rect', rotation: 0 },
  triangle: { pointStyle: 'triangle', rotation: 0 },
  diamond: { pointStyle: 'rectRot', rotation: 0 },
  cross: { pointStyle: 'crossRot', rotation: 0 },
  triangleDown: { pointStyle: 'triangle', rotation: 180 },
};

export interface OptionLine {
  colour: string;
  /** Canvas line dash, e.g. [7, 4] ([] = solid). */
  dash: number[];
  pointStyle: 'circle' | 'rect' | 'triangle' | 'rectRot' | 'crossRot';
  /** Marker rotation in degrees (180 turns the triangle down). */
  rotation: number;
}

/**
 * How the option in colour slot `slot` is drawn in the app's charts: the printed report's colour,
 * dash pattern and marker (src/report/palette.ts), so options stay apart in grey and for
 * colour-blind readers, and the app and the report agree.
 */
export function optionLine(slot: number): OptionLine {
  const style = optionStyle(slot);
  const dash = style.dash === '' ? [] : style.dash.split(' ').map(Number);
  return { colour: style.colour, dash, ...POINT_STYLES[style.marker] };
}

/** The lowest colour slot not yet used (so a new option never takes a colour already on screen). */
export function freeColourSlot(used: readonly number[]): number {
  let slot = 0;
  while (used.includes(slot)) slot++;
  return slot;
}

/** Changes smaller than this share of the reference are left unshaded (common practice: half a percent). */
const SMALLEST_SHADED_CHANGE = 0.005;

/**
 * Which way a change against the reference goes for the analyst: 'better', 'worse', or null when
 * it is too small to mark. `relativeChange` is (value - reference) / |reference|.
 */
export function changeDirection(relativeChange: number | null, lowerIsBetter: boolean): 'better' | 'worse' | null {
  if (relativeChange === null || !Number.isFinite(relativeChange) || Math.abs(relativeChange) < SMALLEST_SHADED_CHANGE) return null;
  return (lowerIsBetter ? relativeChange < 0 : relativeChange > 0) ? 'better' : 'worse';
}

/**
 * Diverging shade for a change against the reference: blue when better, orange when worse
 * (a blue/orange pair stays distinct under the common colour-vision deficiencies; Okabe & Ito 2008).
 * Returns a translucent background, strength capped at a 100 % change. The strongest blue is kept
 * light enough for grey small text to keep 4.5:1 on it; in grey the two are told apart by the
 * pattern the board draws on worse cells, not by the tint.
 */
export function changeShade(relativeChange: number | null, lowerIsBetter: boolean): string {
  const direction = changeDirection(relativeChange, lowerIsBetter);
  if (direction === null || relativeChange === null) return 'transparent';
  const strength = Math.min(1, Math.abs(relativeChange));
  const alpha = (0.1 + 0.3 * strength).toFixed(2);
  return direction === 'better' ? `rgba(0, 114, 178, ${alpha})` : `rgba(230, 159, 0, ${alpha})`;
}

/** Sequential ramp for heatmaps, white to deep blue; `t` in [0, 1]. */
export function heatColour(t: number): string {
  const x = Math.max(0, Math.min(1, t));
  const from = [247, 251, 255];
  const to = [8, 48, 107];
  const c = from.map((f, i) => Math.round(f + (to[i] - f) * Math.sqrt(x)));
  return `rgb(${c[0]}, ${c[1]}, ${c[2]})`;
}
