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

/**
 * The same figure with WebGL traces (scattergl) drawn as SVG traces
 * (scatter): used where WebGL is missing, and for SVG exports, where WebGL
 * traces would come out as a bitmap. Only the trace type changes.
 */
export function withSvgTraces(spec: FigureSpec): FigureSpec {
  if (!spec.data.some((d) => d.type === 'scattergl')) return spec;
  return { ...spec, data: spec.data.map((d) => (d.type === 'scattergl' ? { ...d, type: 'scatter' } : d)) };
}
