/**
 * Notes on values that are allowed but unusual, shown beside the field (the value is kept).
 * R0 of respiratory infections seen in practice lies roughly between 1 and 10 (common practice;
 * measles, among the most transmissible, is usually quoted at 12-18, from memory).
 */

/** Above this R0 the field carries a note. */
export const HIGH_R0 = 10;

/** A note for an R0 that is accepted but unusual, or null when it is in the usual range. */
export function r0Note(r0: number): string | null {
  const shown = Number(r0.toPrecision(4));
  if (r0 > HIGH_R0) return `R0 = ${shown} is far above what respiratory infections usually show (about 1 to ${HIGH_R0}); check the source before relying on it.`;
  if (r0 < 1) return `R0 = ${shown} is below 1: no epidemic grows from the seed infections, whatever the measures.`;
  return null;
}
