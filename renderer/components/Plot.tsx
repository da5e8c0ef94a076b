import type Plotly from 'plotly.js-dist-min';
import { useEffect, useLayoutEffect, useRef } from 'react';
import type { FigureSpec } from '../../core/figures/theme';
import { figureHeight } from '../../core/figures/draw/figure-height';
import { forScreen } from '../../core/figures/draw/for-screen';
import { loadPlotly } from './load-plotly';

/** Plotly options shared by every figure on screen. */
export const PLOT_CONFIG = {
  displaylogo: false,
  responsive: true,
  modeBarButtonsToRemove: ['select2d', 'lasso2d', 'autoScale2d', 'toggleSpikelines', 'hoverClosestCartesian', 'hoverCompareCartesian'],
  toImageButtonOptions: { format: 'svg', scale: 1 },
} as const;

/** Figures this far outside the scrolled view are drawn ahead, CSS px. */
const AHEAD_PX = 200;

/** The nearest ancestor that scrolls vertically, or null (the window). */
function scrollParent(el: HTMLElement): HTMLElement | null {
  for (let p = el.parentElement; p; p = p.parentElement) {
    const o = getComputedStyle(p).overflowY;
    if (o === 'auto' || o === 'scroll') return p;
  }
  return null;
}

/**
 * Draws one figure spec (plain Plotly JSON from core/figures) at its height
 * (figureHeight) and the container's width, as SVG (forScreen). Only figures
 * in or near the view are drawn: a figure scrolled far away keeps its spec
 * and draws when it comes near (IntersectionObserver), so stepping from unit
 * to unit redraws what is on screen, not all a dozen figures of the page.
 * Redraws with Plotly.react when the spec changes; frees the plot on unmount.
 * data-drawn="true" once the current spec is drawn, "false" while it waits
 * (the end-to-end tests and the renderer benchmark wait on it).
 */
export function Plot({ spec, testId }: { spec: FigureSpec; testId?: string }) {
  const ref = useRef<HTMLDivElement>(null);
  const state = useRef<{ near: boolean; pending: FigureSpec | null; drawing: boolean }>({ near: false, pending: null, drawing: false });
  const height = figureHeight(spec);

  const drawPending = useRef<() => void>(() => undefined);
  drawPending.current = () => {
    const el = ref.current;
    const s = state.current;
    if (!el || !s.near || !s.pending || s.drawing) return;
    const next = s.pending;
    s.pending = null;
    s.drawing = true;
    const h = figureHeight(next);
    const fig = forScreen(next, { widthPx: el.clientWidth || 600, heightPx: h });
    void loadPlotly()
      .then((P) => P.react(el, fig.data as Plotly.Data[], { ...fig.layout, height: h, autosize: true } as Partial<Plotly.Layout>, PLOT_CONFIG as unknown as Partial<Plotly.Config>))
      .finally(() => {
        s.drawing = false;
        if (s.pending) drawPending.current();
        else if (ref.current) ref.current.dataset.drawn = 'true';
      });
  };

  // Layout effect: the figure is marked as not drawn in the same commit that brings the new spec.
  useLayoutEffect(() => {
    const el = ref.current;
    if (!el) return;
    el.dataset.drawn = 'false';
    state.current.pending = spec;
    drawPending.current();
  }, [spec]);

  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    // Observed against the scrolling area the figure sits in (the screen's content pane), so the
    // margin of AHEAD_PX applies there (against the window, the pane's clipping would hide it).
    const io = new IntersectionObserver(
      (entries) => {
        state.current.near = entries.some((e) => e.isIntersecting);
        drawPending.current();
      },
      { root: scrollParent(el), rootMargin: `${AHEAD_PX}px 0px` },
    );
    io.observe(el);
    return () => {
      io.disconnect();
      void loadPlotly().then((P) => P.purge(el));
    };
  }, []);

  return <div className="plot" ref={ref} data-testid={testId} style={{ height }} />;
}
