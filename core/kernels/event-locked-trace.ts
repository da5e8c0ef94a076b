/** Event-locked segments of a uniformly sampled trace, and their average. */
export interface EventLockedTrace {
  /** Offsets from the event, s (column times). */
  readonly offsetS: Float64Array;
  /** rows x columns, row-major; NaN where the trace does not cover the offset. */
  readonly values: Float64Array;
  readonly rows: number;
  /** Mean over rows with a value at each column (NaN-skipping). */
  readonly mean: Float64Array;
  /** Standard error of that mean (SD with n - 1, over sqrt n); NaN below 2 rows. */
  readonly sem: Float64Array;
  /** Rows contributing at each column. */
  readonly count: Float64Array;
}

/**
 * Cuts a uniformly sampled trace (sample n at startS + n / rateHz) around each
 * alignment time at offsets startS_w + c / rateHz for c < round((stopS_w -
 * startS_w) * rateHz), reading between samples by linear interpolation, and
 * averages the segments. Used for measured photometry and predicted dF/F
 * alike, so the two are compared on identical offsets. NaN alignment times
 * give NaN rows (and do not count).
 */
export function eventLockedTrace(
  trace: ArrayLike<number>,
  trace0S: number,
  rateHz: number,
  alignTimes: ArrayLike<number>,
  windowStartS: number,
  windowStopS: number,
): EventLockedTrace {
  const cols = Math.max(0, Math.round((windowStopS - windowStartS) * rateHz));
  const rows = alignTimes.length;
  const offsetS = new Float64Array(cols);
  for (let c = 0; c < cols; c++) offsetS[c] = windowStartS + c / rateHz;
  const values = new Float64Array(rows * cols).fill(NaN);
  const n = trace.length;
  for (let r = 0; r < rows; r++) {
    const a = alignTimes[r];
    if (!Number.isFinite(a)) continue;
    for (let c = 0; c < cols; c++) {
      const u = (a + offsetS[c] - trace0S) * rateHz;
      if (u < 0 || u > n - 1) continue;
      const i = Math.min(Math.floor(u), n - 1);
      const f = u - i;
      values[r * cols + c] = f > 0 ? trace[i] + f * (trace[i + 1] - trace[i]) : trace[i];
    }
  }
  const mean = new Float64Array(cols);
  const sem = new Float64Array(cols);
  const count = new Float64Array(cols);
  for (let c = 0; c < cols; c++) {
    let k = 0;
    let s = 0;
    for (let r = 0; r < rows; r++) {
      const v = values[r * cols + c];
      if (v === v) {
        k++;
        s += v;
      }
    }
    const m = k ? s / k : NaN;
    let ss = 0;
    for (let r = 0; r < rows; r++) {
      const v = values[r * cols + c];
      if (v === v) ss += (v - m) * (v - m);
    }
    mean[c] = m;
    count[c] = k;
    sem[c] = k >= 2 ? Math.sqrt(ss / (k - 1) / k) : NaN;
  }
  return { offsetS, values, rows, mean, sem, count };
}
