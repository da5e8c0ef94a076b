import type { FigureSpec } from '../../core/figures/theme';

let supported: boolean | null = null;

/** True when this page can draw WebGL (checked once). Headless or GPU-less browsers often cannot. */
export function webGlSupported(): boolean {
  if (supported === null) {
    try {
      const c = document.createElement('canvas');
      // Software rendering (no GPU, headless) counts as missing: plotly's WebGL traces fail or crawl there.
      supported = !!c.getContext('webgl', { failIfMajorPerformanceCaveat: true });
    } catch {
      supported = false;
    }
  }
  return supported;
}

/** Points above which a figure keeps its WebGL traces (when WebGL works): SVG slows down past this. */
export const WEBGL_MIN_POINTS = 20000;

/** Points in a figure's traces (length of each trace's x). */
export function pointCount(spec: FigureSpec): number {
  let n = 0;
  for (const d of spec.data) n += Array.isArray(d.x) ? d.x.length : 0;
  return n;
}

/**
 * What the screen draws: small figures always as SVG traces (crisp, reliable
 * without a GPU, and some software-GL browsers refuse WebGL even after a
 * context test passes); large ones keep WebGL where this page has it.
 */
export function forScreen(spec: FigureSpec): FigureSpec {
  return pointCount(spec) > WEBGL_MIN_POINTS && webGlSupported() ? spec : withSvgTraces(spec);
}

/**
 * The same figure with WebGL traces (scattergl) drawn as SVG traces
 * (scatter): used where WebGL is missing, and for SVG exports, where WebGL
 * traces would come out as a bitmap. Only the trace type changes.
 */
export function withSvgTraces(spec: FigureSpec): FigureSpec {
  if (!spec.data.some((d) => d.type === 'scattergl')) return spec;
  return { ...spec, data: spec.data.map((d) => (d.type === 'scattergl' ? { ...d, type: 'scatter' } : d)) };
}
