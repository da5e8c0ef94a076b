import type { FigureSpec } from '../theme';

/** Height of a figure with one panel, px: readable at laptop size with a legend below. */
export const ONE_PANEL_PX = 340;
/** Height of a figure with panels stacked on y (raster over PSTH, reliability over latency), px. */
export const STACKED_PX = 460;

/**
 * The height a figure is drawn at on screen and in exports: its layout.height
 * when the figure sets one (heatmaps grow with the units), otherwise by the
 * number of stacked y panels (y axes with their own domain).
 */
export function figureHeight(spec: FigureSpec): number {
  const h = Number(spec.layout.height);
  if (Number.isFinite(h) && h > 0) return h;
  let panels = 0;
  for (const [k, v] of Object.entries(spec.layout)) {
    if (/^yaxis\d*$/.test(k) && v && typeof v === 'object' && Array.isArray((v as { domain?: unknown }).domain)) panels++;
  }
  return panels >= 2 ? STACKED_PX : ONE_PANEL_PX;
}
