/**
 * The trust simulation as it was before issue 9 (commit 55b4840), kept for the tests only: every
 * null unit simulates a baseline stretch of its own (window by window, one interval per SALT
 * window), gamma intervals by Rng.gamma / Rng.exponential (Marsaglia-Tsang on polar normals),
 * power draws by Box-Muller from hashes. test/core/light/rule-trust.test.ts checks that the
 * current ruleTrust (shared baseline stretches, ziggurat draws) agrees with it statistically.
 * Code unchanged except for names, imports and referenceIntervals (the window-level intervals
 * the old simulationIntervals returned).
 */
import type { Parameters } from '../../../core/defaults';
import { Rng } from '../../../core/random/rng';
import { artefactFlags } from '../../../core/light/artefact-flags';
import { createLightScratch, lightResponse, type LightScratch } from '../../../core/light/light-response';
import type { LightSchedule } from '../../../core/light/light-schedule';
import { tagVerdict } from '../../../core/light/tag-verdict';
import { TRUST_REFRACTORY_S } from '../../../core/light/trust-cell';

/** How far the identification rule can be trusted for one kind of unit (one grid node) on this session. */
interface RuleTrust {
  /** Node simulated: baseline rate (Hz) and ISI CV. */
  readonly rateHz: number;
  readonly cv: number;
  /** Gamma shape of the simulated renewal process. */
  readonly shape: number;
  /** Seed of this node's random numbers (from light.seed, rate and CV). */
  readonly seed: number;
  /** Null units simulated and how many the rule called `tagged`. */
  readonly nullSimulations: number;
  readonly falseTagged: number;
  /** Null units whose test windows alone ruled out `tagged` (reliability < minEvokedReliability). */
  readonly screenedOut: number;
  /** falseTagged / nullSimulations. */
  readonly falseRate: number;
  /** Smallest reliability on the grid found `tagged` with the asked power (NaN: not even at 1). */
  readonly minDetectableReliability: number;
  /** Power measured at each reliability the search visited. */
  readonly power: readonly { readonly reliability: number; readonly power: number }[];
}

/** Reliabilities the power search may visit. */
const POWER_GRID = [0.05, 0.1, 0.15, 0.2, 0.3, 0.4, 0.5, 0.7, 1] as const;

const REFRACTORY_S = TRUST_REFRACTORY_S;

/**
 * Spikes of a stationary gamma renewal process (dead time + gamma) on the merged
 * intervals laid end to end, written into buf; also counts the intervals that
 * got at least one spike, and stops (incomplete) once that count exceeds
 * stopAtHits. Starts 10 mean ISIs early (stationary).
 */
function simulateOn(
  rng: Rng,
  rateHz: number,
  shape: number,
  intervals: Float64Array,
  totalS: number,
  buf: Float64Array<ArrayBuffer>,
  stopAtHits = Infinity,
): { buf: Float64Array<ArrayBuffer>; n: number; hit: number } {
  if (!(rateHz > 0) || intervals.length === 0) return { buf, n: 0, hit: 0 };
  const theta = (1 / rateHz - REFRACTORY_S) / shape;
  let tau = -10 / rateHz;
  let n = 0;
  let k = 0;
  let cum = 0;
  let hit = 0;
  let lastK = -1;
  for (;;) {
    tau += REFRACTORY_S + theta * (shape === 1 ? rng.exponential() : rng.gamma(shape));
    if (tau >= totalS) break;
    if (tau < 0) continue;
    while (tau >= cum + (intervals[k + 1] - intervals[k])) {
      cum += intervals[k + 1] - intervals[k];
      k += 2;
    }
    if (k !== lastK) {
      if (++hit > stopAtHits) break;
      lastK = k;
    }
    if (n === buf.length) {
      const g = new Float64Array(buf.length * 2 + 16);
      g.set(buf);
      buf = g;
    }
    buf[n++] = intervals[k] + (tau - cum);
  }
  return { buf, n, hit };
}

