/**
 * Number formatting for the printed tables. Fixed, locale-independent: a point for decimals
 * and a comma between thousands, so output is the same on every machine.
 */

/** Groups the digits of a whole number in thousands: 1234567 -> "1,234,567". */
export function groupThousands(whole: number): string {
  const sign = whole < 0 ? '-' : '';
  const digits = Math.abs(whole).toFixed(0);
  return sign + digits.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
}

/** Persons, rounded to whole persons: "1,234". */
export function persons(x: number): string {
  return groupThousands(Math.round(x));
}

/** A fraction shown as a percentage with `digits` decimals: 0.8923 -> "89.2%". */
export function percent(fraction: number, digits = 1): string {
  return `${(100 * fraction).toFixed(digits)}%`;
}

/** A plain decimal with `digits` decimals. */
export function decimal(x: number, digits: number): string {
  return x.toFixed(digits);
}

/** Doubling time in days, or why there is none: "4.7", "halves in 9.3", "flat". */
export function doublingText(doublingTimeDays: number | null, halvingTimeDays: number | null): string {
  if (doublingTimeDays !== null) return decimal(doublingTimeDays, 1);
  if (halvingTimeDays !== null) return `halves in ${decimal(halvingTimeDays, 1)}`;
  return 'flat';
}
