import { addIntervalOverlap } from './add-interval-overlap';

/**
 * The segments of the rate-drift screen, computed once per session and
 * shared by every unit: the span [startS, stopS) cut into `nSegments` equal
 * consecutive segments, and the time left in each after removing the
 * `exclude` intervals (sorted, non-overlapping, e.g. lightWindows). The
 * time left depends only on the span and the intervals, never on a unit, so
 * with 10,000 pulses and 1,000 units it is computed once rather than 1,000
 * times. `count` is 0 (no segments) when the span is empty or fewer than 2
 * segments are asked for; see rateDrift.
 */
export interface DriftSegments {
  readonly startS: number;
  readonly stopS: number;
  readonly count: number;
  /** Segment length, s. */
  readonly widthS: number;
  /** Time left in each segment after the exclusions, s. */
  readonly timeLeftS: Float64Array;
  readonly exclude: { readonly startS: Float64Array; readonly stopS: Float64Array };
}

const NONE = { startS: new Float64Array(0), stopS: new Float64Array(0) };

export function driftSegments(startS: number, stopS: number, nSegments: number, exclude?: { readonly startS: ArrayLike<number>; readonly stopS: ArrayLike<number> }): DriftSegments {
  const k = Math.floor(nSegments);
  const len = stopS - startS;
  const ex = exclude ? { startS: Float64Array.from(exclude.startS), stopS: Float64Array.from(exclude.stopS) } : NONE;
  if (!(len > 0) || !(k >= 2)) return { startS, stopS, count: 0, widthS: NaN, timeLeftS: new Float64Array(0), exclude: ex };
  const width = len / k;
  const kept = new Float64Array(k).fill(width);
  const xs = ex.startS;
  const xe = ex.stopS;
  for (let j = 0; j < xs.length; j++) addIntervalOverlap(kept, startS, width, Math.max(startS, xs[j]), Math.min(stopS, xe[j]), -1);
  return { startS, stopS, count: k, widthS: width, timeLeftS: kept, exclude: ex };
}
