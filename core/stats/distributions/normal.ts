import { regularizedGammaP, regularizedGammaQ } from './regularized-gamma';

/**
 * Standard normal distribution. normalCdf(z) = Phi(z), via the error function
 * erf(x) = P(1/2, x^2) (Abramowitz & Stegun 6.5.17 / 7.1), computed without
 * cancellation in both tails. Checked against @stdlib/stats-base-dists-normal-cdf.
 */
export function normalCdf(z: number): number {
  if (Number.isNaN(z)) return NaN;
  const x = (z * z) / 2;
  if (z < 0) return 0.5 * regularizedGammaQ(0.5, x);
  return 0.5 + 0.5 * regularizedGammaP(0.5, x);
}

/** Upper tail 1 - Phi(z), accurate far into the tail. */
export function normalSf(z: number): number {
  return normalCdf(-z);
}

/**
 * Inverse of Phi: the z with Phi(z) = p, 0 < p < 1 (0 -> -Infinity,
 * 1 -> Infinity). Acklam's rational approximation refined by one Halley step;
 * relative error ~1e-15. Checked against SciPy's norm.ppf values in the tests.
 */
export function normalQuantile(p: number): number {
  if (Number.isNaN(p) || p < 0 || p > 1) return NaN;
  if (p === 0) return -Infinity;
  if (p === 1) return Infinity;
  const a = [-3.969683028665376e1, 2.209460984245205e2, -2.759285104469687e2, 1.38357751867269e2, -3.066479806614716e1, 2.506628277459239];
  const b = [-5.447609879822406e1, 1.615858368580409e2, -1.556989798598866e2, 6.680131188771972e1, -1.328068155288572e1];
  const c = [-7.784894002430293e-3, -3.223964580411365e-1, -2.400758277161838, -2.549732539343734, 4.374664141464968, 2.938163982698783];
  const d = [7.784695709041462e-3, 3.224671290700398e-1, 2.445134137142996, 3.754408661907416];
  const pLow = 0.02425;
  let x: number;
  if (p < pLow) {
    const q = Math.sqrt(-2 * Math.log(p));
    x = (((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5]) / ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1);
  } else if (p <= 1 - pLow) {
    const q = p - 0.5;
    const r = q * q;
    x = ((((((a[0] * r + a[1]) * r + a[2]) * r + a[3]) * r + a[4]) * r + a[5]) * q) / (((((b[0] * r + b[1]) * r + b[2]) * r + b[3]) * r + b[4]) * r + 1);
  } else {
    const q = Math.sqrt(-2 * Math.log(1 - p));
    x = -(((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5]) / ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1);
  }
  // One Halley step on Phi(x) - p.
  const e = (p < 0.5 ? normalCdf(x) - p : -(normalSf(x) - (1 - p)));
  const u = e * Math.sqrt(2 * Math.PI) * Math.exp((x * x) / 2);
  return x - u / (1 + (x * u) / 2);
}
