/**
 * Value axes of the app's line charts. On a log scale, counts of people or beds are shown from a
 * floor of one (person, bed) when the curves reach ten or more, else from two decades below the
 * highest power of ten reached; ticks are labelled only at powers of ten, as plain grouped
 * numbers ("0.01", "1", "1,000"), never in chart.js's long default form.
 */

const grouped = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });

/** Lowest value of a log axis for curves whose largest value is `peak` (persons or beds). */
export function logAxisFloor(peak: number): number {
  if (!(peak > 0) || !Number.isFinite(peak)) return 1;
  if (peak >= 10) return 1;
  return 10 ** (Math.floor(Math.log10(peak)) - 2);
}

/** Label of a log-axis tick: the value at powers of ten, '' (no label) in between. */
export function logTickLabel(value: number): string {
  if (!(value > 0)) return '';
  const exponent = Math.log10(value);
  if (Math.abs(exponent - Math.round(exponent)) > 1e-9) return '';
  return value >= 1 ? grouped.format(value) : String(Number(value.toPrecision(1)));
}
