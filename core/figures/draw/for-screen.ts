import type { FigureSpec } from '../theme';
import { decimateLine } from './decimate-line';
import { isTickTrace } from './is-tick-trace';
import { ticksAsPath } from './ticks-as-path';
import type { Trace } from './trace';

/** The size a figure is drawn at, CSS px. */
export interface ScreenSize {
  readonly widthPx: number;
  readonly heightPx: number;
  /** Keep every tick and line point (SVG/PNG exports, which may be enlarged): no merging, no decimation. */
  readonly exact?: boolean;
}

/** Device pixels per CSS pixel assumed for merging (2 = sharp on high-density screens too). */
const PIXEL_DENSITY = 2;
/** Smallest tick height on screen, CSS px: below this a tick of a dense raster reads as a dot or fades out (neighbouring rows may overlap, as tick markers of this size did). */
const MIN_TICK_PX = 3;
/** Rasters with more ticks than this are drawn as one path even when they came as SVG traces. */
const PATH_MIN_TICKS = 2000;

/**
 * What the screen draws for a figure spec (plain Plotly JSON from core): only
 * SVG traces, never WebGL. A page cannot know beforehand whether plotly.js's
 * WebGL traces will draw (headless and GPU-less Chromium passes a WebGL
 * context test, then plotly.js shows "WebGL is not supported" in place of the
 * raster), and the figures do not need it:
 *  - rasters (tick-marker traces) become one SVG path each, with ticks of a
 *    row merged per pixel column (ticksAsPath), so every spike stays visible
 *    and drawing costs milliseconds whatever the spike count; ticks are at
 *    least MIN_TICK_PX tall however many rows share the panel;
 *  - long line traces are reduced by min-max decimation per pixel column
 *    (decimateLine), which keeps every peak and trough;
 *  - every other scattergl trace is drawn as the same SVG scatter trace.
 * The layout is unchanged. Exports pass `exact` (every tick and point kept;
 * rasters still as one path).
 */
export function forScreen(spec: FigureSpec, size: ScreenSize): FigureSpec {
  const columns = size.exact ? 0 : Math.max(1, Math.ceil(size.widthPx * PIXEL_DENSITY));
  const layout = spec.layout as Record<string, { range?: unknown; domain?: unknown } | undefined> & { margin?: { t?: number; b?: number } };
  // Rows per y axis of the tick traces, to size ticks.
  const rowSpan = new Map<string, [number, number]>();
  for (const d of spec.data) {
    if (!isTickTrace(d)) continue;
    const key = axisKey('y', d.yaxis);
    const ys = (d.y ?? []) as ArrayLike<number>;
    const span = rowSpan.get(key) ?? [Infinity, -Infinity];
    for (let i = 0; i < ys.length; i++) {
      if (ys[i] < span[0]) span[0] = ys[i];
      if (ys[i] > span[1]) span[1] = ys[i];
    }
    rowSpan.set(key, span);
  }
  const plotPx = Math.max(40, size.heightPx - (layout.margin?.t ?? 36) - (layout.margin?.b ?? 48));
  const data = spec.data.map((d): Trace => {
    const n = Array.isArray(d.x) ? d.x.length : 0;
    if (isTickTrace(d) && (d.type === 'scattergl' || n > PATH_MIN_TICKS)) {
      const yKey = axisKey('y', d.yaxis);
      const span = rowSpan.get(yKey)!;
      const rows = Math.max(1, span[1] - span[0] + 1);
      const dom = domainOf(layout[yKey]?.domain);
      const pxPerRow = (plotPx * (dom[1] - dom[0])) / rows;
      const xRange = rangeOf(layout[axisKey('x', d.xaxis)]?.range);
      return ticksAsPath(d, { columns, halfHeight: Math.max(0.4, MIN_TICK_PX / 2 / pxPerRow), ...(xRange ? { xRange } : {}) });
    }
    if (String(d.mode ?? '').includes('lines') && (d.type === 'scattergl' || d.type === 'scatter')) {
      const out = decimateLine(d, columns);
      return out.type === 'scattergl' ? { ...out, type: 'scatter' } : out;
    }
    return d.type === 'scattergl' ? { ...d, type: 'scatter' } : d;
  });
  return { data, layout: spec.layout };
}

/** Layout key of a trace's axis: "x" -> "xaxis", "y2" -> "yaxis2". */
function axisKey(letter: 'x' | 'y', ref: unknown): string {
  const s = typeof ref === 'string' ? ref : letter;
  return `${letter}axis${s.slice(1)}`;
}

function domainOf(v: unknown): [number, number] {
  return Array.isArray(v) && v.length === 2 && typeof v[0] === 'number' && typeof v[1] === 'number' && v[1] > v[0] ? [v[0], v[1]] : [0, 1];
}

function rangeOf(v: unknown): [number, number] | null {
  return Array.isArray(v) && v.length === 2 && typeof v[0] === 'number' && typeof v[1] === 'number' && v[1] > v[0] ? [v[0], v[1]] : null;
}
