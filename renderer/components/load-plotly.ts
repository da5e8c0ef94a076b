import type PlotlyModule from 'plotly.js-dist-min';

let loading: Promise<typeof PlotlyModule> | null = null;

/**
 * plotly.js, loaded on first use as its own chunk: the Start screen and the
 * unit table appear without waiting for the plotting library (about 4.5 MB).
 */
export function loadPlotly(): Promise<typeof PlotlyModule> {
  loading ??= import('plotly.js-dist-min').then((m) => m.default);
  return loading;
}
