/**
 * Shared look of every figure (renderer screens, exported SVG/PNG and the HTML
 * report), so a verdict has one colour everywhere.
 *
 * Palette: Okabe & Ito (2008), "Color Universal Design", the colour-blind-safe
 * set of eight colours (hex values as published). Verdict colours always
 * appear with their text (and a marker shape), never alone.
 */
export const OKABE_ITO = {
  black: '#000000',
  orange: '#E69F00',
  skyBlue: '#56B4E9',
  bluishGreen: '#009E73',
  yellow: '#F0E442',
  blue: '#0072B2',
  vermillion: '#D55E00',
  reddishPurple: '#CC79A7',
} as const;

/** Colour and marker of each verdict word. */
export const VERDICT_STYLE: Readonly<Record<string, { color: string; symbol: string }>> = {
  tagged: { color: OKABE_ITO.blue, symbol: 'circle' },
  borderline: { color: OKABE_ITO.orange, symbol: 'diamond' },
  untagged: { color: '#7f7f7f', symbol: 'circle-open' },
  up: { color: OKABE_ITO.vermillion, symbol: 'triangle-up' },
  down: { color: OKABE_ITO.blue, symbol: 'triangle-down' },
  flat: { color: '#7f7f7f', symbol: 'line-ew' },
  excited: { color: OKABE_ITO.vermillion, symbol: 'triangle-up' },
  suppressed: { color: OKABE_ITO.blue, symbol: 'triangle-down' },
  none: { color: '#7f7f7f', symbol: 'line-ew' },
  pass: { color: OKABE_ITO.bluishGreen, symbol: 'circle' },
  review: { color: OKABE_ITO.reddishPurple, symbol: 'x' },
};

/** Colours for conditions / groups, in order (Okabe & Ito without black and yellow). */
export const GROUP_COLORS = [
  OKABE_ITO.blue,
  OKABE_ITO.vermillion,
  OKABE_ITO.bluishGreen,
  OKABE_ITO.reddishPurple,
  OKABE_ITO.orange,
  OKABE_ITO.skyBlue,
] as const;

/** Base Plotly layout every figure starts from (plain JSON, no plotly import). */
export const BASE_LAYOUT = {
  font: { family: 'system-ui, -apple-system, "Segoe UI", Roboto, sans-serif', size: 12, color: '#222' },
  paper_bgcolor: '#ffffff',
  plot_bgcolor: '#ffffff',
  margin: { l: 60, r: 20, t: 36, b: 48 },
  showlegend: true,
  legend: { orientation: 'h', y: -0.2 },
} as const;

/** A figure: plain Plotly data + layout JSON, renderable by plotly.js anywhere. */
export interface FigureSpec {
  readonly data: readonly Record<string, unknown>[];
  readonly layout: Record<string, unknown>;
}
