import type { AnalysisStep } from './types';
import { basicStep } from './basic-step';
import { qualityStep } from '../quality/quality-step';

/**
 * The analyses of `run`, in order. To add an analysis: write a step
 * (core/<area>/<name>-step.ts) returning its columns, and list it here.
 * Later steps can read earlier steps' columns through ctx.columns.
 */
export const STEPS: readonly AnalysisStep[] = [
  basicStep,
  qualityStep,
];
