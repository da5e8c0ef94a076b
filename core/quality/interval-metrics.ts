import type { IsiViolations } from './isi-violations';

/** The ISI metrics of one spike train, from one pass (see intervalMetrics). */
export interface IntervalMetrics {
  /** As isiViolations(spikeTimes, refractoryS). */
  readonly violations: IsiViolations;
  /** As localVariation(spikeTimes): Shinomoto et al. (2003); NaN below 3 spikes. */
  readonly lv: number;
  /** As cv2(spikeTimes): Holt et al. (1996); NaN below 3 spikes. */
  readonly cv2: number;
}

/**
 * Refractory violations, LV and CV2 of a sorted spike train in one pass over
 * its inter-spike intervals (the quality step reads each train once instead
 * of three times; the separate functions isiViolations, localVariation and
 * cv2 define the metrics and stay the reference).
 *
 * Same values, bit for bit, as the three functions: each ISI is the same
 * subtraction, the sums add the same terms in the same order, and the final
 * divisions are the same. One division per ISI pair serves both LV and CV2:
 * with D = |a - b| (a, b adjacent ISIs, s = a + b), CV2's term is 2D / s and
 * LV's is ((a - b) / s)^2. In IEEE-754 arithmetic b - a is exactly -(a - b),
 * 2D is exact, and doubling commutes with rounding, so 2D / s = 2 (D / s)
 * exactly as long as D / s is not subnormal (below 2.2e-308, impossible for
 * spike times in seconds: D is 0 or at least one unit in the last place of
 * the times). Checked against the three functions in
 * test/core/quality/interval-metrics.test.ts.
 *
 * Input: spike times (s), sorted ascending; refractory period (s).
 */
export function intervalMetrics(spikeTimes: ArrayLike<number>, refractoryS: number): IntervalMetrics {
  const n = spikeTimes.length;
  const isiCount = Math.max(0, n - 1);
  let count = 0;
  let lvSum = 0;
  let cv2Sum = 0;
  if (n >= 2) {
    let a = spikeTimes[1] - spikeTimes[0];
    if (a < refractoryS) count++;
    for (let i = 2; i < n; i++) {
      const b = spikeTimes[i] - spikeTimes[i - 1];
      if (b < refractoryS) count++;
      const s = a + b;
      if (s > 0) {
        const d = (a - b) / s;
        lvSum += d * d;
        cv2Sum += 2 * Math.abs(d);
      }
      a = b;
    }
  }
  const nIsi = n - 1;
  return {
    violations: { count, isiCount, fraction: isiCount > 0 ? count / isiCount : NaN },
    lv: nIsi < 2 ? NaN : (3 * lvSum) / (nIsi - 1),
    cv2: nIsi < 2 ? NaN : cv2Sum / (nIsi - 1),
  };
}
