import { lowerBoundFrom } from '../align/lower-bound-from';

/**
 * Mean firing rate of one unit as a function of time-in-trial over a set of
 * reference trials, as a cumulative integral on a fine grid, so the mean
 * rate over any window [t0 + a, t0 + b) of time-in-trial is one subtraction.
 *
 * Grid step resolutionS (1 ms by default): window edges are rounded to it.
 * Each grid bin's rate averages only the trials still running then
 * (time-in-trial < stop - start); where no trial covers a bin the integral
 * becomes NaN from there on, and windows reaching it give NaN.
 *
 * Many units in a row: pass the same `scratch` each time; its buffers are
 * reused (a 1 ms grid over seconds is tens of kilobytes, and allocating them
 * per unit cost more than the counting), and the profile returned stays
 * valid until the next call with that scratch. Trials in order of start time
 * walk the spike train once (each search starts where the previous trial ended).
 */
export interface ReferenceProfile {
  /** Mean rate (Hz) over time-in-trial [a, b), NaN when not covered. */
  meanRate(a: number, b: number): number;
  /**
   * Mean rate (Hz) in nBins consecutive bins of binS from time-in-trial a,
   * added times `scale` into out[0..nBins) (NaN bins are skipped; returns false
   * if any bin was not covered).
   */
  addBins(a: number, binS: number, nBins: number, scale: number, out: Float64Array): boolean;
}

/** Reusable buffers of referenceProfile (start with empty arrays; they grow as needed). */
export interface ReferenceProfileScratch {
  count: Float64Array;
  cover: Float64Array;
  integral: Float64Array;
}

export function referenceProfile(
  spikeTimes: ArrayLike<number>,
  starts: ArrayLike<number>,
  stops: ArrayLike<number>,
  lengthS: number,
  resolutionS = 0.001,
  scratch?: ReferenceProfileScratch,
): ReferenceProfile {
  const nGrid = Math.max(1, Math.ceil(lengthS / resolutionS));
  let count: Float64Array;
  let cover: Float64Array;
  let integral: Float64Array;
  if (scratch) {
    if (scratch.count.length < nGrid) {
      scratch.count = new Float64Array(nGrid);
      scratch.cover = new Float64Array(nGrid + 1);
      scratch.integral = new Float64Array(nGrid + 1);
    }
    count = scratch.count.subarray(0, nGrid);
    cover = scratch.cover.subarray(0, nGrid + 1);
    integral = scratch.integral.subarray(0, nGrid + 1);
    count.fill(0);
    cover.fill(0);
    integral[0] = 0;
  } else {
    count = new Float64Array(nGrid);
    cover = new Float64Array(nGrid + 1);
    integral = new Float64Array(nGrid + 1);
  }
  const nSpikes = spikeTimes.length;
  const rateHz = nSpikes > 1 ? (nSpikes - 1) / (spikeTimes[nSpikes - 1] - spikeTimes[0]) : 0; // guesses where each trial starts
  let hint = 0;
  for (let r = 0; r < starts.length; r++) {
    const s = starts[r];
    const len = Math.min(lengthS, stops[r] - s);
    if (!(len > 0)) continue;
    const covered = Math.min(nGrid, Math.floor(len / resolutionS));
    cover[0] += 1;
    cover[covered] -= 1;
    const end = s + covered * resolutionS;
    hint = countTrial(spikeTimes, lowerBoundFrom(spikeTimes, s, hint, rateHz), s, end, resolutionS, covered, count);
  }
  // Cumulative integral of the mean rate (spikes per trial), NaN once coverage ends.
  let c = 0;
  for (let j = 0; j < nGrid; j++) {
    c += cover[j];
    const add = c > 0 ? (count[j] === 0 ? 0 : count[j] / c) : NaN; // 0 / c = 0: most grid bins are empty
    integral[j + 1] = integral[j] + add;
  }
  return {
    meanRate(a: number, b: number): number {
      const ia = Math.round(a / resolutionS);
      const ib = Math.round(b / resolutionS);
      if (ia < 0 || ib > nGrid || !(ib > ia)) return NaN;
      return (integral[ib] - integral[ia]) / ((ib - ia) * resolutionS);
    },
    addBins(a: number, binS: number, nBins: number, scale: number, out: Float64Array): boolean {
      const ia = Math.round(a / resolutionS);
      const step = Math.round(binS / resolutionS);
      if (ia < 0 || ia + step * nBins > nGrid || !(step > 0)) return false;
      const f = scale / (step * resolutionS);
      let ok = true;
      for (let j = 0; j < nBins; j++) {
        const v = integral[ia + step * (j + 1)] - integral[ia + step * j];
        if (v === v) out[j] += f * v;
        else ok = false;
      }
      return ok;
    },
  };
}

/**
 * Spikes of one trial from index i (its first spike at or after s) up to
 * `end`, added to count[] by grid bin (bins at or past `covered` are not
 * counted). Returns the index past the trial. A function per trial, so V8
 * optimises it whole rather than compiling the caller's loop half-way.
 */
function countTrial(spikeTimes: ArrayLike<number>, i: number, s: number, end: number, resolutionS: number, covered: number, count: Float64Array): number {
  const n = spikeTimes.length;
  for (; i < n && spikeTimes[i] < end; i++) {
    const j = Math.floor((spikeTimes[i] - s) / resolutionS);
    if (j < covered) count[j]++;
  }
  return i;
}
