import type { Parameters } from '../defaults';
import type { Recording, Warning } from '../model/types';
import type { Column } from '../table/types';

/** What every analysis step receives. */
export interface StepContext {
  readonly recording: Recording;
  readonly parameters: Parameters;
  /** Columns produced by earlier steps, by name (e.g. a later step may read `tag`). */
  readonly columns: ReadonlyMap<string, Column>;
}

/** What an analysis step returns. */
export interface StepResult {
  /** Per-unit columns, one value per unit in recording order. */
  readonly columns: readonly Column[];
  /** Session-level results written to run.json under the step's name. */
  readonly summary?: Readonly<Record<string, unknown>>;
  /** Counted, benign problems (go to run.json). */
  readonly warnings?: readonly Warning[];
}

/** One analysis of the `run` pipeline. Pure: same inputs, same outputs. */
export interface AnalysisStep {
  /** Short id, also the key of its summary in run.json. */
  readonly name: string;
  run(ctx: StepContext): StepResult;
}
