/**
 * Sums over age bands of a band-major daily series (value for day d, band i at [d * bands + i]),
 * for the engine's death series and for every view that draws all ages together.
 */

/** sum_i series[d][i] for each day d. */
export function totalOverBands(series: Float64Array, bands: number): Float64Array {
  const days = Math.floor(series.length / bands);
  const out = new Float64Array(days);
  for (let d = 0; d < days; d++) {
    let acc = 0;
    for (let i = 0; i < bands; i++) acc += series[d * bands + i];
    out[d] = acc;
  }
  return out;
}

/** sum_i scale_i x series[d][i] for each day d. */
export function weightedBandSum(series: Float64Array, bands: number, scale: ArrayLike<number>): Float64Array {
  const days = series.length / bands;
  const out = new Float64Array(days);
  for (let d = 0; d < days; d++) {
    let acc = 0;
    for (let i = 0; i < bands; i++) acc += series[d * bands + i] * scale[i];
    out[d] = acc;
  }
  return out;
}
