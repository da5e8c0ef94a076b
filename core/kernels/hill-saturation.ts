/**
 * Hill-type saturation applied sample by sample to a linear prediction x
 * (dF/F): y = maxDff * x^n / (x^n + halfDff^n) for x > 0, 0 for x <= 0.
 * halfDff is the linear dF/F at which the output is half of maxDff; n the Hill
 * coefficient (n > 1 gives the supralinear start and saturating top of
 * calcium indicators). Library Hill coefficients are "from memory" and
 * halfDff/maxDff have no published per-spike value: treat the curve as
 * illustrative unless you fitted it. NaN passes through. Returns a new array.
 */
export function hillSaturation(x: ArrayLike<number>, p: { readonly n: number; readonly halfDff: number; readonly maxDff: number }): Float64Array {
  if (!(p.n > 0) || !(p.halfDff > 0) || !(p.maxDff > 0)) throw new Error('hillSaturation: n, halfDff and maxDff must be positive');
  const out = new Float64Array(x.length);
  const kn = Math.pow(p.halfDff, p.n);
  for (let i = 0; i < x.length; i++) {
    const v = x[i];
    if (v !== v) out[i] = NaN;
    else if (v <= 0) out[i] = 0;
    else {
      const vn = Math.pow(v, p.n);
      out[i] = Number.isFinite(vn) ? (p.maxDff * vn) / (vn + kn) : p.maxDff;
    }
  }
  return out;
}
