import type { Warning } from '../model/types';
import { assembleTable } from '../table/assemble-table';
import type { Column } from '../table/types';
import type { AnalysisResult } from './analyse-recording';
import type { StepResult } from './types';

/**
 * Joins the results of the analysis steps into one AnalysisResult: columns
 * (a later step's column replaces an earlier one of the same name), summaries
 * keyed by step name, warnings in step order, and units.csv's table in the
 * contract column order. The input is in the steps' list order, wherever each
 * step ran, so the result is the same whether the steps ran one after the
 * other (analyseRecording) or in several threads
 * (core/node/analyse-recording-threads.ts).
 */
export function combineStepResults(results: readonly { readonly name: string; readonly result: StepResult }[], unitCount: number): AnalysisResult {
  const columns = new Map<string, Column>();
  const summaries: Record<string, unknown> = {};
  const warnings: Warning[] = [];
  for (const { name, result } of results) {
    for (const c of result.columns) columns.set(c.name, c);
    if (result.summary) summaries[name] = result.summary;
    if (result.warnings) warnings.push(...result.warnings);
  }
  return { table: assembleTable([...columns.values()], unitCount), summaries, warnings };
}
