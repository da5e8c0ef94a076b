/**
 * Pins every light default (DESIGN.md section 4; sources beside each value in
 * core/defaults.ts: REFERENCES.md for SALT's window, bins and thresholds, "common practice"
 * or "own choice" for the rest). A change here is a change of the published rule.
 */
import { describe, expect, it } from 'vitest';
import { DEFAULTS } from '../../../core/defaults';

describe('DEFAULTS.light', () => {
  it('holds the documented values', () => {
    expect(DEFAULTS.light).toEqual({
      windowStartMs: 0,
      windowEndMs: 10,
      saltBinMs: 1,
      alphaSalt: 0.01,
      saltP: 'auto',
      maxLatencyMs: 6,
      minWaveformR: 0.9,
      saltBaselineMs: 1000,
      saltMinWindows: 15,
      saltMinPulseFraction: 0.8,
      lightGuardMs: 100,
      alphaCount: 0.01,
      minEvokedReliability: 0.1,
      artefactJitterMs: 0.2,
      artefactMinLatencyMs: 1,
      offsetWindowMs: 2,
      waveformPreMs: 1,
      waveformPostMs: 2,
      waveformChannels: 4,
      waveformMaxSpikes: 500,
      waveformMinSpikes: 10,
      trustNullSimulations: 200,
      trustPowerSimulations: 40,
      trustBudget: 10000000,
      trustPowerLatencyMs: 4,
      trustPowerJitterMs: 1,
      trustPower: 0.8,
      seed: 1,
    });
  });
  it('gives SALT enough windows for p < alphaSalt (REFERENCES.md: resolution 1/#null)', () => {
    const j = DEFAULTS.light.saltBaselineMs / (DEFAULTS.light.windowEndMs - DEFAULTS.light.windowStartMs);
    expect(1 / ((j * (j - 1)) / 2)).toBeLessThan(DEFAULTS.light.alphaSalt / 10);
    const m = DEFAULTS.light.saltMinWindows;
    expect(1 / ((m * (m - 1)) / 2)).toBeLessThan(DEFAULTS.light.alphaSalt);
    // The calibrated p (>= 1 / (J + 1)) can pass alphaSalt with the full baseline: 1/101 < 0.01.
    expect(1 / (j + 1)).toBeLessThan(DEFAULTS.light.alphaSalt);
  });
});
