import { lowerBoundNear } from '../align/lower-bound-near';
import type { LightSchedule } from './light-schedule';

/** The baseline half of SALT's histograms for one spike train (see saltBaseline). */
export interface SaltBaseline {
  /** J rows of nBins + 1 classes: row w, class 0 = no spike in window w, class b = first spike in latency bin b. */
  readonly rows: Int32Array;
  /** Spikes in all baseline windows, and windows with at least one spike. */
  readonly spikes: number;
  readonly answered: number;
}

/**
 * SALT's baseline histograms of a spike train on a schedule (lightSchedule):
 * for every SALT pulse, its block of J windows [anchor - J w, anchor) cut into
 * windows w = floor((t - start) / w) (the last one ends at the anchor), and in
 * each window the first spike's latency bin floor((t - windowStart) / bin)
 * (clamped to the bins) or "no spike". Row w counts window w over the SALT
 * pulses; also the spikes in all blocks and the windows with a spike (the
 * baseline rate and reliability of lightResponse).
 *
 * Depends only on the spikes inside the blocks, so a train that differs only
 * outside them (the trust simulation's responders: a null train plus spikes
 * after the pulses) has the same baseline; lightResponse takes a precomputed one.
 *
 * Blocks are read in time order (schedule.saltBlockOrder) by one forward walk
 * (lowerBoundNear from the previous block); integer counts, so the order does
 * not change any result. rows: optional output (length >= J (nBins + 1),
 * overwritten). J = 0 (SALT not run): empty rows, zero counts. Spike times
 * must be sorted.
 */
export function saltBaseline(spikeTimes: Float64Array, sch: LightSchedule, rows?: Int32Array): SaltBaseline {
  const J = sch.windows;
  const nBins = sch.nBins;
  const classes = nBins + 1;
  const m = J > 0 ? sch.saltPulses.length : 0;
  const size = J * classes;
  const out = rows ?? new Int32Array(size);
  out.fill(0, 0, size);
  const wn = sch.windowS;
  const binS = sch.binS;
  const ns = spikeTimes.length;
  const order = sch.saltBlockOrder;
  const anchor = sch.anchor;
  let spikes = 0;
  let answered = 0;
  let hint = 0;
  for (let k = 0; k < m; k++) {
    const end = anchor[order[k]];
    const start = end - J * wn;
    // lowerBoundNear(spikeTimes, start, hint), its usual case (a few steps forward) written out:
    // a call per block cost more than the walk.
    if (hint < ns && spikeTimes[hint] < start) {
      let q = 0;
      do hint++;
      while (hint < ns && spikeTimes[hint] < start && ++q < 8);
      if (hint < ns && spikeTimes[hint] < start) hint = lowerBoundNear(spikeTimes, start, hint);
    } else if (hint > 0 && spikeTimes[hint - 1] >= start) hint = lowerBoundNear(spikeTimes, start, hint);
    if (hint >= ns || spikeTimes[hint] >= end) continue;
    let last = -1;
    let j = hint;
    for (; j < ns; j++) {
      const t = spikeTimes[j];
      if (t >= end) break;
      spikes++;
      let w = Math.floor((t - start) / wn);
      if (w >= J) w = J - 1;
      if (w === last) continue;
      last = w;
      const r0 = t - (start + w * wn);
      let b = Math.floor(r0 / binS);
      if (b >= nBins) b = nBins - 1;
      if (b < 0) b = 0;
      out[w * classes + 1 + b]++;
      answered++;
    }
    hint = j;
  }
  for (let w = 0; w < J; w++) {
    let c = 0;
    const o = w * classes;
    for (let b = 1; b < classes; b++) c += out[o + b];
    out[o] = m - c;
  }
  return { rows: out, spikes, answered };
}
