import { addEventCounts } from './add-event-counts';
import type { Parameters } from '../defaults';
import type { Recording } from '../model/types';
import { selectEvents } from './select-events';

/** One stretch of the feature vector: a trial-averaged PSTH around one event type. */
export interface FeatureSegment {
  /** "reward" (the ramp event in its reference condition) or "jump <kind>". */
  readonly name: string;
  /** Time of the first bin's left edge relative to the event, s, and the bin width. */
  readonly startS: number;
  readonly binS: number;
  readonly nBins: number;
  /** Offset of the segment in the feature vector. */
  readonly offset: number;
  readonly nEvents: number;
}

export interface ResponseFeatures {
  readonly segments: FeatureSegment[];
  /** Units x features, row-major: trial-averaged rate, Hz (unscaled). */
  readonly rates: Float64Array;
  readonly dim: number;
}

/**
 * Trial-averaged responses of every unit, concatenated: the ramp window
 * around the ramp event (reference-condition trials, as the ramp test), then
 * [min(pre, post start), max(post, late end)) around the jump event of each
 * kind. Bins of cluster.binS. Event types with fewer than cluster.minEvents
 * events are left out (their averages are mostly noise).
 */
export function responseFeatures(recording: Recording, params: Parameters): ResponseFeatures {
  const binS = params.cluster.binS;
  const segments: FeatureSegment[] = [];
  const sources: { times: Float64Array; startS: number; nBins: number }[] = [];
  let offset = 0;
  const add = (name: string, times: Float64Array, startS: number, endS: number) => {
    if (times.length < Math.max(1, params.cluster.minEvents)) return;
    const nBins = Math.max(1, Math.round((endS - startS) / binS));
    segments.push({ name, startS, binS, nBins, offset, nEvents: times.length });
    sources.push({ times, startS, nBins });
    offset += nBins;
  };
  const ramp = selectEvents(recording, params.ramp.event, params.ramp.condition);
  add(params.ramp.event, ramp.times, params.ramp.windowStartS, params.ramp.windowEndS);
  const jumps = selectEvents(recording, params.jump.event, null);
  const kinds = [...new Set(jumps.kinds)].sort();
  const j = params.jump;
  for (const k of kinds) {
    const times = Float64Array.from(jumps.times.filter((_, i) => jumps.kinds[i] === k));
    add(k === '' ? j.event : `${j.event} ${k}`, times, Math.min(j.preStartS, j.postStartS), Math.max(j.postEndS, j.lateEndS));
  }
  const dim = offset;
  const n = recording.units.length;
  const rates = new Float64Array(n * dim);
  for (let u = 0; u < n; u++) {
    const st = recording.units[u].spikeTimes;
    sources.forEach((s, g) => {
      const o = u * dim + segments[g].offset;
      addEventCounts(st, s.times, s.startS, binS, s.nBins, rates, o);
      for (let b = 0; b < s.nBins; b++) rates[o + b] /= s.times.length * binS;
    });
  }
  return { segments, rates, dim };
}
