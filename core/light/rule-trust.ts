import type { Parameters } from '../defaults';
import { Rng } from '../random/rng';
import { artefactFlags } from './artefact-flags';
import { createLightScratch, lightResponse, type LightScratch } from './light-response';
import type { LightSchedule } from './light-schedule';
import { tagVerdict } from './tag-verdict';
import { TRUST_REFRACTORY_S, trustCell } from './trust-cell';

/** How far the identification rule can be trusted for one kind of unit on this session. */
export interface RuleTrust {
  /** Cell simulated: baseline rate (Hz) and ISI CV after rounding to the grid. */
  readonly rateHz: number;
  readonly cv: number;
  /** Gamma shape of the simulated renewal process. */
  readonly shape: number;
  /** Null units simulated and how many the rule called `tagged`. */
  readonly nullSimulations: number;
  readonly falseTagged: number;
  /** falseTagged / nullSimulations. */
  readonly falseRate: number;
  /** Smallest reliability on the grid found `tagged` with the asked power (NaN: not even at 1). */
  readonly minDetectableReliability: number;
  /** Power measured at each reliability the search visited. */
  readonly power: readonly { readonly reliability: number; readonly power: number }[];
}

/** Reliabilities the power search may visit. */
export const POWER_GRID = [0.05, 0.1, 0.15, 0.2, 0.3, 0.4, 0.5, 0.7, 1] as const;

const REFRACTORY_S = TRUST_REFRACTORY_S;

/** Spikes of a stationary gamma renewal process (dead time + gamma) on the merged intervals, written into buf. */
function simulateNull(rng: Rng, rateHz: number, shape: number, intervals: Float64Array, totalS: number, buf: Float64Array<ArrayBuffer>): { buf: Float64Array<ArrayBuffer>; n: number } {
  if (!(rateHz > 0)) return { buf, n: 0 };
  const theta = (1 / rateHz - REFRACTORY_S) / shape;
  // Compressed time: the intervals laid end to end (a renewal process is stationary, so
  // each interval sees the right statistics); start 10 mean ISIs early.
  let tau = -10 / rateHz;
  let n = 0;
  let k = 0;
  let cum = 0;
  for (;;) {
    tau += REFRACTORY_S + theta * (shape === 1 ? rng.exponential() : rng.gamma(shape));
    if (tau >= totalS) break;
    if (tau < 0) continue;
    while (tau >= cum + (intervals[k + 1] - intervals[k])) {
      cum += intervals[k + 1] - intervals[k];
      k += 2;
    }
    if (n === buf.length) {
      const g = new Float64Array(buf.length * 2 + 16);
      g.set(buf);
      buf = g;
    }
    buf[n++] = intervals[k] + (tau - cum);
  }
  return { buf, n };
}

/**
 * Expected false-identification rate of the rule, and its power, for a unit
 * of a given baseline rate and firing regularity on this session's own pulse
 * schedule (issue 3, item 7).
 *
 * Null units: stationary gamma renewal trains (2 ms dead time plus a gamma
 * interval of shape 1 / CV^2, CV the unit's light-free ISI CV on the grid; the
 * dead time makes the simulated CV slightly smaller, by 1 - rate x 2 ms), no
 * light effect, simulated only where the analysis looks
 * (simulationIntervals); each goes through the very rule the real units get
 * (lightResponse, artefactFlags, tagVerdict; no waveforms). falseRate =
 * share called `tagged` (resolution 1 / trustNullSimulations).
 *
 * Power: the first trustPowerSimulations null trains plus one added spike per
 * pulse with probability R at trustPowerLatencyMs +- trustPowerJitterMs
 * (Gaussian); the same random numbers at every R (common random numbers), R
 * searched by bisection on POWER_GRID assuming power grows with R.
 * minDetectableReliability = smallest grid R with power >= trustPower.
 *
 * Seeded by `seed`, the cell's rate and CV (not the unit's position), so a
 * unit's numbers do not change when other units are added. Cost:
 * trustNullSimulations + ~4 x trustPowerSimulations rule evaluations per cell.
 */
