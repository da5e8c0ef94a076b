import type { Parameters } from '../defaults';
import { formatNumber } from '../table/format-number';
import type { LightResponse } from './light-response';

/** Share of the excess spikes in one artefactJitterMs-wide slot above which an answer counts as zero-jitter (own choice). */
export const LOCKED_SHARE = 0.8;

/** One reason to suspect a light artefact: a stable code and a sentence part. */
export interface ArtefactFlag {
  readonly code: 'zero-jitter' | 'too-early' | 'offset-locked' | 'waveform-mismatch';
  readonly text: string;
}

/**
 * Signs that a "response" may be a photoelectric (Becquerel) artefact rather
 * than light-evoked spikes (REFERENCES.md: artefacts are locked to light onset
 * and offset with near-zero jitter and have a waveform unlike the unit's
 * spontaneous spikes):
 * - zero-jitter: >= 80 % of the excess spikes of the test window (>= 5) fall
 *   in one slot artefactJitterMs wide (a 1-ms-jitter answer puts ~15 % there);
 * - too-early: excess spikes earlier on average than artefactMinLatencyMs;
 * - offset-locked: for pulses ending at or after the test window's end (an
 *   offset inside the window is the zero-jitter check's job), spikes in
 *   [offset, offset + offsetWindowMs) exceed the baseline (Poisson p <
 *   alphaCount, excess >= 10) and >= 80 % of the excess sits in one
 *   artefactJitterMs slot;
 * - waveform-mismatch: evoked vs spontaneous mean waveform r < minWaveformR.
 * The test-window flags need an answer there at all (SALT p < alphaSalt or
 * count p < alphaCount); the offset flag carries its own count test.
 * Common-practice thresholds.
 */
export function artefactFlags(r: LightResponse, waveformR: number, p: Parameters['light']): ArtefactFlag[] {
  const flags: ArtefactFlag[] = [];
  const responding = r.salt.p < p.alphaSalt || r.countP < p.alphaCount;
  const ms = (s: number) => formatNumber(s * 1000, 2);
  const slot = formatNumber(p.artefactJitterMs, 2);
  const excessSpikes = r.lockedShare === r.lockedShare ? r.evokedPerPulse * r.pulses - r.baselineHz * r.pulses * r.windowS : 0;
  if (responding && r.lockedShare >= LOCKED_SHARE && excessSpikes >= 5) {
    flags.push({ code: 'zero-jitter', text: `near-zero jitter (${Math.round(Math.min(1, r.lockedShare) * 100)} % of the excess spikes within ${slot} ms)` });
  }
  const lat = r.evokedLatencyS === r.evokedLatencyS ? r.evokedLatencyS : r.meanLatencyS;
  if (responding && lat * 1000 < p.artefactMinLatencyMs) flags.push({ code: 'too-early', text: `latency ${ms(lat)} ms, faster than light-gated spiking` });
  if (r.offsetCountP < p.alphaCount && r.offsetExcess >= 10 && r.offsetLockedShare >= LOCKED_SHARE) {
    flags.push({ code: 'offset-locked', text: `locked to pulse offset (${Math.round(Math.min(1, r.offsetLockedShare) * 100)} % of the excess within ${slot} ms)` });
  }
  if (responding && waveformR < p.minWaveformR) flags.push({ code: 'waveform-mismatch', text: `evoked waveform unlike spontaneous (r=${formatNumber(waveformR, 2)})` });
  return flags;
}
