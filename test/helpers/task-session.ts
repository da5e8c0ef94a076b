/**
 * Test helper: simulated task sessions for the classification tests (our own
 * invented model, deliberately varied: gamma ISI shapes, rates, trial counts,
 * trial-to-trial gain). Spike trains come from a rate function by time
 * rescaling: a unit-rate gamma renewal train (core/sim/renewal-train.ts) in
 * the rescaled time Lambda(t) = integral of the rate, mapped back through
 * Lambda^-1 on a 4 ms grid (rate piecewise constant per grid step), so the ISI shape holds locally and the rate
 * follows the model.
 *
 * Trial layout: start; reward at start + rewardAtS (default 4 s, jittered by
 * up to +-rewardJitterS); stop 1 s after reward; inter-trial gap 1-3 s.
 * A fraction of trials are probe trials (condition "probe") with one jump
 * of kind forward/backward at a random time 1.2-2.6 s after start and a
 * numeric jump size (covariate jump_size).
 */
import type { Recording, Unit } from '../../core/model/types';
import { emptyPulses } from '../../core/model/empty';
import { Rng } from '../../core/random/rng';
import { renewalTrain } from '../../core/sim/renewal-train';

export interface UnitModel {
  /** Baseline rate, Hz. */
  rateHz: number;
  /** Gamma shape of the ISIs (1 = Poisson, < 1 bursty, > 1 regular). */
  shape: number;
  /** Fractional rate change over the 3 s before reward (0.5 = +50 % at reward); applies to all trials. */
  rampChange?: number;
  /** Per-condition ramp change overriding rampChange. */
  rampByCondition?: Record<string, number>;
  /** Jump answer per kind: amplitude as a fraction of the rate (negative = dip), and form. */
  jump?: Partial<Record<'forward' | 'backward', { amplitude: number; form: 'transient' | 'step'; tauS?: number; latencyS?: number; bySize?: boolean }>>;
  /** SD of the log trial gain (trial-to-trial rate variability). */
  gainSd?: number;
}

export interface SessionSpec {
  nTrials: number;
  probeFraction?: number;
  /** Condition label of the non-probe trials; '' = no condition column. */
  standardLabel?: string;
  /** Extra conditions (label, fraction) among the non-probe trials. */
  otherConditions?: { label: string; fraction: number }[];
  rewardAtS?: number;
  rewardJitterS?: number;
  units: UnitModel[];
  seed: number;
}

