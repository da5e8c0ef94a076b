import type { Parameters } from '../defaults';
import type { Recording, Warning } from '../model/types';
import type { Column, UnitTable } from '../table/types';
import { assembleTable } from '../table/assemble-table';
import { STEPS } from './steps';
import type { AnalysisStep } from './types';

export interface AnalysisResult {
  readonly table: UnitTable;
  /** Per-step session summaries, keyed by step name (written to run.json). */
  readonly summaries: Readonly<Record<string, unknown>>;
  readonly warnings: readonly Warning[];
}

/**
 * Runs every analysis step on a recording and assembles units.csv's table.
 * Deterministic: the same recording and parameters give the same result.
 */
export function analyseRecording(
  recording: Recording,
  parameters: Parameters,
  steps: readonly AnalysisStep[] = STEPS,
): AnalysisResult {
  const columns = new Map<string, Column>();
  const summaries: Record<string, unknown> = {};
  const warnings: Warning[] = [];
  for (const step of steps) {
    const res = step.run({ recording, parameters, columns });
    for (const c of res.columns) columns.set(c.name, c);
    if (res.summary) summaries[step.name] = res.summary;
    if (res.warnings) warnings.push(...res.warnings);
  }
  return { table: assembleTable([...columns.values()], recording.units.length), summaries, warnings };
}
