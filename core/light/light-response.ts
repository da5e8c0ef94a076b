import { lowerBound } from '../align/lower-bound';
import { lowerBoundNear } from '../align/lower-bound-near';
import { selectKth } from './select-kth';
import { poissonSf } from '../stats/distributions/poisson';
import type { Parameters } from '../defaults';
import type { LightSchedule } from './light-schedule';
import { saltBaseline, type SaltBaseline } from './salt-baseline';
import { createSaltScratch, saltTest, type SaltResult, type SaltScratch } from './salt-test';

/** One unit's answer to the session's pulses. Times in seconds, rates in Hz. */
export interface LightResponse {
  /** Pulses given, and pulses with at least one spike in the test window. */
  readonly pulses: number;
  /** Test window length, s. */
  readonly windowS: number;
  readonly answered: number;
  /** answered / pulses. */
  readonly reliability: number;
  /** Mean, median and SD (n - 1) of first-spike latency after onset over answered pulses, s. */
  readonly meanLatencyS: number;
  readonly medianLatencyS: number;
  readonly jitterS: number;
  /** Spikes in the test window per pulse (all spikes, not only the first). */
  readonly evokedPerPulse: number;
  /** Baseline rate, Hz, and where it was measured. */
  readonly baselineHz: number;
  readonly baselineSource: 'salt-windows' | 'light-free' | 'none';
  /** Rate in the test window minus baseline rate, Hz. */
  readonly evokedMinusBaselineHz: number;
  /** Exact Poisson test of the summed test-window counts against baselineHz (one-sided, excess). */
  readonly countP: number;
  /** Probability of >= 1 spike in a baseline window (mean over windows; SALT pulses). */
  readonly baselineReliability: number;
  /** Mean latency and SD of the excess spikes in the test window (baseline subtracted), s (see doc). */
  readonly evokedLatencyS: number;
  readonly evokedJitterS: number;
  /** Share of the excess spikes falling in the densest 2 x (artefactJitterMs / 2) slot of the test window. */
  readonly lockedShare: number;
  /** Share of the excess spikes in the densest two such slots >= 1 ms apart (onset- plus offset-locked events). */
  readonly lockedPairShare: number;
  /** Excess spikes in the offset windows, and the share of them in the densest slot. */
  readonly offsetExcess: number;
  readonly offsetLockedShare: number;
  /** SALT on the SALT pulses (NaN p when it cannot run). */
  readonly salt: SaltResult;
  readonly saltPulses: number;
  readonly saltWindows: number;
  /** Answers locked to pulse offset (pulses whose offset falls at or after the test window's end): pulses, answered, jitter (s), count-test p. */
  readonly offsetPulses: number;
  readonly offsetAnswered: number;
  readonly offsetJitterS: number;
  readonly offsetCountP: number;
  /** Per frequency group (schedule.frequencyKeys order): pulses, reliability, mean latency (s). Only with detail (true or 'summary'). */
  readonly frequencyPulses?: Float64Array;
  readonly frequencyReliability?: Float64Array;
  readonly frequencyLatencyS?: Float64Array;
  /** First-spike latency after onset per pulse, s (NaN = no spike in window). Only with detail true (not 'summary'). */
  readonly latencyS?: Float64Array;
}

/** Reusable buffers of lightResponse and ruleTrust (one per thread of work; grow on demand). */
export interface LightScratch {
  rel: Float64Array;
  /** Latencies for the median (selection reorders it). */
  med: Float64Array;
  counts: Int32Array;
  fine: Int32Array;
  salt: SaltScratch;
  /** ruleTrust: simulated spikes (test, baseline, offset stretches) and the power search's draws. */
  sim: Float64Array<ArrayBuffer>[];
}

/** Empty scratch space for lightResponse and ruleTrust. */
export function createLightScratch(): LightScratch {
  return { rel: new Float64Array(0), med: new Float64Array(0), counts: new Int32Array(0), fine: new Int32Array(0), salt: createSaltScratch(), sim: [] };
}

