/** Indicator kernels: library, prediction of dF/F from spikes, comparison with measured traces. */
export type { Kernel, KernelTiming, SampleGrid, KernelEntry, PublishedKinetics, MatchedPair, SourceStatus } from './types';
export { doubleExponentialPeakTime } from './double-exponential-peak-time';
export { kernelValue } from './kernel-value';
export { kernelTiming } from './kernel-timing';
export { solveDoubleExponential } from './solve-double-exponential';
export { KERNEL_LIBRARY, findKernelEntry } from './kernel-library';
export { fft } from './fft';
export { convolveDirect } from './convolve-direct';
export { convolveFft } from './convolve-fft';
export { predictTrace } from './predict-trace';
export { predictTraceDirect } from './predict-trace-direct';
export { predictTrialWindows } from './predict-trial-windows';
export { predictTrains } from './predict-trains';
export { hillSaturation } from './hill-saturation';
export { resampleLinear } from './resample-linear';
export { fitAmplitudeOffset, type AmplitudeFit } from './fit-amplitude-offset';
export { gridSearchKernel, type KernelGridSearch } from './grid-search-kernel';
export { eventLockedTrace, type EventLockedTrace } from './event-locked-trace';
