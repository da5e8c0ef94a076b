/**
 * Benchmark of alignment and kernels on the reference session size (DESIGN.md
 * section 7): 1,000 units over 2 h (~20 M spikes), 600 trials. Prints
 * timings; asserts nothing (tests never time).
 *
 * Run: npx tsx bench/align-bench.ts
 */
import { computePsth } from '../core/align/compute-psth';
import { extractRaster } from '../core/align/extract-raster';
import { populationMatrix } from '../core/align/population-matrix';
import { trialAnchors } from '../core/align/trial-anchors';
import { warpedPsth } from '../core/align/warped-psth';
import { warpSpikes } from '../core/align/warp-spikes';
import { warpTemplate } from '../core/align/warp-template';
import { findKernelEntry } from '../core/kernels/kernel-library';
import { predictTrace } from '../core/kernels/predict-trace';
import { predictTrains } from '../core/kernels/predict-trains';
import { emptyPulses } from '../core/model/empty';
import type { Recording } from '../core/model/types';
import { Rng } from '../core/random/rng';
import { renewalTrain } from '../core/sim/renewal-train';

const UNITS = 1000;
const DURATION_S = 7200;
const TRIALS = 600;

function time<T>(label: string, f: () => T): T {
  const t0 = performance.now();
  const out = f();
  console.log(`${label.padEnd(58)} ${(performance.now() - t0).toFixed(1).padStart(9)} ms`);
  return out;
}

const rng = new Rng(1);
const trains = time(`simulate ${UNITS} units x ${DURATION_S} s`, () =>
  Array.from({ length: UNITS }, () => renewalTrain(rng, 0.5 + 4.5 * rng.uniform(), 0, DURATION_S, 1, 0.002)),
);
console.log(`spikes: ${trains.reduce((s, t) => s + t.length, 0).toLocaleString('en')}`);
const trialLen = DURATION_S / TRIALS;
const reward = Float64Array.from({ length: TRIALS }, (_, k) => k * trialLen + 4 + 2 * rng.uniform());
const opts = { windowStartS: -3, windowStopS: 2, binMs: 10 };

time(`population matrix ${UNITS} x ${TRIALS} trials, 500 bins, Gaussian 25 ms`, () =>
  populationMatrix(trains, reward, { ...opts, smoothing: { kind: 'gaussian', widthMs: 25 } }),
);
time(`population matrix, z-scored on [-3, -2) s`, () =>
  populationMatrix(trains, reward, { ...opts, normalise: 'zscore', baselineStartS: -3, baselineStopS: -2 }),
);
time(`computePsth with SEM, every unit (${UNITS} calls)`, () => {
  for (const t of trains) computePsth(t, reward, opts);
});
time(`computePsth, 1 unit, bootstrap 1000 resamples`, () => computePsth(trains[0], reward, { ...opts, band: 'bootstrap', nBoot: 1000 }));
time(`rasters, every unit`, () => {
  for (const t of trains) extractRaster(t, reward, -3, 2);
});

const rec: Recording = {
  units: [],
  pulses: emptyPulses(),
  events: {
    time: Float64Array.from({ length: 2 * TRIALS }, (_, i) => (i % 2 ? reward[i >> 1] : (i >> 1) * trialLen + 0.5)),
    label: Array.from({ length: 2 * TRIALS }, (_, i) => (i % 2 ? 'reward' : 'tone_on')),
    trial: new Float64Array(2 * TRIALS).fill(NaN),
    kind: new Array(2 * TRIALS).fill(''),
  },
  trials: {
    trial: Float64Array.from({ length: TRIALS }, (_, k) => k + 1),
    start: Float64Array.from({ length: TRIALS }, (_, k) => k * trialLen),
    stop: Float64Array.from({ length: TRIALS }, (_, k) => (k + 1) * trialLen),
    condition: new Array(TRIALS).fill('standard'),
    covariates: {},
  },
  span: [0, DURATION_S],
  spanSource: 'inputs',
  waveformSampleRateHz: NaN,
};
time(`time-warp tone_on -> reward, every unit, 100 ms bins`, () => {
  const a = trialAnchors(rec, ['tone_on', 'reward']);
  const tpl = warpTemplate(a);
  for (const t of trains) warpedPsth(warpSpikes(t, a, tpl, 1, 1), a, tpl, 100);
});

const e = findKernelEntry('jGCaMP8m')!;
const k = { kind: 'double-exponential' as const, tauRiseS: e.tauRiseS, tauDecayS: e.tauDecayS, peakDff: e.peakDff ?? 1 };
time(`predict dF/F, 1 unit, 2 h at 1 kHz (exact IIR)`, () => predictTrace(trains[0], k, { startS: 0, rateHz: 1000, length: DURATION_S * 1000 }));
time(`predict population average, ${UNITS} units, 2 h at 30 Hz`, () => predictTrains(trains, k, { startS: 0, rateHz: 30, length: DURATION_S * 30 }, 1 / UNITS));
const sampled = { kind: 'sampled' as const, values: Float64Array.from({ length: 2000 }, (_, j) => Math.exp(-j / 300) - Math.exp(-j / 20)), sampleRateHz: 1000, gain: 1 };
time(`predict 1 unit, sampled 2 s kernel, 2 h at 1 kHz (FFT)`, () => predictTrace(trains[0], sampled, { startS: 0, rateHz: 1000, length: DURATION_S * 1000 }));
