/**
 * Number formatting for the printed report. Fixed and locale-independent (a point for decimals,
 * a comma between thousands), so the same scenario prints the same text on every machine, and
 * tests can format the engine's numbers the same way to find them in the printed page.
 */

/** A minus sign that survives copying as text: plain ASCII hyphen-minus. */
const MINUS = '-';

/** Groups the digits of a whole number in thousands: 1234567 -> "1,234,567". */
export function groupThousands(whole: number): string {
  const rounded = Math.round(whole);
  const sign = rounded < 0 ? MINUS : '';
  return sign + Math.abs(rounded).toFixed(0).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
}

/** Persons (or beds), rounded to whole persons: "1,234". */
export function formatPersons(x: number): string {
  return groupThousands(x);
}

/** A signed count of persons: "+1,234", "-56", "0". */
export function formatSignedPersons(x: number): string {
  const text = groupThousands(x);
  return Math.round(x) > 0 ? `+${text}` : text;
}

/** A fraction shown as a percentage: 0.8923 -> "89.2%". */
export function formatPercent(fraction: number, digits = 1): string {
  return `${(100 * fraction).toFixed(digits)}%`;
}

/** A plain decimal with `digits` decimals. */
export function formatDecimal(x: number, digits: number): string {
  return x.toFixed(digits);
}

/** R (a reproduction number): two decimals. */
export function formatR(r: number): string {
  return formatDecimal(r, 2);
}

/** Growth rate per day, three decimals with an explicit sign: "+0.147", "-0.021". */
export function formatGrowthRate(perDay: number): string {
  const text = formatDecimal(perDay, 3);
  return perDay > 0 && text !== '0.000' ? `+${text}` : text;
}

/** Doubling time in days, or why there is none: "4.7", "halves in 9.3", "flat". */
export function formatDoubling(doublingTimeDays: number | null, halvingTimeDays: number | null): string {
  if (doublingTimeDays !== null) return formatDecimal(doublingTimeDays, 1);
  if (halvingTimeDays !== null) return `halves in ${formatDecimal(halvingTimeDays, 1)}`;
  return 'flat';
}

/** A multiplier on contacts as a percentage of usual: 0 -> "0%", 1.2 -> "120%", 0.333 -> "33.3%". */
export function formatMultiplier(multiplier: number): string {
  const percent = 100 * multiplier;
  const digits = Number.isInteger(Math.round(percent * 10) / 10) ? 0 : 1;
  return `${percent.toFixed(digits)}%`;
}

/** A short axis value: 0, 950, 12k, 1.5M. */
export function formatAxisValue(x: number): string {
  const a = Math.abs(x);
  if (a >= 1e6) return `${trimZeros((x / 1e6).toFixed(a >= 1e7 ? 0 : 1))}M`;
  if (a >= 1e4) return `${trimZeros((x / 1e3).toFixed(0))}k`;
  if (a >= 1e3) return `${trimZeros((x / 1e3).toFixed(1))}k`;
  if (a === 0 || a >= 10) return trimZeros(x.toFixed(0));
  return trimZeros(x.toPrecision(2));
}

function trimZeros(text: string): string {
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}
