/**
 * Inverse of warpTime for one trial: template time u (s after the first
 * anchor) back to real time, piecewise linear between template anchors and a
 * pure shift outside them. Template anchors map exactly to the trial's anchors.
 */
export function unwarpTime(u: number, anchors: ArrayLike<number>, offset: number, template: ArrayLike<number>): number {
  const K = template.length;
  if (u < template[0]) return anchors[offset] + (u - template[0]);
  if (u >= template[K - 1]) return anchors[offset + K - 1] + (u - template[K - 1]);
  let k = 0;
  while (k < K - 2 && u >= template[k + 1]) k++;
  const ak = anchors[offset + k];
  return ak + ((u - template[k]) * (anchors[offset + k + 1] - ak)) / (template[k + 1] - template[k]);
}
