/**
 * A line chart as an inline SVG string: no script, no external file, scales to the page width
 * (viewBox). Each series keeps its option's colour, dash pattern and marker (palette.ts), so the
 * chart still reads when printed in grey. The x axis is a day number or a list of categories
 * (age bands); the y axis starts at 0.
 */
import { escapeMarkup } from './escape.ts';
import type { Marker, OptionStyle } from './palette.ts';

export interface ChartSeries {
  name: string;
  style: OptionStyle;
  /** y value at x = 0, 1, 2, ... (a day, or the index of a category). */
  values: ArrayLike<number>;
}

export interface LineChartSpec {
  /** Read by screen readers and shown as a tooltip. */
  title: string;
  xLabel: string;
  yLabel: string;
  series: ChartSeries[];
  /** Labels of the x positions (age bands); absent = x is a day number. */
  categories?: string[];
  /** Horizontal lines, e.g. bed capacity. */
  referenceLines?: { value: number; label: string }[];
  yFormat: (value: number) => string;
}

const WIDTH = 720;
const HEIGHT = 300;
const MARGIN = { left: 64, right: 16, top: 14, bottom: 52 };
const MARKER_RADIUS = 3.6;
/** Markers per daily curve: enough to tell lines apart, few enough not to hide them. */
const MARKERS_PER_CURVE = 12;

/** "Nice" tick values covering [0, max]: steps of 1, 2, 2.5 or 5 times a power of ten. */
export function niceTicks(max: number, targetCount = 5): number[] {
  if (!(max > 0) || !Number.isFinite(max)) return [0, 1];
  const rough = max / targetCount;
  const power = 10 ** Math.floor(Math.log10(rough));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * power).find((s) => s >= rough) ?? 10 * power;
  const ticks: number[] = [];
  for (let k = 0; k * step < max + step * 1e-9; k++) ticks.push(k * step);
  if (ticks[ticks.length - 1] < max) ticks.push(ticks.length * step);
  return ticks;
}

const r1 = (x: number): string => (Math.round(x * 10) / 10).toString();

/** One marker shape centred on (x, y). */
export function markerSvg(marker: Marker, x: number, y: number, colour: string, r = MARKER_RADIUS): string {
  const paint = `fill="${colour}" stroke="${colour}"`;
  const poly = (points: [number, number][]) => `<polygon points="${points.map(([px, py]) => `${r1(x + px)},${r1(y + py)}`).join(' ')}" ${paint}/>`;
  switch (marker) {
    case 'circle':
      return `<circle cx="${r1(x)}" cy="${r1(y)}" r="${r}" ${paint}/>`;
    case 'square':
      return `<rect x="${r1(x - r * 0.85)}" y="${r1(y - r * 0.85)}" width="${r1(1.7 * r)}" height="${r1(1.7 * r)}" ${paint}/>`;
    case 'triangle':
      return poly([[0, -1.15 * r], [r, 0.75 * r], [-r, 0.75 * r]]);
    case 'triangleDown':
      return poly([[0, 1.15 * r], [r, -0.75 * r], [-r, -0.75 * r]]);
    case 'diamond':
      return poly([[0, -1.2 * r], [1.2 * r, 0], [0, 1.2 * r], [-1.2 * r, 0]]);
    case 'cross':
      return `<path d="M${r1(x - r)},${r1(y - r)}L${r1(x + r)},${r1(y + r)}M${r1(x - r)},${r1(y + r)}L${r1(x + r)},${r1(y - r)}" stroke="${colour}" stroke-width="2" fill="none"/>`;
  }
}

/** A short sample of an option's line and marker, for legends. */
export function legendSwatchSvg(style: OptionStyle): string {
  return (
    `<svg class="swatch" viewBox="0 0 36 12" width="36" height="12" aria-hidden="true">` +
    `<line x1="1" y1="6" x2="35" y2="6" stroke="${style.colour}" stroke-width="2" stroke-dasharray="${style.dash}"/>` +
    markerSvg(style.marker, 18, 6, style.colour, 3.4) +
    `</svg>`
  );
}

function xTicks(count: number, categories: string[] | undefined): { index: number; label: string }[] {
  if (categories !== undefined) return categories.map((label, index) => ({ index, label }));
  return niceTicks(Math.max(1, count - 1), 8)
    .filter((d) => d <= count - 1)
    .map((d) => ({ index: d, label: String(d) }));
}

