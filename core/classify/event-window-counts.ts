import { lowerBoundFrom } from '../align/lower-bound-from';

/**
 * Around one event at time t (s), in one walk over the spikes: the number of
 * spikes in each of three windows [t + edgesS[2w], t + edgesS[2w + 1]) (w =
 * 0, 1, 2; a window whose end is not after its start counts 0), written to
 * windowCounts[0..2], and the PSTH counts of nBins bins of binS from
 * lo = t + psthStartS added to psth[0..nBins) (bin floor((x - lo) / binS),
 * the last bin keeping rounding at the far edge, spikes in [lo, lo + nBins
 * binS)). A non-finite t counts nothing.
 *
 * The same counts as lowerBound(t + b) - lowerBound(t + a) for each window
 * and addWindowCounts for the PSTH (the jump test used one search per window
 * edge, seven per event; here one search and one pass over the event's
 * spikes). Checked against those in test/core/classify/event-window-counts.test.ts.
 *
 * hint: an index at or before the first spike of interest (e.g. this
 * function's return value for the previous event, events in time order);
 * any hint gives the same counts; rateHz, the train's mean rate, guesses how
 * far ahead the walk starts (lowerBoundFrom; NaN: walk on from the hint).
 * Returns the index of the first spike at or after the walk's start.
 */
export function eventWindowCounts(
  spikeTimes: Float64Array,
  t: number,
  edgesS: ArrayLike<number>,
  windowCounts: Float64Array,
  psthStartS: number,
  binS: number,
  nBins: number,
  psth: Float64Array,
  hint: number,
  rateHz = NaN,
): number {
  windowCounts[0] = 0;
  windowCounts[1] = 0;
  windowCounts[2] = 0;
  if (!Number.isFinite(t)) return hint;
  const lo = t + psthStartS;
  const hi = lo + nBins * binS;
  let a0 = t + edgesS[0];
  let b0 = t + edgesS[1];
  let a1 = t + edgesS[2];
  let b1 = t + edgesS[3];
  let a2 = t + edgesS[4];
  let b2 = t + edgesS[5];
  // An empty window matches no spike.
  if (!(b0 > a0)) (a0 = Infinity), (b0 = -Infinity);
  if (!(b1 > a1)) (a1 = Infinity), (b1 = -Infinity);
  if (!(b2 > a2)) (a2 = Infinity), (b2 = -Infinity);
  const from = Math.min(lo, a0, a1, a2);
  const to = Math.max(hi, b0, b1, b2);
  const n = spikeTimes.length;
  const start = lowerBoundFrom(spikeTimes, from, hint, rateHz);
  let c0 = 0;
  let c1 = 0;
  let c2 = 0;
  for (let i = start; i < n; i++) {
    const x = spikeTimes[i];
    if (x >= to) break;
    if (x >= lo && x < hi) {
      let j = Math.floor((x - lo) / binS);
      if (j >= nBins) j = nBins - 1; // rounding at the far edge
      psth[j]++;
    }
    if (x >= a0 && x < b0) c0++;
    if (x >= a1 && x < b1) c1++;
    if (x >= a2 && x < b2) c2++;
  }
  windowCounts[0] = c0;
  windowCounts[1] = c1;
  windowCounts[2] = c2;
  return start;
}
