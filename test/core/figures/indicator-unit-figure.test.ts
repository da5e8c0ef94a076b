import { describe, expect, it } from 'vitest';
import { DEFAULTS, type Parameters } from '../../../core/defaults';
import { indicatorUnitFigure } from '../../../core/figures/indicator-unit-figure';
import { findKernelEntry } from '../../../core/kernels/kernel-library';
import { emptyPulses } from '../../../core/model/empty';
import type { Recording } from '../../../core/model/types';

function rec(spikes: number[]): Recording {
  return {
    units: [{ id: 'u1', spikeTimes: Float64Array.from(spikes), meta: {} }],
    pulses: emptyPulses(),
    events: { time: Float64Array.from([10, 20]), label: ['reward', 'reward'], trial: Float64Array.from([1, 2]), kind: ['', ''] },
    trials: { trial: Float64Array.from([1, 2]), start: Float64Array.from([8, 18]), stop: Float64Array.from([12, 22]), condition: ['standard', 'standard'], covariates: {} },
    span: [0, 30],
    spanSource: 'inputs',
    waveformSampleRateHz: NaN,
  };
}

const params = (over: Partial<Parameters['align']>): Parameters => ({ ...DEFAULTS, align: { ...DEFAULTS.align, ...over } });

describe('indicator unit figure', () => {
  it('peaks one kernel time-to-peak after a spike that follows every event by 0.5 s', () => {
    // One spike 0.5 s after each reward: the event-locked mean is the kernel itself, shifted by 0.5 s.
    // Check value: the double-exponential peak time t_peak = tr*td*ln(td/tr)/(td-tr) (REFERENCES.md, verified formula).
    const entry = findKernelEntry('jGCaMP8m')!;
    const tr = entry.tauRiseS;
    const td = entry.tauDecayS;
    const tPeak = (tr * td * Math.log(td / tr)) / (td - tr);
    const f = indicatorUnitFigure.build({ recording: rec([10.5, 20.5]), parameters: params({ windowStartS: -1, windowStopS: 2, predictRateHz: 1000, groupBy: 'condition' }), table: { columns: [], rowCount: 1 } }, 0)!;
    const mean = f.data[2] as { x: number[]; y: number[]; name: string };
    expect(mean.name).toBe('standard (n = 2)');
    let best = 0;
    for (let i = 1; i < mean.y.length; i++) if (mean.y[i] > mean.y[best]) best = i;
    // Tolerance: one sample (1 ms) of the 1 kHz grid.
    expect(Math.abs(mean.x[best] - (0.5 + tPeak))).toBeLessThanOrEqual(0.0011);
    // Peak height: the kernel's single-spike peak (dF/F when published), within the sampling error of 1 ms.
    expect(mean.y[best]).toBeCloseTo(entry.peakDff ?? 1, 2);
    expect(JSON.stringify(f.layout)).toContain(entry.peakDff === null ? 'single-spike peaks' : 'Predicted dF/F');
  });
  it('returns null for an unknown kernel or an absent event', () => {
    const ctx = { recording: rec([1]), table: { columns: [], rowCount: 1 } };
    expect(indicatorUnitFigure.build({ ...ctx, parameters: params({ kernel: 'no-such-sensor' }) }, 0)).toBeNull();
    expect(indicatorUnitFigure.build({ ...ctx, parameters: params({ event: 'jump' }) }, 0)).toBeNull();
  });
});
