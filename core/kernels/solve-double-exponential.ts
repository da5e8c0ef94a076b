import { kernelTiming } from './kernel-timing';

/** Two published single-spike quantities, s. */
export type TimingPair =
  | { readonly timeToPeakS: number; readonly halfDecayS: number }
  | { readonly halfRiseS: number; readonly halfDecayS: number };

/**
 * Rise and decay time constants (s) of the difference of exponentials
 * exp(-t/tauDecay) - exp(-t/tauRise) that reproduces two published quantities
 * exactly: time to peak + half-decay, or half-rise + half-decay. (Two
 * constants cannot match half-rise, time to peak and half-decay at once;
 * REFERENCES.md.)
 *
 * Method: the shape depends on r = tauDecay/tauRise only, and every timing
 * scales with tauRise. So the ratio of the two targets fixes r (solved by
 * bisection on ln r, the ratio being monotonic in r), and then tauRise follows
 * from either target. Check values (REFERENCES.md, computed with SciPy):
 * jGCaMP8f 24.8 ms to peak, 67.4 ms half-decay -> 10.6 / 80.9 ms.
 *
 * Returns NaNs when the targets are not positive or their ratio is outside
 * what a difference of exponentials can produce (e.g. half-decay shorter than
 * 1.678 x time to peak, the alpha-function limit).
 */
export function solveDoubleExponential(target: TimingPair): { tauRiseS: number; tauDecayS: number } {
  const bad = { tauRiseS: NaN, tauDecayS: NaN };
  const byPeak = 'timeToPeakS' in target;
  const first = byPeak ? target.timeToPeakS : target.halfRiseS;
  const hd = target.halfDecayS;
  if (!(first > 0) || !(hd > 0) || !Number.isFinite(first) || !Number.isFinite(hd)) return bad;
  const want = hd / first;
  // ratio(r): half-decay / (time to peak or half-rise) for tauRise = 1, tauDecay = r.
  const ratio = (lnr: number) => {
    const t = kernelTiming({ kind: 'double-exponential', tauRiseS: 1, tauDecayS: Math.exp(lnr), peakDff: 1 });
    return t.halfDecayS / (byPeak ? t.timeToPeakS : t.halfRiseS);
  };
  let lo = 1e-6; // r just above 1 (alpha-function limit)
  let hi = Math.log(1e6);
  const rLo = ratio(lo);
  const rHi = ratio(hi);
  if (!(want > rLo && want < rHi)) return bad;
  for (let i = 0; i < 200 && hi - lo > 1e-14; i++) {
    const mid = 0.5 * (lo + hi);
    if (ratio(mid) < want) lo = mid;
    else hi = mid;
  }
  const r = Math.exp(0.5 * (lo + hi));
  const unit = kernelTiming({ kind: 'double-exponential', tauRiseS: 1, tauDecayS: r, peakDff: 1 });
  const tauRiseS = first / (byPeak ? unit.timeToPeakS : unit.halfRiseS);
  return { tauRiseS, tauDecayS: r * tauRiseS };
}
