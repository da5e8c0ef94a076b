import type Plotly from 'plotly.js-dist-min';
import { useEffect, useRef } from 'react';
import type { FigureSpec } from '../../core/figures/theme';
import { loadPlotly } from './load-plotly';
import { forScreen } from './webgl-fallback';

/** Plotly options shared by every figure on screen. */
export const PLOT_CONFIG = {
  displaylogo: false,
  responsive: true,
  modeBarButtonsToRemove: ['select2d', 'lasso2d', 'autoScale2d', 'toggleSpikelines', 'hoverClosestCartesian', 'hoverCompareCartesian'],
  toImageButtonOptions: { format: 'svg', scale: 1 },
} as const;

/**
 * Draws one figure spec (plain Plotly JSON from core/figures). Redraws with
 * Plotly.react when the spec changes; frees the plot on unmount. Marks itself
 * data-drawn="true" once drawn (the end-to-end tests wait on it).
 */
export function Plot({ spec, testId }: { spec: FigureSpec; testId?: string }) {
  const ref = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    el.dataset.drawn = 'false';
    let live = true;
    const fig = forScreen(spec);
    void loadPlotly()
      .then((P) => (live ? P.react(el, fig.data as Plotly.Data[], fig.layout as Partial<Plotly.Layout>, PLOT_CONFIG as unknown as Partial<Plotly.Config>) : null))
      .then(() => {
        if (live) el.dataset.drawn = 'true';
      });
    return () => {
      live = false;
    };
  }, [spec]);
  useEffect(() => {
    const el = ref.current;
    return () => {
      if (el) void loadPlotly().then((P) => P.purge(el));
    };
  }, []);
  return <div className="plot" ref={ref} data-testid={testId} />;
}
