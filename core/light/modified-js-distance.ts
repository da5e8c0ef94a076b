/**
 * SALT's distance between two latency histograms: sqrt(2 * JSDmod(P, Q)),
 * natural log, where JSDmod = KL'(P||M)/2 + KL'(Q||M)/2, M = (P + Q)/2, and
 * KL'(A||B) keeps only the bins where both A and B are non-zero and
 * renormalises both to sum 1 there before the Kullback-Leibler sum.
 *
 * This is the divergence of the published SALT code (Kvitsiani et al. 2013,
 * Nature 498:363; REFERENCES.md), not the textbook Jensen-Shannon divergence:
 * where the supports of P and Q coincide the two agree (the distance is then
 * sqrt(2) x SciPy's `jensenshannon`), but mass lying where the other
 * histogram is empty is ignored, so disjoint supports give 0.
 *
 * Inputs are non-negative weights (counts or probabilities), normalised here.
 * Edge cases: an all-zero or non-finite histogram gives NaN; lengths must match.
 * Checked against REFERENCES.md values and SciPy 1.17 (test/fixtures/light).
 */
export function modifiedJsDistance(p: ArrayLike<number>, q: ArrayLike<number>): number {
  if (p.length !== q.length) throw new Error(`histograms differ in length (${p.length} vs ${q.length})`);
  let sp = 0;
  let sq = 0;
  for (let i = 0; i < p.length; i++) {
    if (!(p[i] >= 0) || !(q[i] >= 0) || !Number.isFinite(p[i]) || !Number.isFinite(q[i])) return NaN;
    sp += p[i];
    sq += q[i];
  }
  if (!(sp > 0) || !(sq > 0)) return NaN;
  const kl = (a: ArrayLike<number>, sa: number, other: ArrayLike<number>, so: number): number => {
    // KL'(A || M) with M = (A/sa + O/so)/2, on the bins where A > 0 (M > 0 there).
    let sumA = 0;
    let sumM = 0;
    for (let i = 0; i < a.length; i++) {
      if (a[i] > 0) {
        sumA += a[i] / sa;
        sumM += (a[i] / sa + other[i] / so) / 2;
      }
    }
    let d = 0;
    for (let i = 0; i < a.length; i++) {
      if (a[i] > 0) {
        const ai = a[i] / sa / sumA;
        const mi = (a[i] / sa + other[i] / so) / 2 / sumM;
        d += ai * Math.log(ai / mi);
      }
    }
    return d;
  };
  const jsd = kl(p, sp, q, sq) / 2 + kl(q, sq, p, sp) / 2;
  return Math.sqrt(Math.max(0, 2 * jsd));
}
