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
  /**
   * True when the step reads only the recording's spikes, pulses, events,
   * trials, behaviour samples and span, and the parameters: never
   * `recording.raw` (a file reader that cannot cross threads) and never an
   * earlier step's columns. Such steps may run in another thread, on a copy of
   * the recording without `raw` (core/node/analyse-recording-threads.ts); the
   * result must not depend on where the step runs.
   */
  readonly selfContained?: boolean;
  run(ctx: StepContext): StepResult;
}
