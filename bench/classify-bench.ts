/**
 * Benchmark of the response classification (issue 5) on the reference
 * session size of DESIGN.md section 7: 1,000 units, 2 h, ~20 M spikes,
 * 600 trials (30 % probe trials with a forward or backward jump).
 * Spike trains are stationary gamma renewal trains (rates log-normal around
 * 2.8 Hz); timing does not depend on the responses. A sampled behavioural
 * variable `progress` (0 -> 1 over the 4 s before each reward, 50 Hz over the
 * whole session, 360,000 samples) times the progress ramp. Prints wall-clock
 * and CPU milliseconds (CPU time is the fairer figure on a shared machine).
 *
 * Run: npx tsx bench/classify-bench.ts   (UNITS=300 for fewer units, REPS=1 for cold runs only)
 */
import { classifyJumps, classifyProgressRamps, classifyRamps, clusterUnits } from '../core/classify';
import { clusterStep } from '../core/classify/cluster-step';
import { jumpStep } from '../core/classify/jump-step';
import { rampStep } from '../core/classify/ramp-step';
import { DEFAULTS } from '../core/defaults';
import { emptyPulses } from '../core/model/empty';
import type { Recording } from '../core/model/types';
import { Rng } from '../core/random/rng';
import { renewalTrain } from '../core/sim/renewal-train';

const N_UNITS = Number(process.env.UNITS ?? 1000);
const N_TRIALS = 600;
const DURATION_S = 7200;

function session(): Recording {
  const rng = new Rng(2026);
  const trialLen = DURATION_S / N_TRIALS;
  const start = new Float64Array(N_TRIALS);
  const stop = new Float64Array(N_TRIALS);
  const condition: string[] = [];
  const ev: { t: number; label: string; trial: number; kind: string }[] = [];
  for (let k = 0; k < N_TRIALS; k++) {
    start[k] = k * trialLen + 1;
    stop[k] = start[k] + 5;
    const probe = rng.uniform() < 0.3;
    condition.push(probe ? 'probe' : 'standard');
    ev.push({ t: start[k] + 4, label: 'reward', trial: k + 1, kind: '' });
    if (probe) ev.push({ t: start[k] + 1.5 + rng.uniform(), label: 'jump', trial: k + 1, kind: rng.uniform() < 0.5 ? 'forward' : 'backward' });
  }
  ev.sort((a, b) => a.t - b.t);
  const units = Array.from({ length: N_UNITS }, (_, i) => ({
    id: String(i),
    spikeTimes: renewalTrain(rng, Math.min(80, Math.exp(Math.log(2) + 0.8 * rng.normal())), 0, DURATION_S, 1 + (i % 3)),
    meta: {},
  }));
  const sampleTime = Float64Array.from({ length: DURATION_S * 50 }, (_, i) => i / 50);
  const progress = new Float64Array(sampleTime.length);
  for (let k = 0; k < N_TRIALS; k++) {
    const t0 = start[k];
    for (let i = Math.ceil(t0 * 50); i < sampleTime.length && sampleTime[i] < start[k] + 5; i++) {
      progress[i] = Math.min(1, (sampleTime[i] - t0) / 4);
    }
  }
  return {
    behaviour: { time: sampleTime, variables: new Map([['progress', progress]]) },
    units,
    pulses: emptyPulses(),
    events: { time: Float64Array.from(ev, (e) => e.t), label: ev.map((e) => e.label), trial: Float64Array.from(ev, (e) => e.trial), kind: ev.map((e) => e.kind) },
    trials: { trial: Float64Array.from({ length: N_TRIALS }, (_, k) => k + 1), start, stop, condition, covariates: {} },
    span: [0, DURATION_S],
    spanSource: 'inputs',
    waveformSampleRateHz: NaN,
  };
}

/**
 * Prints wall-clock and CPU time (CPU time is the fairer figure on a shared,
 * loaded machine) of the first call (cold: what one `run` pays, JIT warm-up
 * included) and the fastest of REPS - 1 further calls (warm).
 */
const REPS = Number(process.env.REPS ?? 3);
function time<T>(label: string, f: () => T, reps = REPS): T {
  let out!: T;
  const runs: { wall: number; cpu: number }[] = [];
  for (let r = 0; r < Math.max(1, reps); r++) {
    const t0 = performance.now();
    const c0 = process.cpuUsage();
    out = f();
    const c = process.cpuUsage(c0);
    runs.push({ wall: performance.now() - t0, cpu: (c.user + c.system) / 1000 });
  }
  const fmt = (x: { wall: number; cpu: number }) => `${x.wall.toFixed(0).padStart(6)} ms wall ${x.cpu.toFixed(0).padStart(6)} ms cpu`;
  const warm = runs.slice(1).reduce<{ wall: number; cpu: number } | null>((a, b) => (!a || b.cpu < a.cpu ? b : a), null);
  console.log(`${label.padEnd(34)} cold ${fmt(runs[0])}${warm ? `   warm ${fmt(warm)}` : ''}`);
  return out;
}

const rec = time('simulate session (not analysis)', session, 1);
const spikes = rec.units.reduce((s, u) => s + u.spikeTimes.length, 0);
console.log(`${N_UNITS} units, ${(spikes / 1e6).toFixed(1)} M spikes, ${N_TRIALS} trials`);
time('classifyRamps', () => classifyRamps(rec, DEFAULTS.ramp));
time('classifyJumps', () => classifyJumps(rec, DEFAULTS.jump));
time('clusterUnits', () => clusterUnits(rec, DEFAULTS));
time('classifyProgressRamps (progress)', () => classifyProgressRamps(rec, { ...DEFAULTS.ramp, progressVariable: 'progress' }));
const ctx = { recording: rec, parameters: DEFAULTS, columns: new Map() };
time('ramp + jump + cluster steps', () => {
  rampStep.run(ctx);
  jumpStep.run(ctx);
  clusterStep.run(ctx);
});
