/**
 * How each option is drawn in the printed charts. Colours: the palette of Okabe M, Ito K (2008),
 * "Color Universal Design (CUD): how to make figures and presentations that are friendly to
 * colorblind people", minus its yellow (too faint on white), plus dark grey: the same colours,
 * in the same order, as the app (src/renderer/lib/optionLines.ts). Because a printout may be
 * grey, every option also has its own dash pattern and marker shape; colour, dash and marker
 * cycle with different periods (7, 4, 6), so the first 84 options all differ in at least one.
 */
export const OPTION_COLOURS = ['#0072B2', '#E69F00', '#009E73', '#D55E00', '#CC79A7', '#56B4E9', '#444444'] as const;

/** SVG stroke-dasharray values: solid, dashed, dotted, dash-dot. */
const DASHES = ['', '7 4', '2 3', '10 3 2 3'] as const;

export const MARKERS = ['circle', 'square', 'triangle', 'diamond', 'cross', 'triangleDown'] as const;
export type Marker = (typeof MARKERS)[number];

export interface OptionStyle {
  colour: string;
  /** SVG stroke-dasharray ('' = solid line). */
  dash: string;
  marker: Marker;
}

export function optionStyle(index: number): OptionStyle {
  return {
    colour: OPTION_COLOURS[index % OPTION_COLOURS.length],
    dash: DASHES[index % DASHES.length],
    marker: MARKERS[index % MARKERS.length],
  };
}

/** Style of option `index`: by its colour slot when `colourSlots` gives one, else by position. */
export function optionStyleOf(index: number, colourSlots?: readonly number[]): OptionStyle {
  return optionStyle(colourSlots?.[index] ?? index);
}
