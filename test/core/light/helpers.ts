/**
 * Test helpers for the light engine: pulse schedules and simulated units.
 * Assumptions deliberately varied between tests (Poisson and gamma-renewal
 * spontaneous firing, Gaussian and exponential latency spreads, added spikes
 * and spikes that replace spontaneous ones), so the rule is not tuned to one
 * generative model. Invented data (tests only).
 */
import { DEFAULTS, type Parameters } from '../../../core/defaults';
import type { Pulses } from '../../../core/model/types';
import { Rng } from '../../../core/random/rng';
import { renewalTrain } from '../../../core/sim/renewal-train';

export function lightParams(over: Partial<Parameters['light']> = {}): Parameters['light'] {
  return { ...DEFAULTS.light, ...over };
}

/** Pulses: `single` pulses every `periodS` from `startS`, then `trains` of `perTrain` pulses at each frequency, `trainGapS` apart. */
export function makePulses(o: {
  startS?: number;
  single?: number;
  periodS?: number;
  durationS?: number;
  trainFrequencies?: number[];
  trains?: number;
  perTrain?: number;
  trainGapS?: number;
  jitterPeriodS?: number;
  seed?: number;
}): { pulses: Pulses; endS: number } {
  const rng = new Rng(o.seed ?? 5);
  const onset: number[] = [];
  const train: number[] = [];
  const freq: number[] = [];
  let t = o.startS ?? 10;
  let id = 0;
  for (let i = 0; i < (o.single ?? 300); i++) {
    onset.push(t);
    train.push(id++);
    freq.push(NaN);
    t += (o.periodS ?? 1) + (o.jitterPeriodS ?? 0) * rng.uniform();
  }
  for (const f of o.trainFrequencies ?? []) {
    for (let k = 0; k < (o.trains ?? 20); k++) {
      for (let j = 0; j < (o.perTrain ?? 10); j++) {
        onset.push(t + j / f);
        train.push(id);
        freq.push(f);
      }
      id++;
      t += (o.perTrain ?? 10) / f + (o.trainGapS ?? 3);
    }
  }
  const n = onset.length;
  return {
    pulses: {
      onset: Float64Array.from(onset),
      duration: new Float64Array(n).fill(o.durationS ?? 0.005),
      train: Int32Array.from(train),
      frequencyHz: Float64Array.from(freq),
      powerMw: new Float64Array(n).fill(5),
    },
    endS: t + 5,
  };
}

export interface ResponderSpec {
  /** Probability of an evoked spike per pulse (1 Hz single pulses; trains scale by `fade`). */
  reliability: number;
  latencyMs: number;
  jitterMs: number;
  /** 'gauss' or 'exp' (latency + exponential spread with mean jitterMs). */
  spread?: 'gauss' | 'exp';
  /** Reliability multiplier per pulse index in a train (e.g. 0.9 -> fades). */
  fade?: number;
  /** Spikes added on top (default) or spontaneous spikes within 5 ms after onset removed first. */
  replace?: boolean;
  /** Inhibition: remove spontaneous spikes in [onset, onset + inhibitMs) with this probability. */
  inhibit?: number;
  inhibitMs?: number;
}

/** Merges sorted arrays into one sorted Float64Array. */
export function mergeSorted(a: Float64Array, b: Float64Array): Float64Array {
  const out = new Float64Array(a.length + b.length);
  let i = 0;
  let j = 0;
  let k = 0;
  while (i < a.length && j < b.length) out[k++] = a[i] <= b[j] ? a[i++] : b[j++];
  while (i < a.length) out[k++] = a[i++];
  while (j < b.length) out[k++] = b[j++];
  return out;
}

/** A unit: renewal spontaneous firing plus a light answer. */
export function simulateUnit(
  rng: Rng,
  pulses: Pulses,
  spanS: number,
  rateHz: number,
  shape: number,
  resp: ResponderSpec | null,
): Float64Array {
  let spont = renewalTrain(rng, rateHz, 0, spanS, shape, 0.002);
  if (!resp) return spont;
  const idxInTrain = new Map<number, number>();
  const keep = new Uint8Array(spont.length).fill(1);
  const added: number[] = [];
  let ptr = 0;
  for (let i = 0; i < pulses.onset.length; i++) {
    const o = pulses.onset[i];
    const pos = idxInTrain.get(pulses.train[i]) ?? 0;
    idxInTrain.set(pulses.train[i], pos + 1);
    while (ptr < spont.length && spont[ptr] < o) ptr++;
    if (resp.inhibit) {
      for (let j = ptr; j < spont.length && spont[j] < o + (resp.inhibitMs ?? 20) / 1000; j++) if (rng.uniform() < resp.inhibit) keep[j] = 0;
    }
    const rel = resp.reliability * Math.pow(resp.fade ?? 1, pos);
    if (rel > 0 && rng.uniform() < rel) {
      const lat =
        resp.spread === 'exp'
          ? resp.latencyMs + resp.jitterMs * rng.exponential()
          : resp.latencyMs + resp.jitterMs * rng.normal();
      if (resp.replace) for (let j = ptr; j < spont.length && spont[j] < o + 0.005; j++) keep[j] = 0;
      added.push(o + Math.max(0.0001, lat / 1000));
    }
  }
  if (resp.inhibit || resp.replace) spont = spont.filter((_, j) => keep[j] === 1);
  return mergeSorted(spont, Float64Array.from(added).sort());
}

/**
 * A bursty unit of another generative model than the gamma renewal: burst onsets form a
 * Poisson process; each onset fires 1 + Poisson(extra) spikes at 2.5-5 ms intervals.
 * Mean rate = onsetHz x (1 + extra).
 */
export function burstyTrain(rng: Rng, onsetHz: number, extra: number, spanS: number): Float64Array {
  const out: number[] = [];
  let t = 0;
  for (;;) {
    t += rng.exponential() / onsetHz;
    if (t >= spanS) break;
    let s = t;
    const k = 1 + rng.poisson(extra);
    for (let j = 0; j < k && s < spanS; j++) {
      out.push(s);
      s += 0.0025 + 0.0025 * rng.uniform();
    }
    t = s;
  }
  return Float64Array.from(out);
}

/** A Poisson unit whose rate drifts slowly: rate(t) = mean x (1 + depth sin(2 pi t / periodS)), by thinning. */
export function driftingTrain(rng: Rng, meanHz: number, depth: number, periodS: number, spanS: number): Float64Array {
  const out: number[] = [];
  const peak = meanHz * (1 + depth);
  let t = 0;
  for (;;) {
    t += rng.exponential() / peak;
    if (t >= spanS) break;
    if (rng.uniform() * peak < meanHz * (1 + depth * Math.sin((2 * Math.PI * t) / periodS))) out.push(t);
  }
  return Float64Array.from(out);
}
