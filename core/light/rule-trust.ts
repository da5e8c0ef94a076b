import type { Parameters } from '../defaults';
import { Rng } from '../random/rng';
import { artefactFlags } from './artefact-flags';
import { createLightScratch, lightResponse, type LightScratch } from './light-response';
import { saltBaseline, type SaltBaseline } from './salt-baseline';
import type { LightSchedule } from './light-schedule';
import type { simulationIntervals } from './simulation-intervals';
import { tagVerdict } from './tag-verdict';
import { TRUST_REFRACTORY_S } from './trust-cell';

/** How far the identification rule can be trusted for one kind of unit (one grid node) on this session. */
export interface RuleTrust {
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
  /** Null units the excess-reliability screens ruled out (test-window reliability, or it minus the baseline's spike probability, < minEvokedReliability). */
  readonly screenedOut: number;
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

/**
 * Spikes of a stationary gamma renewal process (dead time + theta x Gamma(shape))
 * on the merged intervals laid end to end, written into buf; also counts the
 * intervals that got at least one spike. Starts 10 mean ISIs early
 * (stationary). Gamma draws come in order from `draws` (one stream per node).
 */
function simulateOn(
  draws: GammaDraws,
  rateHz: number,
  intervals: Float64Array,
  totalS: number,
  buf: Float64Array<ArrayBuffer>,
): { buf: Float64Array<ArrayBuffer>; n: number; hit: number } {
  if (!(rateHz > 0) || intervals.length === 0) return { buf, n: 0, hit: 0 };
  const theta = (1 / rateHz - REFRACTORY_S) / draws.shape;
  let g = draws.buf;
  let pos = draws.pos;
  let tau = -10 / rateHz;
  let n = 0;
  let k = 0;
  let cum = 0;
  let len = intervals[1] - intervals[0];
  let hit = 0;
  let lastK = -1;
  for (;;) {
    if (pos === g.length) {
      draws.refill();
      g = draws.buf;
      pos = 0;
    }
    tau += REFRACTORY_S + theta * g[pos++];
    if (tau >= totalS) break;
    if (tau < 0) continue;
    while (tau >= cum + len) {
      cum += len;
      k += 2;
      len = intervals[k + 1] - intervals[k];
    }
    if (k !== lastK) {
      hit++;
      lastK = k;
    }
    if (n === buf.length) {
      const grown = new Float64Array(buf.length * 2 + 16);
      grown.set(buf);
      buf = grown;
    }
    buf[n++] = intervals[k] + (tau - cum);
  }
  draws.pos = pos;
  return { buf, n, hit };
}

/** Gamma(shape) draws in blocks (Rng.fillGammaZiggurat), read in order by simulateOn. */
class GammaDraws {
  buf: Float64Array;
  pos: number;
  constructor(
    private readonly rng: Rng,
    readonly shape: number,
    buf: Float64Array,
  ) {
    this.buf = buf;
    this.pos = buf.length;
  }
  refill(): void {
    this.rng.fillGammaZiggurat(this.buf, this.shape);
    this.pos = 0;
  }
}

/**
 * Sorts in place: insertion sort, O(n) on nearly sorted input (added spikes come
 * in pulse order, out of order only where pulses are closer than the latency
 * spread); after 8n moves it hands over to the built-in sort (no quadratic case).
 */
function insertionSort(x: Float64Array): void {
  let budget = 8 * x.length;
  for (let i = 1; i < x.length; i++) {
    const v = x[i];
    if (x[i - 1] <= v) continue;
    let j = i - 1;
    while (j >= 0 && x[j] > v) {
      x[j + 1] = x[j];
      j--;
    }
    x[j + 1] = v;
    budget -= i - j;
    if (budget < 0) {
      x.sort();
      return;
    }
  }
}

/** Whether any [onset + a, onset + b] (onsets sorted) meets a sorted list of intervals [a0, b0, ...] (within EDGE_S). */
function windowsReach(onset: Float64Array, a: number, b: number, iv: Float64Array): boolean {
  let j = 0;
  for (let i = 0; i < onset.length; i++) {
    const lo = onset[i] + a;
    const hi = onset[i] + b;
    while (j < iv.length && iv[j + 1] + EDGE_S <= lo) j += 2;
    if (j < iv.length && iv[j] - EDGE_S <= hi) return true;
  }
  return false;
}

/** Whether any time of a sorted list falls inside (or within EDGE_S of) a sorted list of intervals [a0, b0, ...]. */
function anyInside(times: Float64Array, iv: Float64Array): boolean {
  let i = 0;
  for (let k = 0; k < times.length; k++) {
    const t = times[k];
    while (i < iv.length && iv[i + 1] + EDGE_S <= t) i += 2;
    if (i >= iv.length) return false;
    if (iv[i] - EDGE_S <= t) return true;
  }
  return false;
}

/** Margin of the interval tests here, s (window edges computed two ways differ by far less). */
const EDGE_S = 1e-9;

/** Whether any interval of one sorted list [a0, b0, ...] overlaps (or comes within EDGE_S of) one of another's. */
function overlaps(x: Float64Array, y: Float64Array): boolean {
  let j = 0;
  for (let i = 0; i < x.length; i += 2) {
    while (j < y.length && y[j + 1] + EDGE_S <= x[i]) j += 2;
    if (j < y.length && y[j] - EDGE_S < x[i + 1]) return true;
  }
  return false;
}

/** Most null units that share one simulated baseline stretch. */
const BASELINE_SHARE = 5;

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
 * interval of shape 1 / CV^2, drawn by Rng.gammaZiggurat; the dead time makes
 * the simulated CV slightly smaller, by 1 - rate x 2 ms), no light effect,
 * simulated only where the analysis looks (simulationIntervals): the test
 * windows laid end to end, the SALT baseline blocks likewise, and the offset
 * windows (three independent stretches of one process: dependence between a
 * test window and the baseline just before it is not carried over). Each unit
 * goes through the very rule the real units get (lightResponse, artefactFlags,
 * tagVerdict; no waveforms).
 *
 * Shared baselines: max(trustPowerSimulations, ceil(trustNullSimulations / 5))
 * baseline stretches are simulated, and null unit s takes stretch s mod that
 * number (the power units each their own): every null unit's train has the
 * same law as with a stretch of its own, so falseRate stays an unbiased
 * estimate; units sharing a stretch are dependent only through it (its SALT
 * rows and rate are measured over the J x pulses baseline windows, far more
 * than the test windows, so the spread of falseRate stays near the binomial
 * one: test/core/light/rule-trust.test.ts compares both with the earlier
 * model, which simulated a stretch per unit). The baseline was ~70 % of the
 * draws; each stretch's SALT half (saltBaseline) is computed once.
 *
 * Screens (when the test windows are disjoint): `tagged` needs an excess
 * reliability (test-window reliability minus the baseline windows' spike
 * probability) >= minEvokedReliability; the test windows with a spike are
 * counted while they are simulated and the baseline's are known, so a unit
 * below it (with a 0.001 margin for window edges computed two ways) is counted
 * as not tagged without the rest of the rule: exact, and nearly every null
 * unit stops there. falseRate = share called `tagged` (resolution
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
 * >= trustPower. A responder differs from its null train only after the
 * pulses, so lightResponse reads its test and offset spikes and takes the null
 * stretch's SALT half (exact; the whole train instead if an added spike ever
 * falls in a baseline block, or when offset windows reach into blocks).
 *
 * Seeded by light.seed and the node's rate and CV (not a unit's position), so
 * the numbers do not change when other units are added; bit-for-bit
 * reproducible.
 */
