// The screen's drawing of figure specs (core/figures/draw): rasters as one SVG path
// with ticks merged per pixel column, min-max decimation of long lines, heights.
// Checked against brute-force recomputation on the same inputs (pixel occupancy
// and per-column extrema computed directly here), and with fast-check properties.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { FigureSpec } from '../../../../core/figures/theme';
import { decimateLine } from '../../../../core/figures/draw/decimate-line';
import { figureHeight, ONE_PANEL_PX, STACKED_PX } from '../../../../core/figures/draw/figure-height';
import { forScreen } from '../../../../core/figures/draw/for-screen';
import { isTickTrace } from '../../../../core/figures/draw/is-tick-trace';
import { ticksAsPath } from '../../../../core/figures/draw/ticks-as-path';

/** Ticks of a path trace as [x, row] (segment midpoints). */
function ticksOf(t: Record<string, unknown>): [number, number][] {
  const x = t.x as (number | null)[];
  const y = t.y as (number | null)[];
  const out: [number, number][] = [];
  for (let i = 0; i + 2 < x.length + 1; i += 3) out.push([x[i]!, (y[i]! + y[i + 1]!) / 2]);
  return out;
}

const raster = (rows: number[][]): Record<string, unknown> => {
  const x: number[] = [];
  const y: number[] = [];
  rows.forEach((r, k) => r.forEach((t) => (x.push(t), y.push(k))));
  return { type: 'scattergl', mode: 'markers', name: 'standard (n = 3)', x, y, xaxis: 'x', yaxis: 'y2', marker: { symbol: 'line-ns-open', size: 5, color: '#0072B2' } };
};

describe('ticksAsPath', () => {
  it('draws each tick as a vertical segment of the given half height, separated by gaps, in the trace colour', () => {
    const t = ticksAsPath(raster([[0.1, 0.5], [], [-0.2]]), { columns: 0, halfHeight: 0.4 });
    expect(t.type).toBe('scatter');
    expect(t.mode).toBe('lines');
    expect(t.x).toEqual([0.1, 0.1, null, 0.5, 0.5, null, -0.2, -0.2, null]);
    expect(t.y).toEqual([-0.4, 0.4, null, -0.4, 0.4, null, 1.6, 2.4, null]);
    expect(t.line).toEqual({ width: 1, simplify: false, color: '#0072B2' });
    expect(t.name).toBe('standard (n = 3)');
    expect(t.yaxis).toBe('y2');
    expect('marker' in t).toBe(false);
  });

  it('merges ticks of one row within one pixel column, keeping the first exact time; other rows and columns untouched', () => {
    // x range [0, 1] in 10 columns: 0.01 and 0.05 share column 0; 0.11 is column 1; row 1's 0.02 is its own.
    const t = ticksAsPath(raster([[0.01, 0.05, 0.11], [0.02]]), { columns: 10, xRange: [0, 1] });
    expect(ticksOf(t)).toEqual([[0.01, 0], [0.11, 0], [0.02, 1]]);
  });

  it('property: every occupied (row, pixel column) keeps exactly one tick, inside that pixel, and nothing else is drawn', () => {
    fc.assert(
      fc.property(fc.array(fc.array(fc.double({ min: -3, max: 2, noNaN: true }), { maxLength: 60 }), { minLength: 1, maxLength: 20 }), fc.integer({ min: 1, max: 400 }), (rows, columns) => {
        const sorted = rows.map((r) => [...r].sort((a, b) => a - b));
        const lo = -3;
        const hi = 2;
        const w = (hi - lo) / columns;
        const t = ticksAsPath(raster(sorted), { columns, xRange: [lo, hi] });
        const drawn = ticksOf(t).map(([x, r]) => `${r}:${Math.floor((x - lo) / w)}`);
        const occupied = new Set(sorted.flatMap((r, k) => r.map((x) => `${k}:${Math.floor((x - lo) / w)}`)));
        expect(new Set(drawn).size).toBe(drawn.length);
        expect(new Set(drawn)).toEqual(occupied);
      }),
      { numRuns: 200 },
    );
  });

  it('keeps an empty raster empty, and skips NaN points', () => {
    expect(ticksAsPath(raster([[]]), { columns: 100 }).x).toEqual([]);
    expect(ticksAsPath({ ...raster([[0.1]]), x: [0.1, NaN], y: [0, 0] }, { columns: 0 }).x).toEqual([0.1, 0.1, null]);
  });
});

