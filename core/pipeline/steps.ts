import type { AnalysisStep } from './types';
import { basicStep } from './basic-step';
import { lightStep } from '../light/light-step';
import { rampStep } from '../classify/ramp-step';
import { jumpStep } from '../classify/jump-step';
import { clusterStep } from '../classify/cluster-step';
import { qualityStep } from '../quality/quality-step';

/**
 * The analyses of `run`, in order. To add an analysis: write a step
 * (core/<area>/<name>-step.ts) returning its columns, and list it here.
 * Later steps can read earlier steps' columns through ctx.columns.
 */
export const STEPS: readonly AnalysisStep[] = [
  basicStep,
  lightStep,
  rampStep,
  jumpStep,
  clusterStep,
  qualityStep,
];
