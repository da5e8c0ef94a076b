import type { Parameters } from '../defaults';
import type { Recording, Warning } from '../model/types';
import type { UnitTable } from '../table/types';
import { combineStepResults } from './combine-step-results';
import { runSteps } from './run-steps';
import { STEPS } from './steps';
import type { AnalysisStep } from './types';

export interface AnalysisResult {
  readonly table: UnitTable;
  /** Per-step session summaries, keyed by step name (written to run.json). */
  readonly summaries: Readonly<Record<string, unknown>>;
  readonly warnings: readonly Warning[];
}

/**
 * Runs every analysis step on a recording, one after the other, and
 * assembles units.csv's table. Deterministic: the same recording and
 * parameters give the same result. (The CLI runs the self-contained steps in
 * a second thread on large sessions: core/node/analyse-recording-threads.ts;
 * same result.)
 */
export function analyseRecording(
  recording: Recording,
  parameters: Parameters,
  steps: readonly AnalysisStep[] = STEPS,
): AnalysisResult {
  return combineStepResults(runSteps(recording, parameters, steps), recording.units.length);
}
