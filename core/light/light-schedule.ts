import type { Parameters } from '../defaults';
import type { Pulses } from '../model/types';
import { formatNumber } from '../table/format-number';

/**
 * Everything about a session's pulses that every unit shares: test windows,
 * SALT baseline windows, frequency groups, pulse index in its train, and the
 * light-affected time. Built once per session; every per-unit scan reads it.
 */
export interface LightSchedule {
  /** Number of pulses. */
  readonly n: number;
  /** Recording span, s. */
  readonly span: readonly [number, number];
  /** Pulse onsets, s (sorted). */
  readonly onset: Float64Array;
  /** Pulse offsets, s (NaN when the duration is unknown). */
  readonly offset: Float64Array;
  /** Pulses whose offset is known and falls at or after the end of their test window (the only offset windows lightResponse reads), ascending. */
  readonly offsetPulses: Int32Array;
  /** Test window [onset + windowStartS, onset + windowEndS), s relative to onset. */
  readonly windowStartS: number;
  readonly windowEndS: number;
  /** Window length (SALT's wn), s. */
  readonly windowS: number;
  /** SALT latency bin, s, and bins per window. */
  readonly binS: number;
  readonly nBins: number;
  /**
   * Baseline window j (0-based) of pulse i is
   * [anchor[i] - (j + 1) * windowS, anchor[i] - j * windowS). Anchors sit in the
   * light-free stretch before the pulse's light group; the m-th pulse of a group
   * (a train) has its block of `windows` windows stacked m blocks further back, so
   * no two pulses (and no two baseline rows) share any stretch of time, and none
   * sits in the gaps between pulses of a train. This keeps the test window
   * exchangeable with the baseline windows under no light effect (SALT's
   * calibrated p relies on it).
   */
  readonly anchor: Float64Array;
  /** Whole windows of light-free time left for each pulse's own block once the earlier pulses of its group took theirs (capped at the maximum). */
  readonly available: Int32Array;
  /** Baseline windows SALT uses (0 when SALT cannot run). */
  readonly windows: number;
  /** Pulses SALT uses (those with `windows` baseline windows available), ascending indices. */
  readonly saltPulses: Int32Array;
  /** saltPulses sorted by the start of their baseline block (ties by pulse index): the time order a single forward walk over a unit's spikes reads the blocks in. */
  readonly saltBlockOrder: Int32Array;
  /** Why SALT cannot run ("" when it can). */
  readonly saltProblem: string;
  /** Frequency groups: key ("single", "10hz", "12p5hz"), frequency (NaN = single pulses). */
  readonly frequencyKeys: readonly string[];
  readonly frequencies: readonly number[];
  /** Frequency group of each pulse (index into frequencyKeys). */
  readonly frequencyIndex: Int32Array;
  /** 0-based position of each pulse in its train (by train id). */
  readonly indexInTrain: Int32Array;
  /** Merged light-affected intervals [a0, b0, a1, b1, ...], s. */
  readonly lightIntervals: Float64Array;
  /** Light-free time inside the span, s. */
  readonly lightFreeS: number;
  /** Light groups: pulses whose light-free gap before them is shorter than saltMinWindows windows share one. */
  readonly groupCount: number;
}

/**
 * Builds the session's light schedule.
 *
 * Light-affected time of pulse k: [onset_k + min(0, windowStart), max(offset_k,
 * onset_k + windowEnd) + lightGuardMs]; durations that are NaN count as 0.
 * Light groups: a pulse opens a new group when the light-free time since the
 * previous pulse's light-affected time holds at least saltMinWindows windows;
 * otherwise it joins the previous pulse's group (a train, or pulses too close
 * for their own baseline).
 *
 * Baseline blocks: with g the group's first onset (+ windowStart when negative)
 * and m the pulse's position in its group, anchor = g - m J w: blocks of J
 * windows stacked back from the group's start, one per pulse, disjoint. A
 * 20 Hz train never uses its 50 ms inter-pulse gaps as baseline (issue 3), and
 * no stretch of time serves two pulses: an earlier design shifted each train
 * pulse back by its delay only, so window j of pulse m was window j + 5m of
 * pulse 0 at 20 Hz; the shared data made baseline rows alike and the test row
 * look outlying under no light effect (measured: calibrated p <= 0.05 in 12 %
 * of null units on train-only schedules).
 *
 * Windows used: the largest J <= saltBaselineMs / window such that at least
 * saltMinPulseFraction of the pulses get a whole block (the earliest pulses of
 * each group); when even saltMinWindows cannot give that many (dense light),
 * J = saltMinWindows on the pulses that have room. Pulses without a block are
 * left out of SALT (not out of the other measures). No pulse with
 * saltMinWindows windows of its own: SALT cannot run and saltProblem says why.
 *
 * Frequency (3 significant digits, so 19.9999 and 20.0001 Hz are one group):
 * the pulse's frequencyHz; when NaN and its train has >= 2 pulses,
 * 1 / median inter-pulse interval of the train (3 significant digits); else a
 * single pulse.
 */
