/** Unit quality metrics and the quality screen (public barrel). */
export { autocorrelogram } from './autocorrelogram';
export { cv2 } from './cv2';
export { hillContamination, type Contamination } from './hill-contamination';
export { isiViolations, type IsiViolations } from './isi-violations';
export { localVariation } from './local-variation';
export { presenceRatio } from './presence-ratio';
export { qualityStep } from './quality-step';
export { QUALITY_VERDICTS, qualityVerdict, type QualityVerdict } from './quality-verdict';
export { driftSegments, type DriftSegments } from './drift-segments';
export { rateDrift, type RateDrift } from './rate-drift';
export { unitQuality, type UnitQuality } from './unit-quality';
export { waveformShape, type WaveformShape } from './waveform-shape';
