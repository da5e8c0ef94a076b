/**
 * Benjamini-Hochberg adjusted p-values (q-values of the step-up procedure):
 * q_(i) = min over j >= i of min(1, m p_(j) / j), for p sorted ascending.
 * Rejecting every hypothesis with q <= alpha is the BH procedure at FDR alpha.
 *
 * NaN p-values (tests that could not be run) are left out of the family:
 * m counts the finite p only and their q is NaN (as R's p.adjust does with NA).
 *
 * Reference: Benjamini & Hochberg (1995) JRSS-B 57:289, the 15-p-value
 * example; adjusted values identical to @stdlib/stats-padjust(p, 'bh').
 */
export function benjaminiHochberg(p: ArrayLike<number>): Float64Array {
  const out = new Float64Array(p.length).fill(NaN);
  const idx: number[] = [];
  for (let i = 0; i < p.length; i++) if (p[i] === p[i]) idx.push(i);
  const m = idx.length;
  if (m === 0) return out;
  idx.sort((a, b) => p[a] - p[b] || a - b);
  let running = 1;
  for (let r = m - 1; r >= 0; r--) {
    const i = idx[r];
    const q = (m * p[i]) / (r + 1);
    if (q < running) running = q;
    out[i] = running;
  }
  return out;
}