/** A uniform in (0, 1) from a 32-bit seed and an index (murmur3 finaliser on both; 32 bits). */
function hashUniform(seed: number, k: number): number {
  let h = (seed ^ Math.imul(k, 0x9e3779b1) ^ Math.imul((k / 4294967296) | 0, 0x85ebca6b)) >>> 0;
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return ((h >>> 0) + 0.5) / 4294967296;
}

function lengthOf(iv: Float64Array): number {
  let t = 0;
  for (let k = 0; k < iv.length; k += 2) t += iv[k + 1] - iv[k];
  return t;
}

/**
 * Expected false-identification rate of the rule, and its power, for units of
 * one baseline rate and firing regularity (a node of the trust grid, see
 * trustCell) on this session's own pulse schedule (issue 3, item 7).
 *
 * Null units: stationary gamma renewal trains (2 ms dead time plus a gamma
 * interval of shape 1 / CV^2; the dead time makes the simulated CV slightly
 * smaller, by 1 - rate x 2 ms), no light effect, simulated only where the
 * analysis looks (simulationIntervals): the test windows laid end to end,
 * then the SALT baseline windows, then the offset windows, likewise (three
 * independent stretches of one process: dependence between a test window and
 * the baseline just before it is not carried over). Each unit goes through the
 * very rule the real units get (lightResponse, artefactFlags, tagVerdict; no
 * waveforms). Screens (when the test windows are disjoint): `tagged` needs an
 * excess reliability (test-window reliability minus the baseline windows'
 * spike probability) >= minEvokedReliability, and both are counted while the
 * spikes are simulated (windows with a spike), so a unit below it (with a
 * 0.001 margin for window edges computed two ways) is counted as not tagged
 * without the rest of the rule: exact, and nearly every null unit stops there.
 * falseRate = share called `tagged` (resolution
 * 1 / trustNullSimulations). When SALT cannot run on the schedule the rule
 * cannot call `tagged` at all: falseRate 0 and power NaN without simulation.
 *
 * Power: the first trustPowerSimulations null trains plus one added spike per
 * pulse with probability R at trustPowerLatencyMs +- trustPowerJitterMs
 * (Gaussian); the same random numbers at every R (common random numbers), R
 * searched by bisection on POWER_GRID assuming power grows with R; each step
 * stops once its answer (power >= trustPower or not) is certain, so `power`
 * lists bounds: the value shown is >= trustPower for a passed step and below
 * it for a failed one. minDetectableReliability = smallest grid R with power
 * >= trustPower.
 *
 * Seeded by light.seed and the node's rate and CV (not a unit's position), so
 * the numbers do not change when other units are added; bit-for-bit
 * reproducible.
 */
