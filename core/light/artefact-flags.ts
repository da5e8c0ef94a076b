import type { Parameters } from '../defaults';
import { formatNumber } from '../table/format-number';
import type { LightResponse } from './light-response';
import { ruleSaltP } from './rule-salt-p';
import { saltPChoice } from './salt-p-choice';

/**
 * Share of the excess spikes in one artefactJitterMs-wide slot from which an answer counts
 * as zero-jitter (own choice): a Gaussian answer puts ~8 % there at 1 ms jitter, ~26 % at
 * 0.3 ms, 50 % at ~0.15 ms; an artefact locked to onset and offset puts ~50 % in each.
 */
export const LOCKED_SHARE = 0.5;

/** The same for the offset window, where nothing else is expected (own choice). */
export const OFFSET_LOCKED_SHARE = 0.8;

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
 * - zero-jitter: >= LOCKED_SHARE of the excess spikes of the test window
 *   (>= 5) fall in one slot artefactJitterMs wide, or >= OFFSET_LOCKED_SHARE
 *   in two such slots >= 1 ms apart (events locked to onset and offset);
 * - too-early: mean first-spike latency or mean excess-spike latency below
 *   artefactMinLatencyMs;
 * - offset-locked: for pulses ending at or after the test window's end (an
 *   offset inside the window is the zero-jitter check's job), spikes in
 *   [offset, offset + offsetWindowMs) exceed the baseline (Poisson p <
 *   alphaCount, excess >= 10) and >= OFFSET_LOCKED_SHARE of it sits in one
 *   artefactJitterMs slot;
 * - waveform-mismatch: evoked vs spontaneous mean waveform r < minWaveformR.
 * The test-window flags need an answer there at all (the rule's SALT p < alphaSalt or
 * count p < alphaCount); the offset flag carries its own count test.
 * Common-practice thresholds.
 */
export function artefactFlags(r: LightResponse, waveformR: number, p: Parameters['light']): ArtefactFlag[] {
  const flags: ArtefactFlag[] = [];
  const responding = ruleSaltP(r, saltPChoice(r.saltWindows, p).kind) < p.alphaSalt || r.countP < p.alphaCount;
  const ms = (s: number) => formatNumber(s * 1000, 2);
  const slot = formatNumber(p.artefactJitterMs, 2);
  const excessSpikes = r.lockedShare === r.lockedShare ? r.evokedPerPulse * r.pulses - r.baselineHz * r.pulses * r.windowS : 0;
  if (responding && excessSpikes >= 5 && (r.lockedShare >= LOCKED_SHARE || r.lockedPairShare >= OFFSET_LOCKED_SHARE)) {
    const one = r.lockedShare >= LOCKED_SHARE;
    const share = Math.round(Math.min(1, one ? r.lockedShare : r.lockedPairShare) * 100);
    flags.push({ code: 'zero-jitter', text: `near-zero jitter (${share} % of the excess spikes within ${one ? `one ${slot} ms slot` : `two ${slot} ms slots`})` });
  }
  const lat = r.evokedLatencyS === r.evokedLatencyS ? Math.min(r.evokedLatencyS, r.meanLatencyS) : r.meanLatencyS;
  if (responding && lat * 1000 < p.artefactMinLatencyMs) flags.push({ code: 'too-early', text: `latency ${ms(lat)} ms, faster than light-gated spiking` });
  if (r.offsetCountP < p.alphaCount && r.offsetExcess >= 10 && r.offsetLockedShare >= OFFSET_LOCKED_SHARE) {
    flags.push({ code: 'offset-locked', text: `locked to pulse offset (${Math.round(Math.min(1, r.offsetLockedShare) * 100)} % of the excess within ${slot} ms)` });
  }
  if (responding && waveformR < p.minWaveformR) flags.push({ code: 'waveform-mismatch', text: `evoked waveform unlike spontaneous (r=${formatNumber(waveformR, 2)})` });
  return flags;
}
