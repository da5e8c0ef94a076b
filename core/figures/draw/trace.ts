/** One Plotly trace as plain JSON (core/figures/theme.ts FigureSpec data). */
export type Trace = Readonly<Record<string, unknown>>;
