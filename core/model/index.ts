export type { Scalar, Unit, Pulses, Events, Trials, Recording, Warning, RawSource } from './types';
export { emptyPulses, emptyEvents, emptyTrials } from './empty';
