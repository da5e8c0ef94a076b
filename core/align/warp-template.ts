import type { TrialAnchors } from './trial-anchors';

/**
 * Template anchor positions for time-warping, s after the first anchor:
 * for each anchor k the median over valid trials of (anchor_k - anchor_0).
 * Medians of strictly increasing per-trial sequences are themselves strictly
 * increasing, so the template is a valid warp target. NaNs when no trial is
 * valid. (Median: common practice; robust to a few very long trials.)
 */
export function warpTemplate(a: TrialAnchors): Float64Array {
  const K = a.labels.length;
  const out = new Float64Array(K).fill(NaN);
  const d: number[] = [];
  for (let k = 0; k < K; k++) {
    d.length = 0;
    for (let r = 0; r < a.trials; r++) if (a.valid[r]) d.push(a.times[r * K + k] - a.times[r * K]);
    if (!d.length) continue;
    d.sort((x, y) => x - y);
    const m = d.length >> 1;
    out[k] = d.length % 2 ? d[m] : (d[m - 1] + d[m]) / 2;
  }
  return out;
}
