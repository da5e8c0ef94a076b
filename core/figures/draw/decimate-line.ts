import type { Trace } from './trace';

/**
 * A long line trace (a sampled trace: predicted or measured indicator signal,
 * rate over the session) reduced for the screen by min-max decimation: the x
 * range is cut into `columns` pixel columns and each column keeps, in their
 * original order, its first, lowest, highest and last point. The drawn line
 * then covers exactly the same pixels' vertical extent in every column as the
 * full trace (every peak and trough stays visible), with at most 4 points per
 * column. Common practice for drawing long signals (e.g. oscilloscope and
 * audio-waveform displays).
 *
 * Applies only when x is non-decreasing and there are more than 4 x columns
 * points; otherwise the trace is returned as it is. Gaps (null / NaN y) are
 * kept as one gap point, so separate segments stay separate.
 */
export function decimateLine(trace: Trace, columns: number): Trace {
  const xs = (trace.x ?? []) as ArrayLike<number | null>;
  const ys = (trace.y ?? []) as ArrayLike<number | null>;
  const n = Math.min(xs.length, ys.length);
  if (columns <= 0 || n <= 4 * columns) return trace;
  let lo = NaN;
  let hi = NaN;
  for (let i = 0; i < n; i++) {
    const v = xs[i];
    if (v === null || v !== v) continue;
    if (v < hi) return trace; // not sorted by x
    if (lo !== lo) lo = v;
    hi = v;
  }
  if (!(hi > lo)) return trace;
  const width = (hi - lo) / columns;
  const keep: number[] = [];
  let col = -1;
  let first = -1;
  let min = -1;
  let max = -1;
  let last = -1;
  const flush = () => {
    if (first < 0) return;
    for (const i of [...new Set([first, min, max, last])].sort((a, b) => a - b)) keep.push(i);
    first = -1;
  };
  for (let i = 0; i < n; i++) {
    const x = xs[i];
    const y = ys[i];
    if (x === null || x !== x || y === null || y !== y) {
      flush();
      if (keep.length === 0 || keep[keep.length - 1] !== -1) keep.push(-1);
      continue;
    }
    const c = Math.min(columns - 1, Math.floor((x - lo) / width));
    if (c !== col) {
      flush();
      col = c;
    }
    if (first < 0) {
      first = min = max = last = i;
      continue;
    }
    if (y < (ys[min] as number)) min = i;
    if (y > (ys[max] as number)) max = i;
    last = i;
  }
  flush();
  const x = keep.map((i) => (i < 0 ? null : xs[i]));
  const y = keep.map((i) => (i < 0 ? null : ys[i]));
  return { ...trace, x, y };
}
