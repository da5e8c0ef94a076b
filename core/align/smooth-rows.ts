/**
 * Smooths each row of a row-major rows x cols matrix with discrete weights
 * (smoothingKernel): out[i] = sum_j w[j] x[i - (j - center)] / (sum of the
 * w[j] whose bin lies inside the row). Renormalising at the edges keeps a
 * flat row flat up to the window's ends (common practice for PSTHs; the
 * alternative, zero padding, bends the ends down). NaN propagates.
 * Returns a new array; the identity kernel returns a copy.
 */
export function smoothRows(values: Float64Array, rows: number, cols: number, weights: Float64Array, center: number): Float64Array {
  const out = new Float64Array(rows * cols);
  if (weights.length === 1) {
    out.set(values.subarray(0, rows * cols));
    return out;
  }
  const m = weights.length;
  for (let r = 0; r < rows; r++) {
    const base = r * cols;
    for (let i = 0; i < cols; i++) {
      let s = 0;
      let wsum = 0;
      for (let j = 0; j < m; j++) {
        const src = i - (j - center);
        if (src < 0 || src >= cols) continue;
        s += weights[j] * values[base + src];
        wsum += weights[j];
      }
      out[base + i] = s / wsum;
    }
  }
  return out;
}