export function taskSession(spec: SessionSpec): Recording {
  const rng = new Rng(spec.seed);
  const rewardAt = spec.rewardAtS ?? 4;
  const jitter = spec.rewardJitterS ?? 0;
  const std = spec.standardLabel ?? 'standard';
  const trial: number[] = [];
  const start: number[] = [];
  const stop: number[] = [];
  const condition: string[] = [];
  const jumpSize: number[] = [];
  const evTime: number[] = [];
  const evLabel: string[] = [];
  const evTrial: number[] = [];
  const evKind: string[] = [];
  const jumpOf: { t: number; kind: 'forward' | 'backward'; size: number; trialStop: number }[][] = [];
  const reward: number[] = [];
  let t = 2;
  for (let k = 0; k < spec.nTrials; k++) {
    const s = t;
    const rw = s + rewardAt + (jitter > 0 ? (2 * rng.uniform() - 1) * jitter : 0);
    const e = rw + 1;
    let cond = std;
    const probe = rng.uniform() < (spec.probeFraction ?? 0);
    const js: { t: number; kind: 'forward' | 'backward'; size: number; trialStop: number }[] = [];
    let size = NaN;
    if (probe) {
      cond = 'probe';
      const kind = rng.uniform() < 0.5 ? 'forward' : 'backward';
      const tj = s + 1.2 + 1.4 * rng.uniform();
      size = 0.5 + Math.floor(rng.uniform() * 4) * 0.5;
      js.push({ t: tj, kind, size, trialStop: e });
      evTime.push(tj);
      evLabel.push('jump');
      evTrial.push(k + 1);
      evKind.push(kind);
    } else if (spec.otherConditions) {
      let u = rng.uniform();
      for (const oc of spec.otherConditions) {
        if (u < oc.fraction) {
          cond = oc.label;
          break;
        }
        u -= oc.fraction;
      }
    }
    trial.push(k + 1);
    start.push(s);
    stop.push(e);
    condition.push(cond);
    jumpSize.push(size);
    jumpOf.push(js);
    reward.push(rw);
    evTime.push(rw);
    evLabel.push('reward');
    evTrial.push(k + 1);
    evKind.push('');
    t = e + 1 + 2 * rng.uniform();
  }
  const spanStop = t + 2;
  const dt = 0.004;
  const nGrid = Math.ceil(spanStop / dt);
  const units: Unit[] = spec.units.map((m, ui) => {
    const rate = new Float64Array(nGrid).fill(m.rateHz);
    for (let k = 0; k < spec.nTrials; k++) {
      const gain = m.gainSd ? Math.exp(m.gainSd * rng.normal() - (m.gainSd * m.gainSd) / 2) : 1;
      const g0 = Math.floor(start[k] / dt);
      const g1 = Math.min(nGrid, Math.floor(stop[k] / dt));
      const ramp = m.rampByCondition?.[condition[k]] ?? m.rampChange ?? 0;
      for (let g = g0; g < g1; g++) {
        const tt = g * dt;
        let r = m.rateHz * gain;
        const x = (tt - (reward[k] - 3)) / 3;
        if (ramp !== 0 && x > 0) r *= 1 + ramp * Math.min(1, x);
        rate[g] = r;
      }
      for (const j of jumpOf[k]) {
        const a = m.jump?.[j.kind];
        if (!a) continue;
        const lat = a.latencyS ?? 0.03;
        const amp = a.amplitude * (a.bySize ? j.size / 1.25 : 1);
        const gj = Math.floor((j.t + lat) / dt);
        for (let g = gj; g < g1; g++) {
          const since = g * dt - j.t - lat;
          const f = a.form === 'step' ? 1 : Math.exp(-since / (a.tauS ?? 0.1));
          if (a.form !== 'step' && f < 1e-4) break;
          rate[g] *= Math.max(0, 1 + amp * f);
        }
      }
    }
    // Cumulative intensity and inversion of a unit-rate renewal train.
    const cum = new Float64Array(nGrid + 1);
    for (let g = 0; g < nGrid; g++) cum[g + 1] = cum[g] + rate[g] * dt;
    const unitRng = new Rng(spec.seed * 1000 + ui + 1);
    const s = renewalTrain(unitRng, 1, 0, cum[nGrid], m.shape, 0);
    const out = new Float64Array(s.length);
    let g = 0;
    for (let i = 0; i < s.length; i++) {
      while (g < nGrid && cum[g + 1] <= s[i]) g++;
      const frac = rate[g] > 0 ? (s[i] - cum[g]) / (rate[g] * dt) : 0;
      out[i] = (g + Math.min(1, Math.max(0, frac))) * dt;
    }
    return { id: `u${ui + 1}`, spikeTimes: out, meta: {} };
  });
  const order = evTime.map((_, i) => i).sort((a, b) => evTime[a] - evTime[b]);
  return {
    units,
    pulses: emptyPulses(),
    events: {
      time: Float64Array.from(order, (i) => evTime[i]),
      label: order.map((i) => evLabel[i]),
      trial: Float64Array.from(order, (i) => evTrial[i]),
      kind: order.map((i) => evKind[i]),
    },
    trials: {
      trial: Float64Array.from(trial),
      start: Float64Array.from(start),
      stop: Float64Array.from(stop),
      condition: std === '' && !spec.otherConditions && !spec.probeFraction ? condition.map(() => '') : condition,
      covariates: { jump_size: Float64Array.from(jumpSize) },
    },
    span: [0, spanStop],
    spanSource: 'inputs',
    waveformSampleRateHz: NaN,
  };
}