export function ruleTrust(
  sch: LightSchedule,
  iv: ReturnType<typeof simulationIntervals>,
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
  const draws = new GammaDraws(rng, shape, new Float64Array(1024));
  const J = sch.windows;
  const m = sch.saltPulses.length;
  const testS = lengthOf(iv.test);
  const baseS = lengthOf(iv.base);
  const offS = lengthOf(iv.offset);
  // Buffers reused across nodes (scratch.sim): simulated stretches, then the power search's draws.
  const buffer = (k: number, size: number): Float64Array<ArrayBuffer> => {
    if (!scratch.sim[k] || scratch.sim[k].length < size) scratch.sim[k] = new Float64Array(size);
    return scratch.sim[k];
  };
  let testBuf = buffer(0, Math.ceil(testS * rateHz * 1.5) + 16);
  let baseBuf = buffer(1, Math.ceil(baseS * rateHz * 1.5) + 16);
  let offBuf = buffer(2, Math.ceil(offS * rateHz * 1.5) + 16);
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
  const isTagged = (spikes: Float64Array, baseline?: SaltBaseline): boolean => {
    const r = lightResponse(spikes, sch, p, false, scratch, p.minEvokedReliability, baseline);
    return tagVerdict(r, NaN, artefactFlags(r, NaN, p), p, sch.saltProblem).tag === 'tagged';
  };

  // Power search draws, common random numbers: for responder s and pulse i, u decides
  // whether the pulse gets an added spike (u < R) and z its Gaussian latency; both
  // drawn once (their own stream), so they are the same at every R.
  const u = buffer(3, nPow * n).subarray(0, nPow * n);
  const z = buffer(4, nPow * n).subarray(0, nPow * n);
  const prng = new Rng(seed ^ 0x5bd1e995);
  prng.fillUniform(u);
  prng.fillNormalZiggurat(z);
  const lat = p.trustPowerLatencyMs / 1000;
  const jit = p.trustPowerJitterMs / 1000;
  let latestS = 0;
  for (let k = 0; k < nPow * n; k++) latestS = Math.max(latestS, lat + jit * z[k]);
  // Can an added spike (onset + 0.2 ms ... onset + latestS) fall in a baseline block? Then
  // the power units' baseline spikes are kept for that responder's whole train.
  const reach = nPow > 0 && windowsReach(sch.onset, 0.0002, Math.max(0.0002, latestS), iv.base);

  // Baseline stretches, each shared by at most BASELINE_SHARE null units (unit s uses
  // baseline s mod nBase; the power units s < nPow their own). Kept: SALT's baseline
  // half of each, and the spikes of those a train may need whole (the power units',
  // or all when offset windows reach into baseline blocks).
  const nBase = Math.min(nNull, Math.max(nPow, Math.ceil(nNull / BASELINE_SHARE)));
  const overlap = overlaps(iv.offset, iv.base);
  const baseRows: SaltBaseline[] = [];
  const baseTrain: Float64Array[] = [];
  for (let b = 0; b < nBase; b++) {
    const sim = simulateOn(draws, rateHz, iv.base, baseS, baseBuf);
    baseBuf = sim.buf;
    const train = baseBuf.subarray(0, sim.n);
    baseRows.push(saltBaseline(train, sch));
    baseTrain.push((b < nPow && reach) || overlap ? train.slice() : new Float64Array(0));
  }

  // Margin of the screens: window edges computed two ways may differ in the last bit.
  const screenAt = p.minEvokedReliability - 1e-3;
  // Power units: the null train's spikes in the test and offset windows (with the
  // baseline half, all a responder's lightResponse reads; the whole train when
  // offset windows reach into baseline blocks).
  const keep: Float64Array[] = [];
  let falseTagged = 0;
  let screenedOut = 0;
  for (let s = 0; s < nNull; s++) {
    const t = simulateOn(draws, rateHz, iv.test, testS, testBuf);
    testBuf = t.buf;
    const power = s < nPow;
    const b = s % nBase;
    const screen = !power && iv.testDisjoint;
    // Screen 1: reliability alone (the excess reliability is at most the reliability).
    // Screen 2: excess reliability over the baseline windows' spike probability.
    if (screen && (t.hit / n < screenAt || t.hit / n - baseRows[b].answered / (J * m) < screenAt)) {
      screenedOut++;
      continue;
    }
    const o = simulateOn(draws, rateHz, iv.offset, offS, offBuf);
    offBuf = o.buf;
    if (merged2.length < t.n + o.n) merged2 = new Float64Array(t.n + o.n);
    let spikes = merge(merged2, testBuf, t.n, offBuf, o.n);
    if (overlap) spikes = mergeInto(spikes, spikes.length, baseTrain[b], baseTrain[b].length);
    if (isTagged(spikes, overlap ? undefined : baseRows[b])) falseTagged++;
    if (power) keep.push(spikes.slice());
  }

  scratch.sim[0] = testBuf;
  scratch.sim[1] = baseBuf;
  scratch.sim[2] = offBuf;

  // Power search (u, z and lat, jit above).
  const added = buffer(5, n);
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
      for (let i = 0; i < n; i++) if (u[s * n + i] < R) added[m++] = sch.onset[i] + Math.max(0.0002, lat + jit * z[s * n + i]);
      const add = added.subarray(0, m);
      insertionSort(add);
      let train = mergeInto(keep[s], keep[s].length, add, m);
      // The responder's baseline half is its null train's unless an added spike fell in a block.
      let sb: SaltBaseline | undefined = overlap ? undefined : baseRows[s];
      if (sb && reach && anyInside(add, iv.base)) {
        train = merge(new Float64Array(train.length + baseTrain[s].length), train, train.length, baseTrain[s], baseTrain[s].length);
        sb = undefined;
      }
      if (isTagged(train, sb)) hits++;
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