/**
 * Measures one unit's answer to the pulses of a schedule (lightSchedule).
 *
 * Per pulse, the first spike in [onset + windowStart, onset + windowEnd) gives
 * the first-spike latency (from onset); reliability = share of pulses with a
 * spike there; jitter = SD of those latencies. The same first-spike class
 * (no spike, or 1-ms bin) is taken in every SALT baseline window of the SALT
 * pulses and SALT is run (saltTest). Baseline rate = all spikes in the SALT
 * baseline windows / their total length (local to the light block); when SALT
 * cannot run, spikes in light-free time / light-free time. Count test: the
 * summed test-window count against Poisson(baselineHz x pulses x window),
 * P(X >= k) (exact; Poisson is an assumption: bursty firing makes it liberal,
 * which is why it never makes a unit `tagged` on its own).
 *
 * Evoked latency: mean time after onset of the excess spikes in the test
 * window, from all spikes (a PSTH, additive, so early spontaneous spikes
 * cannot hide late evoked ones as they do in first-spike statistics):
 * mu = (sum(t) - lambda w^2 / 2) / (k - lambda w), lambda = baselineHz x
 * pulses, w the window, k the window count; second moment likewise for the
 * evoked jitter. Truncated at the window end like every in-window measure;
 * NaN when there is no excess. lockedShare: the excess share in the densest
 * 2-bin slot of a histogram with bins artefactJitterMs / 2 wide (near 1 for a
 * zero-jitter artefact; about 0.1 for a 1-ms jitter answer); offsetLockedShare
 * the same after pulse offsets.
 *
 * saltMinExcess: SALT is skipped (p NaN) when the excess reliability is below
 * it (the trust simulation's shortcut: such a unit cannot be `tagged`).
 * baseline: SALT's baseline half (saltBaseline) of a train with the same
 * spikes in the baseline blocks, used instead of scanning them (the trust
 * simulation's responders: same null train, added spikes after the pulses);
 * the result is then that of the train with those baseline spikes.
 *
 * detail: false gives no median, per-frequency figures or per-pulse
 * latencies; 'summary' the median and per-frequency figures; true also the
 * per-pulse latencies (latencyS, one array of pulses' length per call: on
 * this machine allocating it cost more than the whole scan, so the light step
 * asks for it only when the waveform match needs it).
 *
 * Cost: two forward walks over the spikes (lowerBoundNear from the previous
 * window: the test windows in pulse order, then the SALT baseline blocks in
 * time order, schedule.saltBlockOrder), reading each spike inside a window
 * once; no allocation per pulse (detail false or 'summary' allocate nothing
 * per pulse once the scratch has grown). Results do not depend on the order
 * the blocks are read in (integer counts). Spike times must be sorted (as a
 * Recording's are). Edge cases: no pulses -> pulses 0 and NaN measures; no
 * spikes -> reliability 0, NaN latencies.
 */
