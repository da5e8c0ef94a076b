import type { Trace } from './trace';

/** Options of ticksAsPath. */
export interface TicksAsPathOptions {
  /**
   * Pixel columns across the x range (the plot's width in device pixels, or
   * more). Ticks of one row that fall in the same column are drawn once: at
   * that resolution they are one tick anyway. 0 = keep every tick (exports).
   */
  readonly columns: number;
  /** The x range the columns divide (the axis range); default: the data's. */
  readonly xRange?: readonly [number, number];
  /** Half the tick height, in y units (rows); default 0.4. */
  readonly halfHeight?: number;
}

/**
 * A raster trace (markers drawn as vertical ticks, "line-ns" symbols: one
 * point per spike at x = time, y = row) redrawn as ONE SVG path: a vertical
 * segment [y - h, y + h] per tick, separated by gaps (null), in the trace's
 * colour, 1 px wide. plotly.js draws one path element instead of one element
 * per spike (tens of thousands for a busy unit), so a raster of any size
 * draws in milliseconds without WebGL, and exports as a vector.
 *
 * Every spike stays visible: with `columns` set, ticks of the same row in the
 * same pixel column are merged into the first of them (its exact time is
 * kept); no tick is moved and no non-empty pixel is left empty. Rows are
 * recognised by equal y of consecutive points, which is how the raster
 * figures emit them (rows in order, times sorted within a row); unsorted
 * input merges less but is drawn correctly.
 *
 * Edge cases: an empty trace stays empty (its legend entry remains); NaN
 * points are skipped. Hover reports time and row of each tick end.
 */
export function ticksAsPath(trace: Trace, options: TicksAsPathOptions): Trace {
  const xs = (trace.x ?? []) as ArrayLike<number>;
  const ys = (trace.y ?? []) as ArrayLike<number>;
  const n = Math.min(xs.length, ys.length);
  const h = options.halfHeight ?? 0.4;
  let lo = options.xRange?.[0] ?? Infinity;
  let hi = options.xRange?.[1] ?? -Infinity;
  if (!options.xRange) {
    for (let i = 0; i < n; i++) {
      if (xs[i] < lo) lo = xs[i];
      if (xs[i] > hi) hi = xs[i];
    }
  }
  const width = options.columns > 0 && hi > lo ? (hi - lo) / options.columns : 0;
  const x: (number | null)[] = [];
  const y: (number | null)[] = [];
  let lastRow = NaN;
  let lastCol = NaN;
  for (let i = 0; i < n; i++) {
    const t = xs[i];
    const r = ys[i];
    if (t !== t || r !== r) continue;
    if (width > 0) {
      const col = Math.floor((t - lo) / width);
      if (r === lastRow && col === lastCol) continue;
      lastRow = r;
      lastCol = col;
    }
    x.push(t, t, null);
    y.push(r - h, r + h, null);
  }
  const marker = (trace.marker ?? {}) as { color?: unknown; line?: { color?: unknown } };
  const color = marker.color ?? marker.line?.color;
  const { marker: _m, ...rest } = trace;
  return {
    ...rest,
    type: 'scatter',
    mode: 'lines',
    x,
    y,
    connectgaps: false,
    line: { width: 1, simplify: false, ...(typeof color === 'string' ? { color } : {}) },
  };
}