export function ruleTrust(
  sch: LightSchedule,
  intervals: Float64Array,
  rateHz: number,
  cv: number,
  p: Parameters['light'],
  scratch: LightScratch = createLightScratch(),
): RuleTrust {
  const cell = trustCell(rateHz, cv);
  const shape = Math.min(50, Math.max(0.1, 1 / (cell.cv * cell.cv)));
  let totalS = 0;
  for (let k = 0; k < intervals.length; k += 2) totalS += intervals[k + 1] - intervals[k];
  const seed = (Math.imul(p.seed | 0, 0x9e3779b1) ^ Math.imul(Math.round(cell.rateHz * 1000), 0x85ebca6b) ^ Math.imul(Math.round(cell.cv * 100), 0xc2b2ae35)) >>> 0;
  const rng = new Rng(seed);
  let buf = new Float64Array(Math.ceil(totalS * cell.rateHz * 1.5) + 16);
  const nNull = Math.max(0, Math.floor(p.trustNullSimulations));
  const nPow = Math.max(0, Math.min(nNull, Math.floor(p.trustPowerSimulations)));
  const keep: Float64Array[] = [];
  let falseTagged = 0;
  const isTagged = (spikes: Float64Array): boolean => {
    const r = lightResponse(spikes, sch, p, false, scratch, p.minEvokedReliability);
    return tagVerdict(r, NaN, artefactFlags(r, NaN, p), p, sch.saltProblem).tag === 'tagged';
  };
  for (let s = 0; s < nNull; s++) {
    const sim = simulateNull(rng, cell.rateHz, shape, intervals, totalS, buf);
    buf = sim.buf;
    const spikes = buf.subarray(0, sim.n);
    if (isTagged(spikes)) falseTagged++;
    if (s < nPow) keep.push(spikes.slice());
  }

  // Power search with common random numbers.
  const n = sch.n;
  const u = new Float64Array(nPow * n);
  const z = new Float64Array(nPow * n);
  const prng = new Rng(seed ^ 0x5bd1e995);
  for (let i = 0; i < u.length; i++) {
    u[i] = prng.uniform();
    z[i] = prng.normal();
  }
  const lat = p.trustPowerLatencyMs / 1000;
  const jit = p.trustPowerJitterMs / 1000;
  const added = new Float64Array(n);
  let merged = new Float64Array(0);
  const powerAt = new Map<number, number>();
  const measure = (gi: number): number => {
    const R = POWER_GRID[gi];
    const cached = powerAt.get(gi);
    if (cached !== undefined) return cached;
    let hits = 0;
    for (let s = 0; s < nPow; s++) {
      let m = 0;
      for (let i = 0; i < n; i++) if (u[s * n + i] < R) added[m++] = sch.onset[i] + Math.max(0.0002, lat + jit * z[s * n + i]);
      const add = added.subarray(0, m).sort();
      const base = keep[s];
      if (merged.length < base.length + m) merged = new Float64Array(base.length + m);
      let a = 0;
      let b = 0;
      let k = 0;
      while (a < base.length && b < m) merged[k++] = base[a] <= add[b] ? base[a++] : add[b++];
      while (a < base.length) merged[k++] = base[a++];
      while (b < m) merged[k++] = add[b++];
      if (isTagged(merged.subarray(0, k))) hits++;
    }
    const pw = nPow > 0 ? hits / nPow : NaN;
    powerAt.set(gi, pw);
    return pw;
  };
  let minDetectableReliability = NaN;
  if (nPow > 0 && n > 0) {
    let lo = 0;
    let hi = POWER_GRID.length - 1;
    if (measure(hi) >= p.trustPower) {
      while (lo < hi) {
        const mid = (lo + hi) >>> 1;
        if (measure(mid) >= p.trustPower) hi = mid;
        else lo = mid + 1;
      }
      minDetectableReliability = POWER_GRID[lo];
    }
  }
  const power = [...powerAt.entries()].sort((a, b) => a[0] - b[0]).map(([gi, pw]) => ({ reliability: POWER_GRID[gi], power: pw }));
  return {
    rateHz: cell.rateHz,
    cv: cell.cv,
    shape,
    nullSimulations: nNull,
    falseTagged,
    falseRate: nNull > 0 && n > 0 ? falseTagged / nNull : NaN,
    minDetectableReliability,
    power,
  };
}
