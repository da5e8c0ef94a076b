import { addIntervalOverlap } from './add-interval-overlap';
import { countPerBin } from './count-per-bin';

/**
 * Presence ratio: the fraction of `nBins` equal time bins over [startS, stopS)
 * that hold at least one spike (common practice; 100 bins is usual).
 *
 * `observed` (flat pairs [start0, stop0, start1, stop1, ...], s, sorted and
 * not overlapping, e.g. NWB `obs_intervals`) limits the ratio to the time the
 * unit was observed: only bins at least half inside observed time count, in
 * the numerator and the denominator, so a unit recorded for part of the
 * session is not marked absent where nobody looked (our rule; the half-bin
 * threshold is ours). Without `observed` every bin counts.
 *
 * A spike exactly at stopS counts in the last bin; spikes outside the span are
 * ignored. Returns NaN when the span is empty, nBins < 1 or no bin is
 * observed. Sorted spike times; the spikes per bin come from countPerBin
 * (O(bins log n), no pass over every spike), then O(bins + intervals).
 */
export function presenceRatio(spikeTimes: ArrayLike<number>, startS: number, stopS: number, nBins: number, observed?: ArrayLike<number>): number {
  const len = stopS - startS;
  const bins = Math.floor(nBins);
  if (!(len > 0) || !(bins >= 1)) return NaN;
  const width = len / bins;
  // which bins count: all, or those at least half inside observed time
  let eligible: Uint8Array | null = null;
  let nEligible = bins;
  if (observed) {
    const cover = new Float64Array(bins);
    for (let j = 0; j + 1 < observed.length; j += 2) {
      addIntervalOverlap(cover, startS, width, Math.max(startS, observed[j]), Math.min(stopS, observed[j + 1]), 1);
    }
    eligible = new Uint8Array(bins);
    nEligible = 0;
    for (let k = 0; k < bins; k++) {
      if (cover[k] >= 0.5 * width) {
        eligible[k] = 1;
        nEligible++;
      }
    }
    if (nEligible === 0) return NaN;
  }
  const counts = new Float64Array(bins);
  countPerBin(spikeTimes, startS, stopS, width, counts);
  let occupied = 0;
  for (let k = 0; k < bins; k++) if (counts[k] > 0 && (eligible === null || eligible[k] === 1)) occupied++;
  return occupied / nEligible;
}