export function lightResponse(
  spikeTimes: Float64Array,
  sch: LightSchedule,
  p: Parameters['light'],
  detail: boolean | 'summary' = false,
  scratch: LightScratch = createLightScratch(),
  saltMinExcess = -Infinity,
  baseline?: SaltBaseline,
): LightResponse {
  const n = sch.n;
  const ns = spikeTimes.length;
  const ws = sch.windowStartS;
  const wn = sch.windowS;
  const binS = sch.binS;
  const nBins = sch.nBins;
  if (scratch.rel.length < n) scratch.rel = new Float64Array(n);
  const rel = scratch.rel;
  const offsetWindowS = p.offsetWindowMs / 1000;
  // Fine histograms (bins of half the artefact jitter) of all spikes after onset and after offset.
  const fineS = p.artefactJitterMs / 2000;
  const nFine = Math.max(2, Math.ceil(wn / fineS - 1e-9));
  const nFineOff = Math.max(2, Math.ceil(offsetWindowS / fineS - 1e-9));
  if (scratch.fine.length < nFine + nFineOff) scratch.fine = new Int32Array(nFine + nFineOff);
  const fine = scratch.fine;
  fine.fill(0, 0, nFine + nFineOff);

  // Test windows: one forward pointer (onsets are sorted).
  let idx = 0;
  let answered = 0;
  let windowSpikes = 0;
  let sumL = 0;
  let sumL2 = 0;
  let allSum = 0;
  let allSum2 = 0;
  const onset = sch.onset;
  for (let i = 0; i < n; i++) {
    const lo = onset[i] + ws;
    const hi = lo + wn;
    // lowerBoundNear(spikeTimes, lo, idx), its usual case (a few steps forward) written out:
    // a call per pulse cost more than the walk.
    if (idx < ns && spikeTimes[idx] < lo) {
      let q = 0;
      do idx++;
      while (idx < ns && spikeTimes[idx] < lo && ++q < 8);
      if (idx < ns && spikeTimes[idx] < lo) idx = lowerBoundNear(spikeTimes, lo, idx);
    } else if (idx > 0 && spikeTimes[idx - 1] >= lo) idx = lowerBoundNear(spikeTimes, lo, idx);
    if (idx < ns && spikeTimes[idx] < hi) {
      const r = spikeTimes[idx] - lo;
      rel[i] = r;
      answered++;
      sumL += r;
      sumL2 += r * r;
      let j = idx;
      for (; j < ns && spikeTimes[j] < hi; j++) {
        const q = spikeTimes[j] - lo;
        allSum += q;
        allSum2 += q * q;
        let fb = Math.floor(q / fineS);
        if (fb >= nFine) fb = nFine - 1;
        fine[fb]++;
      }
      windowSpikes += j - idx;
    } else rel[i] = NaN;
  }

  // Offset-locked answers.
  let offsetPulses = 0;
  let offsetAnswered = 0;
  let offSpikes = 0;
  let sumO = 0;
  let sumO2 = 0;
  idx = 0;
  // Offsets inside the test window are covered by the test window's own zero-jitter check:
  // only the pulses of sch.offsetPulses (offset at or after the test window's end) are read.
  const offList = sch.offsetPulses;
  const offset = sch.offset;
  for (let k = 0; k < offList.length; k++) {
    const i = offList[k];
    const lo = offset[i];
    offsetPulses++;
    const hi = lo + offsetWindowS;
    idx = lowerBoundNear(spikeTimes, lo, idx);
    if (idx < ns && spikeTimes[idx] < hi) {
      const r = spikeTimes[idx] - lo;
      offsetAnswered++;
      sumO += r;
      sumO2 += r * r;
      let j = idx;
      for (; j < ns && spikeTimes[j] < hi; j++) {
        let fb = Math.floor((spikeTimes[j] - lo) / fineS);
        if (fb >= nFineOff) fb = nFineOff - 1;
        fine[nFine + fb]++;
      }
      offSpikes += j - idx;
    }
  }

  // SALT histograms: row 0 test, rows 1..J baseline windows; class 0 = no spike.
  const J = sch.windows;
  const classes = nBins + 1;
  const m = sch.saltPulses.length;
  let salt: SaltResult = { p: NaN, pCalibrated: NaN, informationDifference: NaN, testDistance: NaN, nullMedian: NaN, nullCount: 0, rows: 0 };
  let baselineHz = NaN;
  let baselineSource: LightResponse['baselineSource'] = 'none';
  let baselineReliability = NaN;
  if (J > 0 && m > 0) {
    const size = (J + 1) * classes;
    if (scratch.counts.length < size) scratch.counts = new Int32Array(size);
    const counts = scratch.counts;
    counts.fill(0, 0, size);
    // Test row: the first-spike class of every SALT pulse.
    const saltPulses = sch.saltPulses;
    for (let k = 0; k < m; k++) {
      const r = rel[saltPulses[k]];
      if (r === r) {
        let b = Math.floor(r / binS);
        if (b >= nBins) b = nBins - 1;
        counts[1 + b]++;
      } else counts[0]++;
    }
    // Baseline rows 1..J (scanned here, or the caller's for a train with the same baseline spikes).
    let base: SaltBaseline;
    if (baseline) {
      counts.set(baseline.rows.subarray(0, J * classes), classes);
      base = baseline;
    } else base = saltBaseline(spikeTimes, sch, counts.subarray(classes, size));
    const baseSpikes = base.spikes;
    const baseAnswered = base.answered;
    if (answered / n - baseAnswered / (m * J) >= saltMinExcess) salt = saltTest(counts, J + 1, classes, m, scratch.salt);
    baselineHz = baseSpikes / (m * J * wn);
    baselineSource = 'salt-windows';
    baselineReliability = baseAnswered / (m * J);
  } else if (sch.lightFreeS > 0) {
    let inSpan = lowerBound(spikeTimes, sch.span[1]) - lowerBound(spikeTimes, sch.span[0]);
    const li = sch.lightIntervals;
    for (let k = 0; k < li.length; k += 2) {
      const a = Math.max(li[k], sch.span[0]);
      const b = Math.min(li[k + 1], sch.span[1]);
      if (b > a) inSpan -= lowerBound(spikeTimes, b) - lowerBound(spikeTimes, a);
    }
    baselineHz = inSpan / sch.lightFreeS;
    baselineSource = 'light-free';
  }

  const reliability = n > 0 ? answered / n : NaN;
  const meanRel = answered > 0 ? sumL / answered : NaN;
  const jitterS = answered > 1 ? Math.sqrt(Math.max(0, (sumL2 - answered * meanRel * meanRel) / (answered - 1))) : NaN;
  const evokedPerPulse = n > 0 ? windowSpikes / n : NaN;
  const countP = n > 0 && baselineHz === baselineHz ? poissonSf(windowSpikes, baselineHz * n * wn) : NaN;
  const offsetCountP = offsetPulses > 0 && baselineHz === baselineHz ? poissonSf(offSpikes, baselineHz * offsetPulses * offsetWindowS) : NaN;
  const offMean = offsetAnswered > 0 ? sumO / offsetAnswered : NaN;
  const offsetJitterS = offsetAnswered > 1 ? Math.sqrt(Math.max(0, (sumO2 - offsetAnswered * offMean * offMean) / (offsetAnswered - 1))) : NaN;

  // Excess spikes (all spikes, additive, so spontaneous spikes cannot mask evoked ones).
  let evokedLatencyS = NaN;
  let evokedJitterS = NaN;
  let lockedShare = NaN;
  let lockedPairShare = NaN;
  let offsetLockedShare = NaN;
  if (n > 0 && baselineHz === baselineHz) {
    const lam = baselineHz * n;
    const excess = windowSpikes - lam * wn;
    if (excess > 0) {
      const mu = (allSum - (lam * wn * wn) / 2) / excess;
      const m2 = (allSum2 - (lam * wn * wn * wn) / 3) / excess;
      evokedLatencyS = mu + ws;
      evokedJitterS = m2 - mu * mu > 0 ? Math.sqrt(m2 - mu * mu) : 0;
      // Densest slot, and densest two slots >= 1 ms apart (onset- and offset-locked events).
      const gap = Math.ceil(0.001 / fineS - 1e-9);
      let best = 0;
      let bestPair = 0;
      let bestBefore = 0;
      for (let b = 0; b + 1 < nFine; b++) {
        const here = fine[b] + fine[b + 1];
        if (b - gap >= 0) bestBefore = Math.max(bestBefore, fine[b - gap] + fine[b - gap + 1]);
        best = Math.max(best, here);
        if (b >= gap) bestPair = Math.max(bestPair, here + bestBefore);
      }
      lockedShare = (best - lam * 2 * fineS) / excess;
      lockedPairShare = (bestPair - lam * 4 * fineS) / excess;
    }
    const offExcess = offSpikes - baselineHz * offsetPulses * offsetWindowS;
    if (offExcess > 0) {
      let best = 0;
      for (let b = 0; b + 1 < nFineOff; b++) best = Math.max(best, fine[nFine + b] + fine[nFine + b + 1]);
      offsetLockedShare = (best - baselineHz * offsetPulses * 2 * fineS) / offExcess;
    }
  }

  let medianLatencyS = NaN;
  let latencyS: Float64Array | undefined;
  let frequencyPulses: Float64Array | undefined;
  let frequencyReliability: Float64Array | undefined;
  let frequencyLatencyS: Float64Array | undefined;
  if (detail) {
    // Median and per-frequency figures from rel (no allocation per pulse; the
    // per-pulse latencies are copied out only when detail is true).
    if (detail === true) latencyS = new Float64Array(n);
    if (scratch.med.length < n) scratch.med = new Float64Array(n);
    const med = scratch.med;
    const nf = sch.frequencyKeys.length;
    frequencyPulses = new Float64Array(nf);
    const fAns = new Float64Array(nf);
    const fSum = new Float64Array(nf);
    const fIndex = sch.frequencyIndex;
    let got = 0;
    for (let i = 0; i < n; i++) {
      const l = rel[i] + ws;
      if (latencyS) latencyS[i] = l;
      const f = fIndex[i];
      frequencyPulses[f]++;
      if (l === l) {
        med[got++] = l;
        fAns[f]++;
        fSum[f] += l;
      }
    }
    if (got) medianLatencyS = got % 2 ? selectKth(med, got, (got - 1) / 2) : medianOfEven(med, got);
    frequencyReliability = new Float64Array(nf);
    frequencyLatencyS = new Float64Array(nf);
    for (let f = 0; f < nf; f++) {
      frequencyReliability[f] = frequencyPulses[f] > 0 ? fAns[f] / frequencyPulses[f] : NaN;
      frequencyLatencyS[f] = fAns[f] > 0 ? fSum[f] / fAns[f] : NaN;
    }
  }

  return {
    pulses: n,
    windowS: wn,
    answered,
    reliability,
    meanLatencyS: meanRel + ws,
    medianLatencyS,
    jitterS,
    evokedPerPulse,
    baselineHz,
    baselineSource,
    evokedMinusBaselineHz: n > 0 && wn > 0 ? evokedPerPulse / wn - baselineHz : NaN,
    countP,
    baselineReliability,
    evokedLatencyS,
    evokedJitterS,
    salt,
    saltPulses: J > 0 ? m : 0,
    saltWindows: J,
    offsetPulses,
    offsetAnswered,
    offsetJitterS,
    offsetCountP,
    offsetExcess: offsetPulses > 0 && baselineHz === baselineHz ? offSpikes - baselineHz * offsetPulses * offsetWindowS : NaN,
    lockedShare,
    lockedPairShare,
    offsetLockedShare,
    frequencyPulses,
    frequencyReliability,
    frequencyLatencyS,
    latencyS,
  };
}

/** Median of x[0..n) for even n > 0 by selection (x is reordered). */
function medianOfEven(x: Float64Array, n: number): number {
  const hi = selectKth(x, n, n / 2);
  let lo = -Infinity;
  for (let i = 0; i < n / 2; i++) if (x[i] > lo) lo = x[i];
  return (lo + hi) / 2;
}

