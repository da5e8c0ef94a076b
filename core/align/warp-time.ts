/**
 * Piecewise-linear time warp of one trial onto a template: maps real time t
 * (s) to template time (s after the first anchor). Between anchors a_k and
 * a_k+1 (anchors[offset + k]) the map is linear onto [T_k, T_k+1]
 * (template[k], with template[0] = 0); before the first anchor and after the
 * last it is a pure shift (slope 1), so pre- and post-windows keep real
 * durations. Anchors map exactly: warpTime(a_k) === T_k with no rounding,
 * since the segment formula adds 0 at its left anchor. Anchors must increase
 * strictly (trialAnchors checks it).
 */
export function warpTime(t: number, anchors: ArrayLike<number>, offset: number, template: ArrayLike<number>): number {
  const K = template.length;
  const a0 = anchors[offset];
  if (t < a0) return template[0] + (t - a0);
  const aLast = anchors[offset + K - 1];
  if (t >= aLast) return template[K - 1] + (t - aLast);
  let k = 0;
  while (k < K - 2 && t >= anchors[offset + k + 1]) k++;
  const ak = anchors[offset + k];
  return template[k] + ((t - ak) * (template[k + 1] - template[k])) / (anchors[offset + k + 1] - ak);
}
