/** Light identification: the public barrel of core/light. */
export { lightSchedule, type LightSchedule } from './light-schedule';
export { lightResponse, createLightScratch, type LightResponse, type LightScratch } from './light-response';
export { saltTest, createSaltScratch, type SaltResult } from './salt-test';
export { saltBaseline, type SaltBaseline } from './salt-baseline';
export { modifiedJsDistance } from './modified-js-distance';
export { artefactFlags, LOCKED_SHARE, OFFSET_LOCKED_SHARE, type ArtefactFlag } from './artefact-flags';
export { tagVerdict, type TagVerdict } from './tag-verdict';
export { meanWaveform, type MeanWaveform } from './mean-waveform';
export { waveformMatch, type WaveformMatch } from './waveform-match';
export { lightFreeSpikes } from './light-free-spikes';
export { simulationIntervals } from './simulation-intervals';
export { ruleTrust, POWER_GRID, type RuleTrust } from './rule-trust';
export { trustCell } from './trust-cell';
export { selectKth } from './select-kth';
export { lightStep } from './light-step';
export { saltPChoice, type SaltPChoice } from './salt-p-choice';
export { ruleSaltP } from './rule-salt-p';
export { formatP } from './format-p';
