import type { Events, Pulses, Trials } from './types';

/** An empty pulse table (a session without light stimulation). */
export function emptyPulses(): Pulses {
  return {
    onset: new Float64Array(0),
    duration: new Float64Array(0),
    train: new Int32Array(0),
    frequencyHz: new Float64Array(0),
    powerMw: new Float64Array(0),
  };
}

/** An empty event table. */
export function emptyEvents(): Events {
  return { time: new Float64Array(0), label: [], trial: new Float64Array(0), kind: [] };
}

/** An empty trial table. */
export function emptyTrials(): Trials {
  return {
    trial: new Float64Array(0),
    start: new Float64Array(0),
    stop: new Float64Array(0),
    condition: [],
    covariates: {},
  };
}
