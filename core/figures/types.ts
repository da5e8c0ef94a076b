import type { Parameters } from '../defaults';
import type { Recording } from '../model/types';
import type { UnitTable } from '../table/types';
import type { FigureSpec } from './theme';

/** What a figure builder is given: the session, its parameters and its unit table. */
export interface FigureContext {
  readonly recording: Recording;
  readonly parameters: Parameters;
  readonly table: UnitTable;
}

/**
 * A figure every screen, export and the HTML report can draw. build() is pure:
 * it recomputes what it needs from the recording (cheap per unit) and returns
 * plain Plotly JSON, or null when the figure does not apply (e.g. no pulses).
 */
export interface UnitFigure {
  readonly id: string;
  readonly title: string;
  build(ctx: FigureContext, unitIndex: number): FigureSpec | null;
}

export interface PopulationFigure {
  readonly id: string;
  readonly title: string;
  build(ctx: FigureContext): FigureSpec | null;
}