export function ruleTrustReference(
  sch: LightSchedule,
  iv: ReferenceIntervals,
  rateHz: number,
  cv: number,
  p: Parameters['light'],
  scratch: LightScratch = createLightScratch(),
): RuleTrust {
  const shape = Math.min(50, Math.max(0.1, 1 / (cv * cv)));
  const seed = (Math.imul(p.seed | 0, 0x9e3779b1) ^ Math.imul(Math.round(rateHz * 1000), 0x85ebca6b) ^ Math.imul(Math.round(cv * 100), 0xc2b2ae35)) >>> 0;
  const n = sch.n;
  const nNull = Math.max(0, Math.floor(p.trustNullSimulations));
  const nPow = Math.max(0, Math.min(nNull, Math.floor(p.trustPowerSimulations)));
  const base = { rateHz, cv, shape, seed };
  if (n === 0) return { ...base, nullSimulations: nNull, falseTagged: 0, screenedOut: 0, falseRate: NaN, minDetectableReliability: NaN, power: [] };
  if (sch.windows === 0) return { ...base, nullSimulations: 0, falseTagged: 0, screenedOut: 0, falseRate: 0, minDetectableReliability: NaN, power: [] };

  const rng = new Rng(seed);
  const J = sch.windows;
  const m = sch.saltPulses.length;
  const testS = lengthOf(iv.test);
  const baseS = lengthOf(iv.base);
  const offS = lengthOf(iv.offset);
  let testBuf = new Float64Array(Math.ceil(testS * rateHz * 1.5) + 16);
  let baseBuf = new Float64Array(Math.ceil(baseS * rateHz * 1.5) + 16);
  let offBuf = new Float64Array(Math.ceil(offS * rateHz * 1.5) + 16);
  let merged = new Float64Array(0);
  let merged2 = new Float64Array(0);
  const merge = (out: Float64Array, a: Float64Array, na: number, b: Float64Array, nb: number): Float64Array => {
    let i = 0;
    let j = 0;
    let k = 0;
    while (i < na && j < nb) out[k++] = a[i] <= b[j] ? a[i++] : b[j++];
    while (i < na) out[k++] = a[i++];
    while (j < nb) out[k++] = b[j++];
    return out.subarray(0, k);
  };
  const mergeInto = (a: Float64Array, na: number, b: Float64Array, nb: number): Float64Array => {
    if (merged.length < na + nb) merged = new Float64Array(na + nb);
    return merge(merged, a, na, b, nb);
  };
  const isTagged = (spikes: Float64Array): boolean => {
    const r = lightResponse(spikes, sch, p, false, scratch, p.minEvokedReliability);
    return tagVerdict(r, NaN, artefactFlags(r, NaN, p), p, sch.saltProblem).tag === 'tagged';
  };
  // Margin of the screens: window edges computed two ways may differ in the last bit.
  const screenAt = p.minEvokedReliability - 1e-3;
  const keep: Float64Array[] = [];
  let falseTagged = 0;
  let screenedOut = 0;
  for (let s = 0; s < nNull; s++) {
    const t = simulateOn(rng, rateHz, shape, iv.test, testS, testBuf);
    testBuf = t.buf;
    const power = s < nPow;
    // Screen 1: reliability alone (the excess reliability is at most the reliability).
    if (!power && iv.testDisjoint && t.hit / n < screenAt) {
      screenedOut++;
      continue;
    }
    // Screen 2: excess reliability over the baseline windows (one interval per window); the
    // baseline stops as soon as its windows with a spike make the excess too small.
    const screen = !power && iv.testDisjoint;
    const limit = screen ? Math.floor((t.hit / n - screenAt) * J * m) : Infinity;
    const b = simulateOn(rng, rateHz, shape, iv.base, baseS, baseBuf, limit);
    baseBuf = b.buf;
    if (screen && t.hit / n - b.hit / (J * m) < screenAt) {
      screenedOut++;
      continue;
    }
    const o = simulateOn(rng, rateHz, shape, iv.offset, offS, offBuf);
    offBuf = o.buf;
    if (merged2.length < t.n + b.n) merged2 = new Float64Array(t.n + b.n);
    const tb = merge(merged2, testBuf, t.n, baseBuf, b.n);
    const spikes = mergeInto(tb, tb.length, offBuf, o.n);
    if (isTagged(spikes)) falseTagged++;
    if (power) keep.push(spikes.slice());
  }

  // Power search with common random numbers.
  // u decides which pulses get an added spike (all of them are needed); the Gaussian
  // latency z of a pair is drawn only when the pair is first used, from a hash of
  // (seed, pair), so it is the same at every R and independent of the search order.
  const u = new Float64Array(nPow * n);
  const z = new Float64Array(nPow * n).fill(NaN);
  const prng = new Rng(seed ^ 0x5bd1e995);
  for (let i = 0; i < u.length; i++) u[i] = prng.uniform();
  const zAt = (k: number): number => {
    let v = z[k];
    if (v === v) return v;
    const a = hashUniform(seed, 2 * k);
    const b = hashUniform(seed, 2 * k + 1);
    v = Math.sqrt(-2 * Math.log(a)) * Math.cos(2 * Math.PI * b);
    z[k] = v;
    return v;
  };
  const lat = p.trustPowerLatencyMs / 1000;
  const jit = p.trustPowerJitterMs / 1000;
  const added = new Float64Array(n);
  const powerAt = new Map<number, number>();
  // Power at one grid step, stopping as soon as the verdict on trustPower is certain
  // (hits needed reached, or too many misses); the recorded power is then a bound
  // (>= trustPower, or < trustPower), reported as hits / responders simulated so far.
  const need = Math.ceil(p.trustPower * nPow - 1e-9);
  const measure = (gi: number): boolean => {
    const R = POWER_GRID[gi];
    const cached = powerAt.get(gi);
    if (cached !== undefined) return cached >= p.trustPower;
    let hits = 0;
    let done = 0;
    for (let s = 0; s < nPow; s++) {
      let m = 0;
      for (let i = 0; i < n; i++) if (u[s * n + i] < R) added[m++] = sch.onset[i] + Math.max(0.0002, lat + jit * zAt(s * n + i));
      const add = added.subarray(0, m).sort();
      if (isTagged(mergeInto(keep[s], keep[s].length, add, m))) hits++;
      done++;
      if (hits >= need || done - hits > nPow - need) break;
    }
    const pass = hits >= need;
    powerAt.set(gi, pass ? Math.max(p.trustPower, hits / nPow) : Math.min(hits / nPow, (need - 1) / nPow));
    return pass;
  };
  let minDetectableReliability = NaN;
  if (nPow > 0) {
    // Bisection over the grid; the top (R = 1) is checked last, only if needed.
    let lo = 0;
    let hi = POWER_GRID.length - 1;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (measure(mid)) hi = mid;
      else lo = mid + 1;
    }
    if (lo < POWER_GRID.length - 1 || measure(lo)) minDetectableReliability = POWER_GRID[lo];
  }
  const power = [...powerAt.entries()].sort((a, b) => a[0] - b[0]).map(([gi, pw]) => ({ reliability: POWER_GRID[gi], power: pw }));
  return { ...base, nullSimulations: nNull, falseTagged, screenedOut, falseRate: nNull > 0 ? falseTagged / nNull : NaN, minDetectableReliability, power };
}

