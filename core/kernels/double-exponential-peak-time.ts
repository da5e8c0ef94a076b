/**
 * Time of the peak of h(t) = exp(-t/tauDecay) - exp(-t/tauRise), s:
 * t_peak = tauRise * tauDecay * ln(tauDecay / tauRise) / (tauDecay - tauRise)
 * (REFERENCES.md, "Indicator kernels", verified). The formula is symmetric in
 * the two constants; equal constants give the alpha-function limit t = tau.
 * Non-positive or non-finite constants give NaN.
 */
export function doubleExponentialPeakTime(tauRiseS: number, tauDecayS: number): number {
  if (!(tauRiseS > 0) || !(tauDecayS > 0) || !Number.isFinite(tauRiseS) || !Number.isFinite(tauDecayS)) return NaN;
  if (Math.abs(tauDecayS - tauRiseS) <= 1e-12 * tauDecayS) return tauRiseS;
  return (tauRiseS * tauDecayS * Math.log(tauDecayS / tauRiseS)) / (tauDecayS - tauRiseS);
}