export function lightSchedule(pulses: Pulses, span: readonly [number, number], p: Parameters['light']): LightSchedule {
  const n = pulses.onset.length;
  const onset = pulses.onset;
  const windowStartS = p.windowStartMs / 1000;
  const windowEndS = p.windowEndMs / 1000;
  const windowS = windowEndS - windowStartS;
  const binS = p.saltBinMs / 1000;
  const nBins = Math.max(1, Math.round(windowS / binS));
  const guardS = p.lightGuardMs / 1000;
  const maxWindows = windowS > 0 ? Math.max(0, Math.floor(p.saltBaselineMs / 1000 / windowS + 1e-9)) : 0;

  const offset = new Float64Array(n);
  const lightStart = new Float64Array(n);
  const lightEnd = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const d = pulses.duration[i];
    offset[i] = Number.isFinite(d) ? onset[i] + d : NaN;
    lightStart[i] = onset[i] + Math.min(0, windowStartS);
    lightEnd[i] = Math.max(Number.isFinite(d) ? onset[i] + d : onset[i], onset[i] + windowEndS) + guardS;
  }

  // Merged light-affected intervals and light-free time in the span.
  const merged: number[] = [];
  for (let i = 0; i < n; i++) {
    const a = lightStart[i];
    const b = lightEnd[i];
    if (merged.length && a <= merged[merged.length - 1]) merged[merged.length - 1] = Math.max(merged[merged.length - 1], b);
    else merged.push(a, b);
  }
  const lightIntervals = Float64Array.from(merged);
  let lightS = 0;
  for (let k = 0; k < lightIntervals.length; k += 2) {
    const a = Math.max(lightIntervals[k], span[0]);
    const b = Math.min(lightIntervals[k + 1], span[1]);
    if (b > a) lightS += b - a;
  }
  const lightFreeS = Math.max(0, span[1] - span[0] - lightS);

  // Light groups: a pulse opens a new group when the light-free time since the
  // previous pulse's light-affected time holds saltMinWindows windows.
  const group = new Int32Array(n);
  const posInGroup = new Int32Array(n);
  const groupRef: number[] = [];
  const groupFree: number[] = [];
  const groupSize: number[] = [];
  const minBaselineS = p.saltMinWindows * windowS;
  let prevEnd = -Infinity;
  for (let i = 0; i < n; i++) {
    const gapStart = Math.max(span[0], prevEnd);
    if (i === 0 || onset[i] - gapStart >= minBaselineS) {
      const ref = onset[i] + Math.min(0, windowStartS);
      groupRef.push(ref);
      groupFree.push(Math.max(0, ref - gapStart));
      groupSize.push(0);
    }
    const g = groupRef.length - 1;
    group[i] = g;
    posInGroup[i] = groupSize[g]++;
    prevEnd = Math.max(prevEnd, lightEnd[i]);
  }
  const groupCount = groupRef.length;

  // Windows used: every SALT pulse takes its own block of J windows, the blocks of
  // a group's pulses stacked back from the group's start (pulse m of the group:
  // [ref - (m + 1) J w, ref - m J w)), so no stretch of time is shared by two
  // pulses or two baseline rows. J = the largest J <= maxWindows for which at
  // least saltMinPulseFraction of the pulses get a block (the first ones of each
  // group), else saltMinWindows.
  const fits = (J: number): number => {
    let c = 0;
    for (let g = 0; g < groupCount; g++) c += Math.min(groupSize[g], Math.floor(groupFree[g] / (J * windowS) + 1e-9));
    return c;
  };
  const keep = Math.ceil(p.saltMinPulseFraction * n);
  const minJ = Math.max(1, p.saltMinWindows);
  let windows = 0;
  let saltProblem = '';
  if (n === 0) saltProblem = 'no laser pulses';
  else if (maxWindows < minJ || fits(minJ) === 0) {
    saltProblem = `too little light-free time before the pulses for SALT (no pulse has ${minJ} baseline windows of ${formatNumber(windowS * 1000, 3)} ms of its own; at least ${p.saltMinWindows} needed)`;
  } else {
    windows = minJ;
    for (let J = maxWindows; J > minJ; J--) {
      if (fits(J) >= keep) {
        windows = J;
        break;
      }
    }
  }
  const anchor = new Float64Array(n);
  const available = new Int32Array(n);
  const stack = windows > 0 ? windows : 0;
  for (let i = 0; i < n; i++) {
    const g = group[i];
    anchor[i] = groupRef[g] - posInGroup[i] * stack * windowS;
    const room = (anchor[i] - (groupRef[g] - groupFree[g])) / windowS;
    available[i] = Math.max(0, Math.min(maxWindows, Math.floor(room + 1e-9)));
  }
  const salt: number[] = [];
  if (windows > 0) for (let i = 0; i < n; i++) if (available[i] >= windows) salt.push(i);

  // Frequencies and pulse index in train.
  const trainCount = new Map<number, number>();
  const trainMembers = new Map<number, number[]>();
  const indexInTrain = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const t = pulses.train[i];
    const c = trainCount.get(t) ?? 0;
    indexInTrain[i] = c;
    trainCount.set(t, c + 1);
    const m = trainMembers.get(t);
    if (m) m.push(i);
    else trainMembers.set(t, [i]);
  }
  const freqOf = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const f = pulses.frequencyHz[i];
    if (Number.isFinite(f) && f > 0) freqOf[i] = Number(f.toPrecision(3));
    else {
      const members = trainMembers.get(pulses.train[i])!;
      if (members.length < 2) freqOf[i] = NaN;
      else {
        const ipi = members.slice(1).map((k, j) => onset[k] - onset[members[j]]).sort((a, b) => a - b);
        const m = ipi.length % 2 ? ipi[(ipi.length - 1) / 2] : (ipi[ipi.length / 2 - 1] + ipi[ipi.length / 2]) / 2;
        freqOf[i] = m > 0 ? Number((1 / m).toPrecision(3)) : NaN;
      }
    }
  }
  const distinct = [...new Set(Array.from(freqOf, (f) => (Number.isNaN(f) ? -1 : f)))].sort((a, b) => a - b);
  const frequencies = distinct.map((f) => (f < 0 ? NaN : f));
  const frequencyKeys = frequencies.map((f) => (Number.isNaN(f) ? 'single' : `${formatNumber(f, 3).replace('.', 'p')}hz`));
  const frequencyIndex = new Int32Array(n);
  for (let i = 0; i < n; i++) frequencyIndex[i] = distinct.indexOf(Number.isNaN(freqOf[i]) ? -1 : freqOf[i]);

  const offsetPulses: number[] = [];
  for (let i = 0; i < n; i++) if (Number.isFinite(offset[i]) && offset[i] >= onset[i] + windowEndS) offsetPulses.push(i);

  return {
    n,
    span,
    onset,
    offset,
    offsetPulses: Int32Array.from(offsetPulses),
    windowStartS,
    windowEndS,
    windowS,
    binS,
    nBins,
    anchor,
    available,
    windows,
    saltPulses: Int32Array.from(salt),
    saltBlockOrder: Int32Array.from(salt).sort((a, b) => anchor[a] - anchor[b] || a - b),
    saltProblem,
    frequencyKeys,
    frequencies,
    frequencyIndex,
    indexInTrain,
    lightIntervals,
    lightFreeS,
    groupCount,
  };
}