export function lineChartSvg(spec: LineChartSpec): string {
  const count = Math.max(...spec.series.map((s) => s.values.length), 1);
  let yMax = 0;
  for (const s of spec.series) for (let k = 0; k < s.values.length; k++) if (Number.isFinite(s.values[k])) yMax = Math.max(yMax, s.values[k]);
  for (const line of spec.referenceLines ?? []) yMax = Math.max(yMax, line.value);
  const ticks = niceTicks(yMax);
  const top = ticks[ticks.length - 1];
  const plotW = WIDTH - MARGIN.left - MARGIN.right;
  const plotH = HEIGHT - MARGIN.top - MARGIN.bottom;
  const categorical = spec.categories !== undefined;
  // Categories sit in the middle of equal slots; days run edge to edge.
  const xOf = (k: number) => MARGIN.left + (categorical ? ((k + 0.5) * plotW) / count : (k * plotW) / Math.max(1, count - 1));
  const yOf = (v: number) => MARGIN.top + plotH - (v / top) * plotH;

  const parts: string[] = [];
  parts.push(
    `<svg class="chart" viewBox="0 0 ${WIDTH} ${HEIGHT}" role="img" aria-label="${escapeMarkup(spec.title)}" xmlns="http://www.w3.org/2000/svg">`,
    `<title>${escapeMarkup(spec.title)}</title>`,
    `<g class="grid" font-size="11" fill="#222">`,
  );
  for (const t of ticks) {
    const y = r1(yOf(t));
    parts.push(`<line x1="${MARGIN.left}" y1="${y}" x2="${WIDTH - MARGIN.right}" y2="${y}" stroke="#d4d4d4" stroke-width="0.8"/>`);
    parts.push(`<text x="${MARGIN.left - 6}" y="${y}" text-anchor="end" dominant-baseline="middle">${escapeMarkup(spec.yFormat(t))}</text>`);
  }
  const xt = xTicks(count, spec.categories);
  const rotate = categorical && count > 8;
  for (const { index, label } of xt) {
    const x = r1(xOf(index));
    const y = HEIGHT - MARGIN.bottom;
    parts.push(`<line x1="${x}" y1="${y}" x2="${x}" y2="${y + 4}" stroke="#222" stroke-width="0.8"/>`);
    parts.push(
      rotate
        ? `<text x="${x}" y="${y + 8}" text-anchor="end" dominant-baseline="middle" transform="rotate(-40 ${x} ${y + 8})">${escapeMarkup(label)}</text>`
        : `<text x="${x}" y="${y + 16}" text-anchor="middle">${escapeMarkup(label)}</text>`,
    );
  }
  parts.push(
    `<line x1="${MARGIN.left}" y1="${HEIGHT - MARGIN.bottom}" x2="${WIDTH - MARGIN.right}" y2="${HEIGHT - MARGIN.bottom}" stroke="#222" stroke-width="1"/>`,
    `<text x="${MARGIN.left + plotW / 2}" y="${HEIGHT - 6}" text-anchor="middle" font-size="12">${escapeMarkup(spec.xLabel)}</text>`,
    `<text x="14" y="${MARGIN.top + plotH / 2}" text-anchor="middle" font-size="12" transform="rotate(-90 14 ${MARGIN.top + plotH / 2})">${escapeMarkup(spec.yLabel)}</text>`,
    `</g>`,
  );
  for (const line of spec.referenceLines ?? []) {
    const y = r1(yOf(line.value));
    parts.push(
      `<line x1="${MARGIN.left}" y1="${y}" x2="${WIDTH - MARGIN.right}" y2="${y}" stroke="#000" stroke-width="1.2" stroke-dasharray="1 2"/>`,
      `<text x="${WIDTH - MARGIN.right - 4}" y="${r1(yOf(line.value) - 4)}" text-anchor="end" font-size="11" fill="#000">${escapeMarkup(line.label)}</text>`,
    );
  }
  const markerStep = categorical ? 1 : Math.max(1, Math.round(count / MARKERS_PER_CURVE));
  spec.series.forEach((s, k) => {
    const points: string[] = [];
    for (let d = 0; d < s.values.length; d++) points.push(`${r1(xOf(d))},${r1(yOf(s.values[d]))}`);
    parts.push(
      `<g class="series">`,
      `<polyline points="${points.join(' ')}" fill="none" stroke="${s.style.colour}" stroke-width="1.8" stroke-dasharray="${s.style.dash}" stroke-linejoin="round"/>`,
    );
    // Stagger the markers of successive options so that they do not sit on top of each other.
    const offset = categorical ? 0 : Math.round((k * markerStep) / Math.max(1, spec.series.length));
    for (let d = offset; d < s.values.length; d += markerStep) parts.push(markerSvg(s.style.marker, xOf(d), yOf(s.values[d]), s.style.colour));
    parts.push(`</g>`);
  });
  parts.push(`</svg>`);
  return parts.join('');
}