describe('decimateLine', () => {
  const line = (x: number[], y: (number | null)[]) => ({ type: 'scattergl', mode: 'lines', x, y });

  it('keeps first, lowest, highest and last point of each pixel column, in order', () => {
    // 20 points over [0, 19], 2 columns of width 9.5: column 0 = x 0..9, column 1 = x 10..19.
    const x = Array.from({ length: 20 }, (_, i) => i);
    const y = [5, 3, 9, 1, 4, 4, 4, 8, 2, 6, 0, 0, 7, 0, 0, -1, 0, 0, 0, 2];
    const d = decimateLine(line(x, y), 2);
    expect(d.x).toEqual([0, 2, 3, 9, 10, 12, 15, 19]);
    expect(d.y).toEqual([5, 9, 1, 6, 0, 7, -1, 2]);
  });

  it('property: per pixel column, the same minimum and maximum as the full trace, at most 4 points per column', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { minLength: 50, maxLength: 2000 }), fc.integer({ min: 2, max: 12 }), (y, columns) => {
        const x = y.map((_, i) => i / 10);
        const d = decimateLine(line(x, y), columns);
        const dx = d.x as number[];
        const dy = d.y as number[];
        if (y.length <= 4 * columns) return expect(d.y).toBe(y);
        const w = (x[x.length - 1] - x[0]) / columns;
        const col = (v: number) => Math.min(columns - 1, Math.floor((v - x[0]) / w));
        for (let c = 0; c < columns; c++) {
          const full = y.filter((_, i) => col(x[i]) === c);
          const kept = dy.filter((_, i) => col(dx[i]) === c);
          if (full.length === 0) continue;
          expect(Math.min(...kept)).toBe(Math.min(...full));
          expect(Math.max(...kept)).toBe(Math.max(...full));
          expect(kept.length).toBeLessThanOrEqual(4);
        }
        expect(dx[0]).toBe(x[0]);
        expect(dx[dx.length - 1]).toBe(x[x.length - 1]);
      }),
      { numRuns: 100 },
    );
  });

  it('leaves short traces and traces not sorted by x as they are; keeps gaps as gaps', () => {
    const short = line([0, 1, 2], [1, 2, 3]);
    expect(decimateLine(short, 100)).toBe(short);
    const unsorted = line(Array.from({ length: 100 }, (_, i) => (i * 37) % 100), Array.from({ length: 100 }, () => 1));
    expect(decimateLine(unsorted, 2)).toBe(unsorted);
    const x = Array.from({ length: 100 }, (_, i) => i);
    const y: (number | null)[] = x.map((i) => (i === 50 ? null : i));
    const d = decimateLine(line(x, y), 4);
    expect((d.y as (number | null)[]).filter((v) => v === null)).toHaveLength(1);
    expect((d.x as (number | null)[]).indexOf(null)).toBeGreaterThan(0);
  });
});

describe('forScreen', () => {
  const spec = (data: Record<string, unknown>[], layout: Record<string, unknown> = {}): FigureSpec => ({ data, layout: { margin: { t: 36, b: 48 }, xaxis: { range: [-3, 2] }, yaxis2: { domain: [0.45, 1] }, ...layout } });

  it('never leaves a WebGL trace: rasters become paths, other scattergl traces SVG scatter', () => {
    const s = spec([raster([[0.1], [0.2]]), { type: 'scattergl', mode: 'markers', x: [1], y: [2] }, { type: 'bar', x: [1], y: [2] }]);
    const out = forScreen(s, { widthPx: 800, heightPx: 460 });
    expect(out.data.map((d) => [d.type, d.mode])).toEqual([['scatter', 'lines'], ['scatter', 'markers'], ['bar', undefined]]);
    expect(out.data.some((d) => d.type === 'scattergl')).toBe(false);
    expect(out.layout).toBe(s.layout);
  });

  it('sizes ticks to at least 3 px when many rows share a panel, and 0.8 rows otherwise', () => {
    // 600 rows on (460 - 84) * 0.55 = 206.8 px: 0.345 px per row, so half height = 1.5 / 0.345 rows.
    const many = raster(Array.from({ length: 600 }, () => [0]));
    const t = forScreen(spec([many]), { widthPx: 800, heightPx: 460 }).data[0];
    const half = ((t.y as number[])[1] - (t.y as number[])[0]) / 2;
    expect(half).toBeCloseTo(1.5 / (((460 - 84) * 0.55) / 600), 9);
    const few = forScreen(spec([raster([[0], [0], [0]])]), { widthPx: 800, heightPx: 460 }).data[0];
    expect(((few.y as number[])[1] - (few.y as number[])[0]) / 2).toBeCloseTo(0.4, 12);
  });

  it('merges at twice the width in pixels over the axis range on screen, and keeps every tick for exports', () => {
    // Two ticks 1e-4 s apart in a 5 s range: the same column at 800 px (1,600 columns), both kept for an export.
    const s = spec([raster([[0, 1e-4]])]);
    expect(ticksOf(forScreen(s, { widthPx: 800, heightPx: 460 }).data[0])).toHaveLength(1);
    expect(ticksOf(forScreen(s, { widthPx: 800, heightPx: 460, exact: true }).data[0])).toHaveLength(2);
  });

  it('decimates long scattergl lines to SVG', () => {
    const x = Array.from({ length: 100_000 }, (_, i) => i / 100);
    const out = forScreen(spec([{ type: 'scattergl', mode: 'lines', x, y: x.map(Math.sin) }]), { widthPx: 500, heightPx: 300 }).data[0];
    expect(out.type).toBe('scatter');
    expect((out.x as number[]).length).toBeLessThanOrEqual(4 * 1000);
  });

  it('isTickTrace: markers-only traces with line-ns symbols', () => {
    expect(isTickTrace(raster([[1]]))).toBe(true);
    expect(isTickTrace({ type: 'scatter', mode: 'markers', marker: { symbol: 'line-ns' } })).toBe(true);
    expect(isTickTrace({ type: 'scatter', mode: 'lines+markers', marker: { symbol: 'line-ns' } })).toBe(false);
    expect(isTickTrace({ type: 'scattergl', mode: 'markers', marker: { symbol: 'circle' } })).toBe(false);
  });
});

describe('figureHeight', () => {
  it('takes the layout height, else one or two stacked panels', () => {
    expect(figureHeight({ data: [], layout: { height: 900 } })).toBe(900);
    expect(figureHeight({ data: [], layout: { yaxis: { title: 'x' } } })).toBe(ONE_PANEL_PX);
    expect(figureHeight({ data: [], layout: { yaxis: { domain: [0, 0.4] }, yaxis2: { domain: [0.5, 1] } } })).toBe(STACKED_PX);
  });
});
