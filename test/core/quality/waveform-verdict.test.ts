import { describe, expect, it } from 'vitest';
import { DEFAULTS } from '../../../core/defaults';
import type { Recording } from '../../../core/model/types';
import { emptyEvents, emptyPulses, emptyTrials } from '../../../core/model/empty';
import { analyseRecording } from '../../../core/pipeline/analyse-recording';
import { basicStep } from '../../../core/pipeline/basic-step';
import { qualityStep } from '../../../core/quality/quality-step';
import { qualityVerdict } from '../../../core/quality/quality-verdict';
import { unitQuality } from '../../../core/quality/unit-quality';
import { waveformShape } from '../../../core/quality/waveform-shape';
import { Rng } from '../../../core/random/rng';

describe('waveformShape (trough-to-peak and half-width; common practice definitions)', () => {
  // Hand-made waveform at 30 kHz (1 sample = 1/30 ms): baseline 0, trough -100 at sample 6,
  // later peak 40 at sample 10 -> trough-to-peak 4 samples = 0.13333 ms.
  // Half depth -50 is met exactly at samples 5 and 7 -> half-width 2 samples = 0.066667 ms.
  const w = Float64Array.of(0, 0, 0, 0, 0, -50, -100, -50, 0, 20, 40, 20, 0, 0, 0);
  it('measures a hand-made waveform', () => {
    const s = waveformShape(w, 30000);
    expect(s.troughToPeakMs).toBeCloseTo(4 / 30, 12);
    expect(s.halfWidthMs).toBeCloseTo(2 / 30, 12);
  });
  it('interpolates half-depth crossings linearly and subtracts the baseline', () => {
    // offset +7 everywhere (baseline from the first fifth of samples); half depth -40 of trough -80
    // left crossing between samples 1 (0) and 2 (-80): 1.5; right between 2 and 3 (-20): 2 + 40/60
    const s = waveformShape(Float64Array.of(7, 7, -73, -13, 17, 7, 7, 7, 7, 7), 1000);
    expect(s.halfWidthMs).toBeCloseTo(2 + 40 / 60 - 1.5, 12);
    expect(s.troughToPeakMs).toBeCloseTo(2, 12);
  });
  it('flips a waveform whose main phase is positive', () => {
    const flipped = Float64Array.from(w, (v) => -v);
    const s = waveformShape(flipped, 30000);
    expect(s.troughToPeakMs).toBeCloseTo(4 / 30, 12);
  });
  it('returns NaN for flat, short or rate-less waveforms', () => {
    expect(waveformShape(new Float64Array(10), 30000).troughToPeakMs).toBeNaN();
    expect(waveformShape(Float64Array.of(0, -1), 30000).halfWidthMs).toBeNaN();
    expect(waveformShape(w, NaN).halfWidthMs).toBeNaN();
    // trough on the last sample: no peak after it
    expect(waveformShape(Float64Array.of(0, 0, 0, 0, 0, -5), 1000).troughToPeakMs).toBeNaN();
  });
});

const poissonTrain = (rng: Rng, rateHz: number, t0: number, t1: number, deadS = 0.002) => {
  const out: number[] = [];
  let t = t0 + rng.exponential() / rateHz;
  while (t < t1) {
    out.push(t);
    t += deadS + rng.exponential() / rateHz;
  }
  return Float64Array.from(out);
};

