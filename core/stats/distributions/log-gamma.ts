/**
 * Natural log of the gamma function for x > 0 (Lanczos approximation, g = 7,
 * n = 9 coefficients as in Numerical Recipes 3rd ed. / Godfrey's table),
 * with the reflection formula below 0.5. Relative error ~1e-15.
 * Checked against @stdlib/math-base-special-gammaln in the tests.
 */
const G = 7;
const C = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059,
  12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
];

export function logGamma(x: number): number {
  if (Number.isNaN(x)) return NaN;
  if (x < 0.5) return Math.log(Math.PI / Math.abs(Math.sin(Math.PI * x))) - logGamma(1 - x);
  const z = x - 1;
  let a = C[0];
  const t = z + G + 0.5;
  for (let i = 1; i < G + 2; i++) a += C[i] / (z + i);
  return 0.5 * Math.log(2 * Math.PI) + (z + 0.5) * Math.log(t) - t + Math.log(a);
}
