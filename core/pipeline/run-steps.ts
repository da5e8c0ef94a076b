import type { Parameters } from '../defaults';
import type { Recording } from '../model/types';
import type { Column } from '../table/types';
import type { AnalysisStep, StepResult } from './types';

/**
 * Runs analysis steps one after the other on a recording; each step sees the
 * columns of the steps before it in this list. Returns each step's result
 * with its name, in list order (combineStepResults joins them).
 */
export function runSteps(recording: Recording, parameters: Parameters, steps: readonly AnalysisStep[]): { name: string; result: StepResult }[] {
  const columns = new Map<string, Column>();
  return steps.map((step) => {
    const result = step.run({ recording, parameters, columns });
    for (const c of result.columns) columns.set(c.name, c);
    return { name: step.name, result };
  });
}