describe('qualityVerdict (thresholds of core/defaults.ts, common practice)', () => {
  const q = DEFAULTS.quality;
  it('passes a steady, clean unit and names its numbers', () => {
    const rng = new Rng(11);
    const m = unitQuality(poissonTrain(rng, 5, 0, 600), [0, 600], q);
    // a 2 ms dead time after each spike leaves no ISI under 1.5 ms
    expect(m.isiViolationCount).toBe(0);
    expect(m.contamination).toBe(0);
    expect(m.presenceRatio).toBe(1);
    const v = qualityVerdict(m, q);
    expect(v.verdict).toBe('pass');
    expect(v.reason).toMatch(/^contamination 0, presence ratio 1, rate drift CV 0\.\d+ within thresholds$/);
  });
  it('sends a unit that stops half way to review with every failed screen named', () => {
    const rng = new Rng(12);
    const m = unitQuality(poissonTrain(rng, 5, 0, 300), [0, 600], q);
    const v = qualityVerdict(m, q);
    expect(v.verdict).toBe('review');
    expect(v.reason).toMatch(/presence ratio 0\.5 < 0\.9/);
    // segment rates ~5,5,5,5,5,0,0,0,0,0 -> CV ~ 1
    expect(v.reason).toMatch(/rate drift CV 1(\.\d+)? > 0\.5|rate drift CV 0\.9\d+ > 0\.5/);
  });
  it('reports contamination >= 0.5 in words when the estimate is undefined', () => {
    // 200 spikes in pairs 1 ms apart: 100 violations over 100 s -> radicand 0.25 - 100*100/(2*0.0015*40000) < 0
    const t: number[] = [];
    for (let i = 0; i < 100; i++) t.push(i + 0.1, i + 0.101);
    const m = unitQuality(Float64Array.from(t), [0, 100], q);
    expect(m.contaminationAtLeastHalf).toBe(true);
    expect(m.contamination).toBeNaN();
    const v = qualityVerdict(m, q);
    expect(v.verdict).toBe('review');
    expect(v.reason).toMatch(/^contamination >= 0\.5 \(100 ISIs < 1\.5 ms/);
  });
  it('does not judge units with too few spikes', () => {
    const m = unitQuality(Float64Array.of(1, 2, 3), [0, 10], q);
    expect(qualityVerdict(m, q)).toEqual({ verdict: 'review', reason: 'too few spikes to judge (3 < 100)' });
  });
  it('ignores spikes outside the recording span', () => {
    const m = unitQuality(Float64Array.of(-5, 1, 2, 3, 50), [0, 10], q);
    expect(m.nSpikes).toBe(3);
    expect(m.rateHz).toBeCloseTo(0.3, 12);
  });
});

describe('qualityStep in the pipeline', () => {
  it('adds the quality columns after the contract columns and counts verdicts', () => {
    const rng = new Rng(3);
    const rec: Recording = {
      units: [
        { id: 'a', spikeTimes: poissonTrain(rng, 4, 0, 500), meta: {}, waveformMean: Float64Array.of(0, 0, 0, 0, 0, -50, -100, -50, 0, 20, 40, 20, 0, 0, 0) },
        { id: 'b', spikeTimes: Float64Array.of(1, 2), meta: {} },
      ],
      pulses: emptyPulses(),
      events: emptyEvents(),
      trials: emptyTrials(),
      span: [0, 500],
      spanSource: 'inputs',
      waveformSampleRateHz: 30000,
    };
    const res = analyseRecording(rec, DEFAULTS, [basicStep, qualityStep]);
    const names = res.table.columns.map((c) => c.name);
    expect(names).toEqual([
      'unit', 'n_spikes', 'rate_hz',
      'isi_violations', 'isi_violation_fraction', 'contamination', 'presence_ratio', 'lv', 'cv2',
      'rate_drift_cv', 'rate_slope_hz_per_min', 'trough_to_peak_ms', 'half_width_ms', 'quality', 'quality_reason',
    ]);
    const col = (n: string) => res.table.columns.find((c) => c.name === n)!;
    expect(col('quality').values).toEqual(['pass', 'review']);
    expect(col('trough_to_peak_ms').values[0]).toBeCloseTo(4 / 30, 12);
    expect(col('trough_to_peak_ms').values[1]).toBeNaN();
    expect(res.summaries.quality).toMatchObject({ counts: { pass: 1, review: 1 } });
  });
});
