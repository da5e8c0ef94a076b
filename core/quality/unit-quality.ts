import type { Parameters } from '../defaults';
import { hillContamination } from './hill-contamination';
import { intervalMetrics } from './interval-metrics';
import { presenceRatio } from './presence-ratio';
import { driftSegments, type DriftSegments } from './drift-segments';
import { rateDrift } from './rate-drift';
import { waveformShape } from './waveform-shape';

/** Every quality metric of one unit (NaN where a metric does not apply). */
export interface UnitQuality {
  readonly nSpikes: number;
  /** Spikes in the span / span length, Hz. */
  readonly rateHz: number;
  readonly isiViolationCount: number;
  readonly isiViolationFraction: number;
  /** Hill et al. (2011) contamination; NaN when undefined (see atLeastHalf). */
  readonly contamination: number;
  readonly contaminationAtLeastHalf: boolean;
  readonly presenceRatio: number;
  readonly lv: number;
  readonly cv2: number;
  readonly rateDriftCv: number;
  readonly rateSlopeHzPerMin: number;
  readonly troughToPeakMs: number;
  readonly halfWidthMs: number;
}

/**
 * Computes all quality metrics of one unit over the recording span with the
 * `quality` parameters (refractory/censored periods in ms, presence bins,
 * drift segments). Spikes outside the span are ignored for every metric.
 * `segments` are the rate-drift segments of the session (driftSegments,
 * computed once for all units, with e.g. lightWindows after each laser
 * pulse left out); by default the span in q.driftSegments plain segments.
 * `observedIntervals` (NWB obs_intervals) limit the presence ratio to the
 * time the unit was observed (see presenceRatio).
 * Waveform metrics need `waveform` and a finite `waveformSampleRateHz`.
 */
export function unitQuality(
  spikeTimes: Float64Array,
  span: readonly [number, number],
  q: Parameters['quality'],
  waveform?: Float64Array,
  waveformSampleRateHz = NaN,
  segments?: DriftSegments,
  observedIntervals?: Float64Array,
): UnitQuality {
  const [t0, t1] = span;
  let a = 0;
  while (a < spikeTimes.length && spikeTimes[a] < t0) a++;
  let b = spikeTimes.length;
  while (b > a && spikeTimes[b - 1] > t1) b--;
  const s = a === 0 && b === spikeTimes.length ? spikeTimes : spikeTimes.subarray(a, b);
  const len = t1 - t0;
  const n = s.length;
  const refractoryS = q.refractoryMs / 1000;
  const isi = intervalMetrics(s, refractoryS); // isiViolations, localVariation and cv2 in one pass
  const viol = isi.violations;
  const cont = hillContamination(viol.count, n, len, refractoryS, q.censoredMs / 1000);
  const drift = rateDrift(s, segments ?? driftSegments(t0, t1, q.driftSegments));
  const shape = waveform ? waveformShape(waveform, waveformSampleRateHz) : { troughToPeakMs: NaN, halfWidthMs: NaN };
  return {
    nSpikes: n,
    rateHz: len > 0 ? n / len : NaN,
    isiViolationCount: viol.count,
    isiViolationFraction: viol.fraction,
    contamination: cont.value,
    contaminationAtLeastHalf: cont.atLeastHalf,
    presenceRatio: presenceRatio(s, t0, t1, q.presenceBins, observedIntervals),
    lv: isi.lv,
    cv2: isi.cv2,
    rateDriftCv: drift.cv,
    rateSlopeHzPerMin: drift.slopeHzPerMin,
    troughToPeakMs: shape.troughToPeakMs,
    halfWidthMs: shape.halfWidthMs,
  };
}