/** The intervals the old trust simulation read: test windows merged; every SALT baseline window, one interval each; offset windows merged. */
export interface ReferenceIntervals {
  test: Float64Array;
  testDisjoint: boolean;
  base: Float64Array;
  offset: Float64Array;
}

export function referenceIntervals(sch: LightSchedule, offsetWindowS: number): ReferenceIntervals {
  const test: number[] = [];
  let disjoint = true;
  for (let i = 0; i < sch.n; i++) {
    const a = sch.onset[i] + sch.windowStartS;
    const b = sch.onset[i] + sch.windowEndS;
    if (test.length && a <= test[test.length - 1]) {
      disjoint = false;
      test[test.length - 1] = Math.max(test[test.length - 1], b);
    } else test.push(a, b);
  }
  const J = sch.windows;
  const w = sch.windowS;
  const blocks = Array.from(sch.saltPulses).sort((a, b) => sch.anchor[a] - sch.anchor[b]);
  const base = new Float64Array(J > 0 ? 2 * J * blocks.length : 0);
  let k = 0;
  for (const i of blocks) {
    const start = sch.anchor[i] - J * w;
    for (let j = 0; j < J; j++) {
      base[k++] = start + j * w;
      base[k++] = j === J - 1 ? sch.anchor[i] : start + (j + 1) * w;
    }
  }
  const iv: [number, number][] = [];
  for (let i = 0; i < sch.n; i++) {
    const o = sch.offset[i];
    if (Number.isFinite(o) && o >= sch.onset[i] + sch.windowEndS) iv.push([o, o + offsetWindowS]);
  }
  iv.sort((x, y) => x[0] - y[0] || x[1] - y[1]);
  const offset: number[] = [];
  for (const [a, b] of iv) {
    if (offset.length && a <= offset[offset.length - 1]) offset[offset.length - 1] = Math.max(offset[offset.length - 1], b);
    else offset.push(a, b);
  }
  return { test: Float64Array.from(test), testDisjoint: disjoint, base, offset: Float64Array.from(offset) };
}
