export type { Scalar, Unit, Pulses, Events, Trials, Recording, Warning } from './types';
export { emptyPulses, emptyEvents, emptyTrials } from './empty';
